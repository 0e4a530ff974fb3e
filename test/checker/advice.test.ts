/**
 * Issue 6, item 4: each setup's report carries one merged "what to do" list, fails first, without
 * two pieces of advice that undo each other, and in the words of the system it concerns (points
 * have a dwell angle and a points gap, not a duty: common practice). The contradicting pairs are
 * written out here, independently of the checker's own intents, as patterns over the sentences.
 * Walks every demo plan (with its readings), every demo engine's existing setup and parts-bin
 * suggestions, and every combination of two generated bins.
 */
import { describe, expect, it } from 'vitest';
import { checkSetup, compareSetups, searchBest, type Intent, type RuleResult, type SetupReport, type SetupSpec } from '../../electron/checker/index.js';
import { whatToDo } from '../../electron/checker/advice.js';
import { comparisonInput, searchInput } from '../../electron/setup/index.js';
import { demoPlans, resolveDemoPlan } from '../../db/demo/index.js';
import type { Reading } from '../../db/schema.js';
import { demoWorkshop } from '../reference/demo-workshop.js';
import { generatedSearch } from './generated-bin.js';
import { fourCylinder, module, moduleSetup, pointsSetup, ballastCoil, ironBallast } from './fixtures.js';

/** Pairs of advice that cannot both be followed (common practice). */
const OPPOSITES: ReadonlyArray<readonly [string, RegExp, RegExp]> = [
  ['add vs remove the ballast', /\b(add|fit|keep)\b[^.]*\bballast\b|more resistance in the coil circuit|add resistance to the coil circuit/i, /\bremove the ballast\b|\bor bridge it\b/i],
  ['add vs drop the cranking bypass', /\badd a cranking bypass\b/i, /\bdrop the bypass\b/i],
  ['higher vs lower coil resistance', /\bhigher(-| primary )resistance coil\b|\bcoil of higher (primary )?resistance\b/i, /\bcoil of lower (inductance or )?resistance\b/i],
  ['longer vs shorter dwell (or duty)', /\bcharges it longer\b|\btop of its range\b|\bcloser points gap\b|\bhigher (fixed |maximum )?duty\b/i, /\blower (fixed |maximum )?duty\b|\bsmaller dwell\b|\blow end of its range\b|\bwider points gap\b/i],
  ['close vs open the plug gap', /\bclose the (plug )?gap\b/i, /\bopen the gap\b|\bwiden the (plug )?gap\b/i],
  ['fit vs remove the condenser', /\bfit a condenser\b/i, /\bdisconnect the condenser\b|\bremove the condenser\b/i],
];

function problems(r: SetupReport, where: string): string[] {
  const out: string[] = [];
  const a = r.actions;
  for (const [name, x, y] of OPPOSITES) {
    const xs = a.filter((s) => x.test(s));
    const ys = a.filter((s) => y.test(s));
    if (xs.length > 0 && ys.length > 0) out.push(`${where}: ${name}: "${xs[0]}" against "${ys[0]}"`);
  }
  if (new Set(a).size !== a.length) out.push(`${where}: a sentence appears twice`);
  if (r.switching === 'points' && a.some((s) => /\bduty\b/i.test(s))) out.push(`${where}: points told about duty: ${a.find((s) => /\bduty\b/i.test(s))}`);
  // Every rule that is not a pass is either in the list or was left out for a clash the list names.
  if (r.rules.some((x) => x.verdict === 'fail') && a.length === 0) out.push(`${where}: fails but nothing to do`);
  // Fails first: a failing rule's action never comes after a caution's.
  const rank = (s: string): number => Math.min(...r.rules.filter((x) => x.action === s).map((x) => (x.verdict === 'fail' ? 0 : x.verdict === 'caution' ? 1 : 2)), 0.5);
  for (let i = 1; i < a.length; i++) if (rank(a[i]!) < rank(a[i - 1]!) && rank(a[i]!) === 0) out.push(`${where}: a fail's action after a caution's`);
  return out;
}

describe('the merged "what to do" list', () => {
  it('never advises both halves of a contradicting pair on the demo plans, their existing setups and the shelf suggestions', () => {
    const w = demoWorkshop();
    const found: string[] = [];
    let id = 1;
    let checked = 0;
    demoPlans.forEach((dp, i) => {
      const plan = w.plans[i]!;
      const engine = w.engines.find((e) => e.id === plan.engineId)!;
      const readings: Reading[] = resolveDemoPlan(dp, engine.id, () => null).readings.map((x) => ({ ...x, planId: plan.id, id: id++, updatedAt: '2024-01-01T00:00:00.000Z' }));
      const c = compareSetups(comparisonInput(engine, [plan], w.parts, new Map([[plan.id, readings]])));
      for (const r of [c.existing, ...c.candidates]) { found.push(...problems(r, `${engine.name} / ${r.label}`)); checked++; }
    });
    for (const engine of w.engines) {
      const s = searchBest(searchInput(engine, w.parts, 10));
      for (const t of s.top) { found.push(...problems(t.report, `${engine.name} / shelf / ${t.report.label}`)); checked++; }
    }
    expect(found).toEqual([]);
    expect(checked).toBeGreaterThan(40);
  });

  it('never advises both halves of a contradicting pair on any combination of two generated bins', () => {
    const found: string[] = [];
    let withActions = 0;
    for (const input of [generatedSearch({ coils: 10, modules: 8, ballasts: 2, seed: 7, rpmPoints: 40 }), generatedSearch({ coils: 8, modules: 8, ballasts: 2, seed: 31, rpmPoints: 40 })]) {
      for (const mod of input.modules) {
        for (const c of input.coils) {
          for (const [ballast, crankingBypass] of [[null, false] as const, ...input.ballasts.flatMap((b) => [[b, false] as const, [b, true] as const])]) {
            const setup: SetupSpec = { ...pointsSetup({ leads: input.leads, plug: input.plug, tach: input.tach, plugGapM: input.plugGapM }), label: `${mod.name} / ${c.name}`, switching: mod.moduleType, module: mod, coil: c, ballast, crankingBypass, condenserF: null };
            const r = checkSetup(input.engine, setup, undefined, { rpmPoints: 40, skipGapSuggestion: true });
            found.push(...problems(r, setup.label));
            if (r.actions.length > 0) withActions++;
          }
        }
      }
    }
    expect(found).toEqual([]);
    expect(withActions).toBeGreaterThan(100);
  });

  it('keeps "add ballast resistance" and drops "remove the ballast" when a current-limited module is over its rating', () => {
    // A ballast coil (1.5 ohm) behind an iron ballast on a current-limited module whose limit (6 A) is above its own
    // rating (2 A, a part the store would refuse): on 14 V the coil reaches more than 2 A, so the peak-current rule
    // fails, while the ballast rule alone would say the module's limit makes removing the ballast safe.
    const r = checkSetup(fourCylinder, moduleSetup(module({ currentLimitA: 6, maxCurrentA: 2 }), { coil: ballastCoil(), ballast: ironBallast() }));
    expect(r.rules.find((x) => x.id === 'ballast-plan')!.action).toMatch(/Remove the ballast/);
    expect(r.rules.find((x) => x.id === 'peak-current')!.verdict).toBe('fail');
    expect(r.actions.some((s) => /Add ballast resistance/.test(s))).toBe(true);
    expect(r.actions.some((s) => /Remove the ballast/.test(s))).toBe(false);
  });

  it('says that no single change cures two failing rules that pull opposite ways, rather than advising both', () => {
    const fail = (id: RuleResult['id'], title: string, action: string, intents: Intent[]): RuleResult => ({ id, title, verdict: 'fail', figures: [], why: 'Why.', action, intents });
    const list = whatToDo([
      fail('peak-current', 'Peak coil current', 'Add ballast resistance, or choose a higher-resistance coil.', ['ballast:add', 'coil-resistance:raise']),
      fail('spark-energy', 'Spark energy across rpm', 'Choose a coil of lower inductance or resistance.', ['coil-resistance:lower']),
      { ...fail('ballast-plan', 'Ballast resistor', 'Remove the ballast (or bridge it) for this coil.', ['ballast:remove']), verdict: 'caution' },
    ]);
    expect(list).toEqual(['Add ballast resistance, or choose a higher-resistance coil.', '"Peak coil current" and "Spark energy across rpm" pull opposite ways, so no single change to these parts cures both: choose a different coil or module.']);
  });

  it('tells points about dwell and the points gap, and a current-limited module about its maximum duty', () => {
    const pts = checkSetup({ ...fourCylinder, redlineRpm: 9000 }, pointsSetup({ coil: ballastCoil(), ballast: ironBallast(), crankingBypass: true }));
    const off = pts.rules.find((x) => x.id === 'off-time')!;
    if (off.verdict !== 'pass') expect(off.action).toMatch(/points gap/);
    expect(pts.rules.every((x) => !/duty/.test(x.action))).toBe(true);
    const cl = checkSetup(fourCylinder, moduleSetup(module()));
    expect(cl.rules.find((x) => x.id === 'off-time')!.action).toMatch(/lower maximum duty/);
  });
});
