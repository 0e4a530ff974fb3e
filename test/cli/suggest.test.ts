/**
 * The "did you mean" of the plan file (electron/cli/suggest.ts): edit distance on the textbook
 * examples, and the name it offers for slips people make in a JSON file.
 */
import { describe, expect, it } from 'vitest';
import { closestName, editDistance } from '../../electron/cli/suggest.js';

describe('edit distance (optimal string alignment)', () => {
  it('gives the textbook values', () => {
    // kitten -> sitting: substitute k/s, substitute e/i, insert g = 3 (the classic Levenshtein example).
    expect(editDistance('kitten', 'sitting')).toBe(3);
    // flaw -> lawn: delete f, insert n = 2.
    expect(editDistance('flaw', 'lawn')).toBe(2);
    // A swap of two neighbours counts once: ca -> ac = 1 (Damerau 1964).
    expect(editDistance('ca', 'ac')).toBe(1);
    // Optimal string alignment edits no substring twice: CA -> ABC = 3 (the unrestricted Damerau distance is 2).
    expect(editDistance('CA', 'ABC')).toBe(3);
    expect(editDistance('', 'abc')).toBe(3);
    expect(editDistance('same', 'same')).toBe(0);
  });
});

describe('closestName', () => {
  const engineKeys = ['name', 'idleRpm', 'crankingRpm', 'redlineRpm', 'pointsFloatRpm', 'pointsGapMm', 'pointsDwellDeg', 'boreMm', 'strokeMm', 'conditions'];

  it('offers the setting a slip of case, a missing unit or a typing slip points at', () => {
    expect(closestName('pointsFloatRPM', engineKeys)).toBe('pointsFloatRpm');
    expect(closestName('redline', engineKeys)).toBe('redlineRpm');
    expect(closestName('boreMM', engineKeys)).toBe('boreMm');
    expect(closestName('strokMm', engineKeys)).toBe('strokeMm');
    expect(closestName('pointsGpaMm', engineKeys)).toBe('pointsGapMm');
    expect(closestName('condition', engineKeys)).toBe('conditions');
  });

  it('offers nothing when no setting is close, or a short word begins several', () => {
    expect(closestName('colour', engineKeys)).toBeNull();
    expect(closestName('points', engineKeys)).toBeNull();
  });
});
