/**
 * The merged "what to do" list (advice.ts) and the comparison against the existing setup
 * (checkSetup's `baseline`, index.ts), held to their documented contracts. Written against the
 * mutation-testing survivors (npm run mutate).
 *
 * Contracts checked: each sentence of the list appears once (advice.ts header); a baseline is used
 * only when it was worked out on the same rpm points, point for point (index.ts, checkSetup).
 */
import { describe, expect, it } from 'vitest';
import { whatToDo } from '../../electron/checker/advice.js';
import { checkSetup } from '../../electron/checker/index.js';
import type { Intent, RuleResult } from '../../electron/checker/index.js';
import { fourCylinder, module, moduleSetup, pointsSetup } from './fixtures.js';

describe('the merged list says each sentence once', () => {
  const r = (title: string, verdict: RuleResult['verdict'], action: string, intents?: Intent[]): RuleResult => ({ id: 'tach', title, verdict, figures: [], why: 'because', action, ...(intents ? { intents } : {}) });
  it('two failing rules of one title against the same listed action give one "pull opposite ways" line', () => {
    const out = whatToDo([r('Fit', 'fail', 'fit a ballast', ['ballast:add']), r('Remove', 'fail', 'remove it', ['ballast:remove']), r('Remove', 'fail', 'take it out', ['ballast:remove'])]);
    expect(out).toEqual(['fit a ballast', '"Fit" and "Remove" pull opposite ways, so no single change to these parts cures both: choose a different coil or module.']);
  });
  it('keeps the report order within one verdict however many rules there are', () => {
    const many = Array.from({ length: 40 }, (_, k) => r(`R${k}`, k % 3 === 0 ? 'fail' : 'caution', `do ${k}`));
    const fails = many.filter((x) => x.verdict === 'fail').map((x) => x.action);
    const cautions = many.filter((x) => x.verdict === 'caution').map((x) => x.action);
    expect(whatToDo(many)).toEqual([...fails, ...cautions]);
  });
});

describe('the existing setup as a baseline', () => {
  const opts = { rpmPoints: 12, skipGapSuggestion: true };
  const energyRule = (rep: ReturnType<typeof checkSetup>) => rep.rules.find((x) => x.id === 'spark-energy')!;
  it('compares point for point when the baseline has the same rpm points, and ignores one that has not', () => {
    const existing = checkSetup(fourCylinder, pointsSetup(), undefined, opts);
    const plan = moduleSetup(module());
    const withBase = checkSetup(fourCylinder, plan, undefined, opts, existing);
    expect(energyRule(withBase).figures.some((f) => f.name.includes(`relative to ${existing.label}`))).toBe(true);
    // Worked on 20 points, the baseline's 12 points do not line up: the plan is judged alone.
    const other = checkSetup(fourCylinder, pointsSetup(), undefined, { ...opts, rpmPoints: 20 });
    const alone = checkSetup(fourCylinder, plan, undefined, opts);
    const mismatched = checkSetup(fourCylinder, plan, undefined, opts, other);
    expect(energyRule(mismatched)).toEqual(energyRule(alone));
    expect(energyRule(mismatched).figures.some((f) => f.name.includes('relative to'))).toBe(false);
  });
});
