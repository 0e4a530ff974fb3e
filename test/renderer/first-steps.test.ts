/**
 * The first-run path's ticks (renderer/screens/engines/first-steps.ts): a step is ticked off only
 * by the person's own records; the demo workshop's (db/demo) never count. The renderer keeps the
 * demo's names in demo-names.ts (it may not import db/demo), so they are held to db/demo here.
 */
import { describe, expect, it } from 'vitest';
import { demoEngines, demoParts, demoPlans } from '../../db/demo/index.js';
import { demoEngineNames, demoPartNames, demoPlanNames } from '../../renderer/screens/engines/demo-names.js';
import { firstSteps } from '../../renderer/screens/engines/first-steps.js';

const demoEvidence = () => ({
  engines: demoEngines.map((e) => ({ name: e.name })),
  parts: demoParts.map((p) => ({ kind: p.kind, name: p.name })),
  plans: demoPlans.map((p, i) => ({ id: i + 1, name: p.name, status: p.status })),
  plansWorked: 0,
});

describe('the first-run path', () => {
  it('knows the demo workshop by the same names db/demo gives it', () => {
    expect([...demoEngineNames]).toEqual(demoEngines.map((e) => e.name));
    expect(demoPartNames.map(([k, n]) => `${k}/${n}`)).toEqual(demoParts.map((p) => `${p.kind}/${p.name}`));
    expect([...demoPlanNames]).toEqual(demoPlans.map((p) => p.name));
  });

  it('ticks nothing off for the demo workshop alone, even its wired plan', () => {
    // The demo holds a plan marked wired in; it is not the person's work.
    expect(demoPlans.some((p) => p.status === 'wired')).toBe(true);
    expect(firstSteps(demoEvidence()).map((s) => s.done)).toEqual([false, false, false, false]);
  });

  it('ticks each step off from the person’s own records', () => {
    const e = demoEvidence();
    const own = {
      ...e,
      engines: [...e.engines, { name: 'My roadster' }],
      parts: [...e.parts, { kind: 'coil', name: 'Coil from the glovebox' }],
      plans: [...e.plans, { id: 99, name: 'Points out, module in', status: 'draft' }],
    };
    expect(firstSteps(own).map((s) => [s.id, s.done])).toEqual([
      ['engine', true],
      ['shelf', true],
      ['weigh', true],
      ['sheet', false],
    ]);
    // A plan of one's own marked wired in, or one with a tick or reading, finishes the last step.
    expect(firstSteps({ ...own, plans: [...own.plans, { id: 100, name: 'Second try', status: 'wired' }] })[3]!.done).toBe(true);
    expect(firstSteps({ ...own, plansWorked: 1 })[3]!.done).toBe(true);
    // A part of a demo name but another kind is the person's own.
    const renamed = firstSteps({ ...e, parts: [...e.parts, { kind: 'plug', name: e.parts[0]!.name }] });
    expect(renamed[1]!.done).toBe(true);
  });
});
