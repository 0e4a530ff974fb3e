/**
 * The verdict-only judge of the parts-bin search (judge.ts) and the comparison (compare.ts), held to
 * what their headers promise: the judge fails a combination exactly when its full report has a
 * failing rule, and flags each failing rule; with `crankingOnly` it works out the cranking points
 * again and leaves the running points as the workspace holds them; the comparison suggests a plug
 * gap unless told not to, and gives the same reports whatever comparison ran before it (its reused
 * workspaces are sized to each rpm grid). Written against the mutation-testing survivors.
 *
 * The physics checks: Ohm's law for the key-on current of a 1.5 ohm coil on 14 V (running supply,
 * workshop manuals) through 0.1 ohm harness and 0.1 ohm points contact (both from memory).
 */
import { describe, expect, it } from 'vitest';
import { checkSetup, compareSetups } from '../../electron/checker/index.js';
import { judge } from '../../electron/checker/judge.js';
import { keyOnReport } from '../../electron/checker/keyon.js';
import { prepareSetup } from '../../electron/checker/prepare.js';
import { FAIL_TESTS } from '../../electron/checker/rules/index.js';
import { analyse, createSession } from '../../electron/checker/session.js';
import { createWorkspace } from '../../electron/checker/sweep.js';
import type { SetupSpec } from '../../electron/checker/index.js';
import { ballastCoil, cdModule, fourCylinder, ironBallast, module, moduleSetup, pointsSetup } from './fixtures.js';

const OPTIONS = { rpmPoints: 12 };

describe('judge: fails exactly when the full report has a failing rule', () => {
  const s = createSession(fourCylinder, undefined, OPTIONS);
  const judged = (setup: SetupSpec) => {
    const prep = prepareSetup(s.engine, setup, s.conditions, s.model);
    const failed = new Uint8Array(FAIL_TESTS.length).fill(7);
    const j = judge(s, prep, keyOnReport(prep, s.conditions), null, createWorkspace(s.grids.sweep.n), failed);
    return { j, failed, full: analyse(s, setup, null, false) };
  };
  it('passes sound setups with every flag down', () => {
    for (const setup of [moduleSetup(module()), moduleSetup(cdModule()), pointsSetup({ coil: ballastCoil(), ballast: ironBallast() })]) {
      const { j, failed, full } = judged(setup);
      expect(full.rules.some((r) => r.verdict === 'fail')).toBe(false);
      expect(j.fails).toBe(false);
      expect([...failed]).toEqual(FAIL_TESTS.map(() => 0));
      expect(j.worstRatio).toBe(full.worstRatio);
    }
  });
  it('fails a setup with a failing rule and flags that rule alone', () => {
    // A 1.5 ohm ballast coil straight on 14 V behind points: 14 / 1.7 = 8.2 A (Ohm's law), about
    // 100 W in the coil with the key on (Joule's law), over the 80 W it sheds (from memory).
    const bare = pointsSetup({ coil: ballastCoil(), ballast: null });
    expect(checkSetup(fourCylinder, bare, undefined, OPTIONS).keyOn.currentA).toBeCloseTo(14 / (1.5 + 0.1 + 0.1), 9);
    // A condenser across a CD coil primary swallows the pulse (a fail on its own).
    const cdCondenser = moduleSetup(cdModule(), { condenserF: 0.22e-6 });
    for (const setup of [bare, cdCondenser]) {
      const { j, failed, full } = judged(setup);
      const failing = new Set(full.rules.filter((r) => r.verdict === 'fail').map((r) => r.id));
      expect(failing.size).toBeGreaterThan(0);
      expect(j.fails).toBe(true);
      expect([...failed]).toEqual(FAIL_TESTS.map(([id]) => (failing.has(id) ? 1 : 0)));
    }
  });
  it('with crankingOnly works out only the cranking points and keeps the running points of the workspace', () => {
    const ws = createWorkspace(s.grids.sweep.n);
    const failed = new Uint8Array(FAIL_TESTS.length);
    // First a plain 3 ohm coil behind a module, then the cranking-bypass twin of a ballast setup.
    const first = prepareSetup(s.engine, moduleSetup(module()), s.conditions, s.model);
    judge(s, first, keyOnReport(first, s.conditions), null, ws, failed);
    const held = ws.currentA.slice();
    const twinSetup = moduleSetup(module(), { coil: ballastCoil(), ballast: ironBallast(), crankingBypass: true });
    const twin = prepareSetup(s.engine, twinSetup, s.conditions, s.model);
    judge(s, twin, keyOnReport(twin, s.conditions), null, ws, failed, { crankingOnly: true });
    const own = analyse(s, twinSetup, null, false).ws.currentA;
    const cranking = s.grids.sweep.cranking;
    let runningPoints = 0;
    for (let i = 0; i < ws.n; i++) {
      if (cranking[i] === 1) expect(ws.currentA[i]).toBe(own[i]);
      else {
        runningPoints++;
        expect(ws.currentA[i]).toBe(held[i]);
      }
    }
    expect(runningPoints).toBeGreaterThan(0);
    // The two setups do differ while running, so the running points really were left alone.
    expect([...held].some((x, i) => cranking[i] !== 1 && x !== own[i])).toBe(true);
  });
});

describe('compareSetups', () => {
  const existing = pointsSetup();
  const candidate = moduleSetup(module());
  it('suggests a plug gap for every setup by default, and none when told to skip it', () => {
    const withGap = compareSetups({ engine: fourCylinder, existing, candidates: [candidate], options: OPTIONS });
    expect(withGap.existing.gap).not.toBeNull();
    expect(withGap.candidates[0]!.gap).not.toBeNull();
    const explicit = compareSetups({ engine: fourCylinder, existing, candidates: [candidate], options: { ...OPTIONS, skipGapSuggestion: false } });
    expect(explicit.existing.gap).not.toBeNull();
    const skipped = compareSetups({ engine: fourCylinder, existing, candidates: [candidate], options: { ...OPTIONS, skipGapSuggestion: true } });
    expect(skipped.existing.gap).toBeNull();
    expect(skipped.candidates[0]!.gap).toBeNull();
  });
  it('gives the reports checkSetup gives, whatever size of rpm grid the comparison before it used', () => {
    for (const sizes of [[10, 30, 30, 10], [30, 10, 20]]) {
      for (const n of sizes) {
        const options = { rpmPoints: n, skipGapSuggestion: true };
        const r = compareSetups({ engine: fourCylinder, existing, candidates: [candidate], options });
        const ex = checkSetup(fourCylinder, existing, undefined, options);
        // The comparison names the baseline 'the existing setup' in its figures.
        const cand = checkSetup(fourCylinder, candidate, undefined, options, { ...ex, label: 'the existing setup' });
        expect(r.existing.points.length).toBe(ex.points.length);
        expect(r.existing.points).toEqual(ex.points);
        expect(r.candidates[0]!.points).toEqual(cand.points);
        expect(r.candidates[0]!.rules).toEqual(cand.rules);
        expect(r.rows.map((x) => x.verdict)).toEqual([ex.verdict, cand.verdict]);
      }
    }
  });
});
