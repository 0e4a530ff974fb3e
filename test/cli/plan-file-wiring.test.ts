/**
 * Issue 6, item 3 in the plan file: `coilWiring` is optional in the existing setup and in each
 * candidate (default: as marked for the car's earth), refused when it is neither choice, and read
 * into the stored shapes the adapter turns into the checker's setups.
 */
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { readPlanFile } from '../../electron/cli/plan-file.js';
import { CliInputError } from '../../electron/cli/errors.js';
import { existingSetupSpec, planSetupSpec } from '../../electron/setup/index.js';

const example = (): Record<string, any> => JSON.parse(readFileSync(new URL('../fixtures/plan-example.json', import.meta.url), 'utf8'));

describe('coilWiring in a plan file', () => {
  it('defaults to as marked for the earth, and carries "reversed" through to the checker setups', () => {
    const plain = readPlanFile(example());
    expect(existingSetupSpec(plain.engine, plain.parts).coilWiring).toBe('as-marked-for-earth');
    expect(plain.plans.every((p) => p.coilWiring === 'as-marked-for-earth')).toBe(true);

    const raw = example();
    raw.existing.coilWiring = 'reversed';
    raw.candidates[0].coilWiring = 'reversed';
    const w = readPlanFile(raw);
    expect(existingSetupSpec(w.engine, w.parts).coilWiring).toBe('reversed');
    expect(planSetupSpec(w.engine, w.plans[0]!, w.parts).coilWiring).toBe('reversed');
  });

  it('refuses a wiring that is neither, naming the field', () => {
    const raw = example();
    raw.candidates[0].coilWiring = 'upside-down';
    let lines: string[] = [];
    try {
      readPlanFile(raw);
    } catch (e) {
      if (!(e instanceof CliInputError)) throw e;
      lines = e.lines;
    }
    expect(lines.join('\n')).toMatch(/candidates\.0\.coilWiring/);
  });
});
