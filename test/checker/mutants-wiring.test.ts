/**
 * The wiring rules (rules/wiring.ts) on the cases the other files leave out: a magneto's condenser
 * (a magneto breaks its primary with points too, and carries a condenser across them: common
 * practice), a points condenser of exactly 0.4 uF (the top of the accepted 0.12 to 0.4 uF; the usual
 * 0.18 to 0.25 uF, from memory), each fail test against its rule on every kind of system, and the
 * setup-complete sentence with more than one issue. Written against the mutation-testing survivors.
 */
import { describe, expect, it } from 'vitest';
import { analyse, createSession } from '../../electron/checker/session.js';
import type { RuleContext } from '../../electron/checker/rules/context.js';
import { condenser, condenserFails, setupComplete, suppressedLeads, suppressedLeadsFails } from '../../electron/checker/rules/wiring.js';
import type { EngineSpec, LeadsSpec, PlugSpec, SetupSpec } from '../../electron/checker/index.js';
import { cdModule, coil, fourCylinder, module, moduleSetup, pointsSetup } from './fixtures.js';

function ctxOf(setup: SetupSpec, engine: EngineSpec = fourCylinder): RuleContext {
  return analyse(createSession(engine, undefined, { rpmPoints: 12 }), setup, null, false).ctx;
}
const magneto = (over: Partial<SetupSpec> = {}) => pointsSetup({ switching: 'magneto', magneto: { ratedCurrentA: 0.2, fullOutputRpm: 2000 }, ...over });
const copper: LeadsSpec = { name: 'Copper', core: 'copper', resistancePerLeadOhm: 0 };
const plainPlug: PlugSpec = { name: 'Plug', resistor: false, resistorOhm: 0, gapMinM: 0.5e-3, gapMaxM: 1.1e-3 };

describe('the condenser on a magneto and at the top of the accepted range', () => {
  it('a magneto without a condenser fails like points: its contacts would burn', () => {
    const r = condenser(ctxOf(magneto({ condenserF: null })));
    expect(r.verdict).toBe('fail');
    expect(r.action).toBe('Fit a condenser across the points (about 0.2 uF).');
    expect(r.intents).toEqual(['condenser:fit']);
    expect(r.why).toMatch(/^The condenser across the points stops them arcing/);
    const ok = condenser(ctxOf(magneto({ condenserF: 0.22e-6 })));
    expect(ok.verdict).toBe('pass');
    expect(ok.action).toBe('Nothing to do.');
  });
  it('accepts exactly 0.4 uF', () => {
    const f = 0.4 / 1e6;
    expect(f * 1e6).toBe(0.4);
    const r = condenser(ctxOf(pointsSetup({ condenserF: f })));
    expect(r.verdict).toBe('pass');
    expect(r.figures).toEqual([{ name: 'condenser', value: 0.4, unit: 'uF' }]);
  });
});

describe('each wiring fail test says "fail" exactly when its rule does', () => {
  const kinds: Array<[string, (over: Partial<SetupSpec>) => SetupSpec]> = [
    ['points', (o) => pointsSetup(o)],
    ['magneto', (o) => magneto(o)],
    ['transistor points', (o) => moduleSetup(module({ moduleType: 'transistor-points', currentLimitA: null, maxDutyFraction: null }), o)],
    ['current-limited module', (o) => moduleSetup(module(), o)],
    ['current-limited module needing suppression', (o) => moduleSetup(module({ needsSuppressedLeads: true }), o)],
    ['CD module', (o) => moduleSetup(cdModule(), o)],
    ['CD module needing suppression', (o) => moduleSetup(cdModule({ needsSuppressedLeads: true }), o)],
  ];
  it('the condenser, with and without one, on every system', () => {
    for (const [label, make] of kinds) {
      for (const condenserF of [null, 0.22e-6]) {
        const ctx = ctxOf(make({ condenserF }));
        expect(condenserFails(ctx), `${label}, condenser ${condenserF}`).toBe(condenser(ctx).verdict === 'fail');
      }
    }
    // The plain cases by name: points without one fail; a module without one does not.
    expect(condenserFails(ctxOf(pointsSetup({ condenserF: null })))).toBe(true);
    expect(condenserFails(ctxOf(moduleSetup(module(), { condenserF: null })))).toBe(false);
  });
  it('suppressed leads, with copper leads and plain plugs on every system', () => {
    for (const [label, make] of kinds) {
      for (const leads of [copper, null]) {
        const ctx = ctxOf(make({ leads, plug: plainPlug }));
        expect(suppressedLeadsFails(ctx), `${label}, leads ${leads?.name ?? 'none'}`).toBe(suppressedLeads(ctx).verdict === 'fail');
      }
    }
    // Points and a module that does not ask for suppression: plain copper is no fault.
    expect(suppressedLeadsFails(ctxOf(pointsSetup({ leads: copper, plug: plainPlug })))).toBe(false);
    expect(suppressedLeadsFails(ctxOf(moduleSetup(module(), { leads: copper, plug: plainPlug })))).toBe(false);
    const pts = suppressedLeads(ctxOf(pointsSetup({ leads: copper, plug: plainPlug })));
    expect(pts.verdict).toBe('pass');
    expect(pts.why).toBe('The module does not call for suppressed leads.');
    expect(pts.action).toBe('Nothing to do.');
  });
});

describe('setup complete', () => {
  it('lists every issue, each sentence apart', () => {
    // No primary resistance and no inductance on the coil: two issues.
    const c = ctxOf(pointsSetup({ coil: coil({ primaryInductanceH: 0, primaryResistanceOhm20C: { value: 0, provenance: 'catalogue' } }) }));
    expect(c.p.issues.length).toBeGreaterThanOrEqual(2);
    const r = setupComplete(c);
    expect(r.verdict).toBe('fail');
    expect(r.why).toBe(`The setup cannot be checked properly: ${c.p.issues.join(' ')}`);
    expect(r.why).toMatch(/assumed\. [A-Z]/);
  });
});
