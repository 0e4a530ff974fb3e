/**
 * Which steps each kind of plan gets, and the sheet-wide rules of the contract
 * (notes/contract.md, piece A; shared/design/wiring-sheet.md sections 3 and 4): cautions first and
 * all of them, each reading quantity at most once, each unit the contract's, every number finite,
 * step keys unique and stable. Trade facts named where they decide a step (common practice).
 */
import { describe, expect, it } from 'vitest';
import { buildSheet, SheetInputError } from '../../electron/checklist/index.js';
import type { Sheet, SheetStep } from '../../electron/checklist/types.js';
import { ignitionCautions } from '../../electron/safety/cautions.js';
import { allCases, type SheetCase } from './demo-sheets.js';

/** The contract's table of one unit per quantity (notes/contract.md), written out by hand. */
const CONTRACT_UNITS: Record<string, string> = {
  'battery-voltage-resting': 'V',
  'coil-primary-resistance': 'ohm',
  'coil-secondary-resistance': 'kohm',
  'ballast-resistance': 'ohm',
  'ht-lead-resistance': 'kohm',
  'key-on-current': 'A',
  'coil-feed-voltage-key-on': 'V',
  'coil-switch-voltage-key-on': 'V',
  'coil-voltage-after-shut-off': 'V',
  'supply-voltage-cranking': 'V',
  'coil-feed-voltage-cranking': 'V',
  'module-supply-voltage-cranking': 'V',
  'supply-voltage-running': 'V',
  'dwell-angle': 'deg',
  'tach-idle-rpm': 'rpm',
  'timing-idle': 'deg',
  'timing-advanced': 'deg',
  'plug-gap': 'mm',
};

const cases = allCases();
const byLabel = (label: string): SheetCase => {
  const c = cases.find((x) => x.label === label || x.label === `demo plan: ${label}`);
  if (!c) throw new Error(`no case ${label}`);
  return c;
};
const steps = (s: Sheet): SheetStep[] => s.stages.flatMap((x) => x.steps);
const keys = (s: Sheet): string[] => steps(s).map((x) => x.key);
const step = (s: Sheet, key: string): SheetStep => {
  const f = steps(s).find((x) => x.key === key);
  if (!f) throw new Error(`no step ${key}; have ${keys(s).join(', ')}`);
  return f;
};
const quantities = (s: Sheet): string[] => steps(s).flatMap((x) => (x.reading ? [x.reading.quantity] : []));

const POINTS = 'points kept, iron ballast with bypass';
const TRANSISTOR = 'transistor points, iron ballast with bypass';
const FIXED = 'Fixed-duty breakerless unit on the plain coil';
const LIMITED = 'Current-limited unit, full-voltage coil, ballast removed';
const CD = 'Capacitive discharge, keep the resistive feed for now';
const MODULE_STEPS = ['fit.module-mount', 'fit.module-earth', 'fit.module-supply', 'fit.module-trigger', 'fit.module-output'];

function allNumbers(x: unknown, path: string, out: Array<[string, number]>): void {
  if (typeof x === 'number') out.push([path, x]);
  else if (Array.isArray(x)) x.forEach((v, i) => allNumbers(v, `${path}[${i}]`, out));
  else if (x && typeof x === 'object') for (const [k, v] of Object.entries(x)) allNumbers(v, `${path}.${k}`, out);
}

describe('every sheet', () => {
  for (const c of cases) {
    describe(c.label, () => {
      const s = c.sheet;
      it('shows all the cautions first, in order (electron/safety/cautions.ts)', () => {
        expect(s.cautions.map((x) => x.id)).toEqual(ignitionCautions.map((x) => x.id));
        expect(s.cautions.map((x) => x.text)).toEqual(ignitionCautions.map((x) => x.text));
        expect(Object.keys(s).indexOf('cautions')).toBeLessThan(Object.keys(s).indexOf('stages'));
      });
      it('has unique step keys of the form stage.what, each in its own stage', () => {
        expect(new Set(keys(s)).size).toBe(keys(s).length);
        for (const st of s.stages) for (const x of st.steps) {
          expect(x.stage).toBe(st.id);
          expect(x.key.startsWith(`${st.id}.`)).toBe(true);
        }
      });
      it('asks for each quantity at most once, in the contract unit, with probes, state, how, source and causes', () => {
        const q = quantities(s);
        expect(new Set(q).size).toBe(q.length);
        for (const x of steps(s)) {
          if (!x.reading) continue;
          expect(x.reading.unit, x.key).toBe(CONTRACT_UNITS[x.reading.quantity]);
          expect(x.reading.min, x.key).toBeLessThanOrEqual(x.reading.max);
          for (const f of ['probes', 'state', 'how', 'source'] as const) expect(x.reading[f].length, `${x.key} ${f}`).toBeGreaterThan(3);
          expect(x.reading.ifOutOfRange.length, x.key).toBeGreaterThan(0);
          expect(x.fitting).toBe(false);
        }
      });
      it('has every number finite', () => {
        const nums: Array<[string, number]> = [];
        allNumbers(s, 'sheet', nums);
        expect(nums.length).toBeGreaterThan(50);
        for (const [p, n] of nums) expect(Number.isFinite(n), p).toBe(true);
      });
      it('has the stages in order, with the fitting steps only in the magneto and fit stages', () => {
        const order = ['magneto', 'before', 'measure', 'fit', 'static', 'cranking', 'running', 'finish'];
        const ids = s.stages.map((x) => x.id);
        expect(ids).toEqual(order.filter((id) => ids.includes(id as never)));
        expect(ids.slice(-7)).toEqual(order.slice(1));
        for (const x of steps(s)) if (x.fitting) expect(['magneto', 'fit']).toContain(x.stage);
      });
      it('has a ballast step exactly when the plan has a ballast, a condenser step only on a points plan', () => {
        const hasBallast = c.input.setup.ballast !== null;
        expect(keys(s).includes('measure.ballast')).toBe(hasBallast);
        expect(quantities(s).includes('ballast-resistance')).toBe(hasBallast);
        expect(keys(s).includes('fit.ballast-feed')).toBe(hasBallast);
        const module = c.input.setup.module !== null;
        expect(keys(s).includes('fit.condenser')).toBe(!module);
        for (const k of MODULE_STEPS) expect(keys(s).includes(k), k).toBe(module);
      });
      it('builds the same keys again (ticks are stored by them)', () => {
        expect(keys(buildSheet(c.input))).toEqual(keys(s));
      });
    });
  }
});

describe('each kind of plan gets its steps', () => {
  it('points kept: condenser kept, coil 1 to the points, key-on current, divider and points drop; dwell from the engine', () => {
    const s = byLabel(POINTS).sheet;
    expect(keys(s)).toEqual(expect.arrayContaining(['fit.points', 'fit.condenser', 'fit.coil-switch', 'static.key-on-current', 'static.coil-feed', 'static.coil-switch', 'running.dwell']));
    expect(keys(s)).not.toContain('static.after-shut-off');
    expect(keys(s)).not.toContain('fit.condenser-off');
    expect(quantities(s)).not.toContain('module-supply-voltage-cranking');
    // Points drop limit 0.3 V: common practice.
    expect(step(s, 'static.coil-switch').reading!.max).toBe(0.3);
    expect(step(s, 'static.coil-switch').reading!.source).toMatch(/common practice/);
    expect(byLabel(POINTS).input.setup.condenserF).not.toBeNull();
  });
  it('transistor-assisted points: condenser off, trigger from the points, key-on current through the switch, coil 1 at the saturation voltage', () => {
    const s = byLabel(TRANSISTOR).sheet;
    expect(keys(s)).toEqual(expect.arrayContaining(['fit.points', 'fit.condenser-off', 'static.key-on-current', 'static.coil-switch', 'cranking.module-supply', 'running.dwell']));
    expect(step(s, 'fit.module-trigger').terminals.join(' ')).toMatch(/points/);
    expect(step(s, 'static.coil-switch').reading!.source).toBe('module data');
    expect(step(s, 'static.key-on-current').reading!.how).toMatch(/12\.60 - 1\.80/);
  });
  it('breakerless fixed duty: points out, pickup in, after-shut-off instead of key-on current, dwell from the duty', () => {
    const s = byLabel(FIXED).sheet;
    expect(keys(s)).toEqual(expect.arrayContaining(['fit.points-out', 'fit.pickup', 'static.after-shut-off', 'running.dwell']));
    for (const k of ['static.key-on-current', 'static.coil-feed', 'static.coil-switch', 'fit.points', 'fit.condenser-off']) expect(keys(s)).not.toContain(k);
    expect(step(s, 'fit.module-trigger').terminals.join(' ')).toMatch(/pickup/);
    expect(step(s, 'running.dwell').reading!.how).toMatch(/duty 0\.600 x 360 \/ 6/);
  });
  it('breakerless current-limited: after-shut-off, dwell from the checker', () => {
    const s = byLabel(LIMITED).sheet;
    expect(keys(s)).toEqual(expect.arrayContaining(['fit.pickup', 'static.after-shut-off', 'running.dwell']));
    expect(keys(s)).not.toContain('static.key-on-current');
    expect(step(s, 'running.dwell').reading!.source).toBe('checker');
  });
  it('capacitive discharge: no key-on coil current, no dwell, no coil 15 while cranking; module supply while cranking', () => {
    const s = byLabel(CD).sheet;
    for (const q of ['key-on-current', 'coil-feed-voltage-key-on', 'coil-switch-voltage-key-on', 'coil-voltage-after-shut-off', 'dwell-angle', 'coil-feed-voltage-cranking']) expect(quantities(s)).not.toContain(q);
    expect(quantities(s)).toContain('module-supply-voltage-cranking');
    expect(keys(s)).toContain('fit.condenser-off');
  });
});

describe('ballast and bypass', () => {
  it('a discrete ballast: measured cold, fed from 15, the coil from 15a', () => {
    const s = byLabel(POINTS).sheet;
    expect(step(s, 'measure.ballast').terminals.join(' ')).toMatch(/15a/);
    expect(step(s, 'fit.coil-feed').terminals.join(' ')).toMatch(/^15a/);
  });
  it('a resistive harness wire is named as a wire, not a ballast block', () => {
    const s = byLabel(CD).sheet;
    expect(step(s, 'measure.ballast').title).toMatch(/feed wire/);
    expect(step(s, 'fit.ballast-feed').title).toMatch(/feed wire/);
  });
  it('no ballast on the plan but one today: take it out and take the bypass off; the coil fed straight from 15', () => {
    const s = byLabel(LIMITED).sheet;
    expect(keys(s)).toEqual(expect.arrayContaining(['fit.ballast-out', 'fit.bypass-off']));
    expect(keys(s)).not.toContain('fit.bypass');
    expect(step(s, 'fit.coil-feed').terminals[0]).toMatch(/^15 /);
  });
  it('no ballast today or on the plan: neither a ballast nor a bypass step', () => {
    const s = byLabel(FIXED).sheet;
    for (const k of ['measure.ballast', 'fit.ballast-out', 'fit.ballast-feed', 'fit.bypass', 'fit.bypass-off']) expect(keys(s)).not.toContain(k);
  });
  it('with the bypass: a step from the starter solenoid to the coil side of the ballast, and the cranking reading says so', () => {
    const s = byLabel(POINTS).sheet;
    expect(step(s, 'fit.bypass').terminals.join(' ')).toMatch(/starter solenoid.*15a/);
    expect(step(s, 'cranking.coil-feed').reading!.how).toMatch(/bypass/);
    expect(step(s, 'cranking.coil-feed').reading!.ifOutOfRange[0]).toMatch(/bypass is not connected/);
  });
  it('without the bypass (ballast kept): no bypass step, and today\'s bypass comes off', () => {
    const s = byLabel('points kept, ceramic ballast without bypass').sheet;
    expect(keys(s)).toContain('fit.bypass-off');
    expect(keys(s)).not.toContain('fit.bypass');
    expect(step(s, 'cranking.coil-feed').reading!.how).not.toMatch(/bypass/);
  });
  it('a module fed after the ballast: the supply step says most makers want 15', () => {
    const s = byLabel('transistor points, harness wire, fed after the ballast').sheet;
    expect(step(s, 'fit.module-supply').terminals.join(' ')).toMatch(/15a/);
    expect(step(s, 'fit.module-supply').text).toMatch(/from 15/);
  });
});

describe('the tachometer by the way it senses', () => {
  it('pulses at coil 1 on an inductive module: wired to 1, no adaptor (tach rule pass)', () => {
    const c = byLabel(LIMITED);
    expect(c.input.report.rules.find((r) => r.id === 'tach')!.verdict).toBe('pass');
    expect(step(c.sheet, 'fit.tach').terminals[0]).toMatch(/^1 /);
    expect(keys(c.sheet)).not.toContain('fit.tach-adaptor');
  });
  it('current in the coil feed on a CD module: the tach rule fails, so an adaptor step comes first (common practice table)', () => {
    const c = byLabel(CD);
    expect(c.input.report.rules.find((r) => r.id === 'tach')!.verdict).toBe('fail');
    const k = keys(c.sheet);
    expect(k.indexOf('fit.tach-adaptor')).toBeGreaterThan(-1);
    expect(k.indexOf('fit.tach-adaptor')).toBeLessThan(k.indexOf('fit.tach'));
  });
  it('every plan whose tach rule is not pass gets the adaptor step, and only those', () => {
    for (const c of cases) {
      const v = c.input.report.rules.find((r) => r.id === 'tach')!.verdict;
      const wired = c.input.setup.tach !== null && c.input.setup.tach.senses !== 'cable';
      expect(keys(c.sheet).includes('fit.tach-adaptor'), c.label).toBe(wired && v !== 'pass');
    }
  });
  it('current in the coil feed with points (tach rule pass): the feed stays looped through it, no adaptor', () => {
    const c = byLabel('points kept, harness wire, current-sensing tach');
    expect(c.input.report.rules.find((r) => r.id === 'tach')!.verdict).toBe('pass');
    expect(step(c.sheet, 'fit.tach').text).toMatch(/senses the current in the coil feed/);
    expect(keys(c.sheet)).not.toContain('fit.tach-adaptor');
    expect(c.sheet.diagram.wires.some((w) => w.from === 'switch.15' && w.to === 'tach.in')).toBe(true);
  });
  it('current in the coil feed on an inductive module: the tach rule takes care, so the adaptor step quotes its action', () => {
    const c = byLabel('fixed duty, ceramic ballast with bypass');
    const rule = c.input.report.rules.find((r) => r.id === 'tach')!;
    expect(rule.verdict).toBe('caution');
    expect(step(c.sheet, 'fit.tach-adaptor').text).toContain(rule.action);
  });
  it("a module-output tach on a module with a tach output: wired to the module's tach output", () => {
    const s = byLabel('current-limited, module tach output').sheet;
    expect(step(s, 'fit.tach').terminals[0]).toBe('module tach output');
  });
  it('a cable tach: nothing to wire, not a fitting step', () => {
    const s = byLabel(FIXED).sheet;
    expect(step(s, 'fit.tach').fitting).toBe(false);
    expect(step(s, 'fit.tach').text).toMatch(/cable-driven/);
  });
  it('no tach on the car: no tach steps', () => {
    const s = byLabel('Six-volt breakerless unit on the original coil').sheet;
    expect(keys(s).filter((k) => k.includes('tach'))).toEqual([]);
  });
});

describe('earth, voltage, magneto', () => {
  const pe = /31 \(earth\) is battery positive/;
  it('positive earth: the sentence on the battery, polarity and module steps and in the diagram notes', () => {
    const s = byLabel(FIXED).sheet;
    for (const k of ['before.battery-off', 'static.battery-on', 'static.battery-rest', 'fit.coil-polarity', 'fit.module-earth', 'fit.module-supply']) expect(step(s, k).text, k).toMatch(pe);
    expect(s.diagram.notes.join(' ')).toMatch(pe);
    expect(step(s, 'fit.coil-polarity').text).toMatch(/coil 15 \(supply side\) is the terminal marked -/);
  });
  it('negative earth: no positive-earth sentence anywhere', () => {
    const s = byLabel(LIMITED).sheet;
    expect(JSON.stringify(s)).not.toMatch(pe);
    expect(step(s, 'fit.coil-polarity').text).toMatch(/coil 15 \(supply side\) is the terminal marked \+/);
  });
  it('6 V: battery at rest 6.2 to 6.35 V (state-of-charge table, common practice) and the 6 V wording', () => {
    const s = byLabel('points kept, 6 V').sheet;
    const r = step(s, 'static.battery-rest').reading!;
    expect([r.min, r.max]).toEqual([6.2, 6.35]);
    expect(r.how).toMatch(/6 V battery/);
    expect(s.header.engine.systemVoltageV).toBe(6);
  });
  it('12 V: battery at rest 12.4 to 12.7 V', () => {
    const r = step(byLabel(POINTS).sheet, 'static.battery-rest').reading!;
    expect([r.min, r.max]).toEqual([12.4, 12.7]);
  });
  it('dynamo or alternator named in the running supply', () => {
    expect(step(byLabel(FIXED).sheet, 'running.supply').text).toMatch(/dynamo/);
    expect(step(byLabel(LIMITED).sheet, 'running.supply').text).toMatch(/alternator/);
  });
  it('a magneto today: its own stage comes first, and no points to take out of it', () => {
    const s = byLabel('magneto today, current-limited plan').sheet;
    expect(s.stages[0]!.id).toBe('magneto');
    expect(s.stages[0]!.steps.every((x) => x.fitting)).toBe(true);
    expect(keys(s)).not.toContain('fit.points-out');
    for (const c of cases.filter((x) => x.input.existing.switching !== 'magneto')) expect(c.sheet.stages[0]!.id).toBe('before');
  });
});

describe('header', () => {
  it('carries the verdict with counts and the worst reserve ratio, the printed date, and today\'s setup', () => {
    const c = byLabel(LIMITED);
    const h = c.sheet.header;
    const r = c.input.report;
    expect(h.verdict.verdict).toBe(r.verdict);
    const n = (v: string): number => r.rules.filter((x) => x.verdict === v).length;
    expect(h.verdict.line).toContain(`${n('pass')} checks fine, ${n('caution')} to take care over, ${n('fail')} not like this`);
    expect(h.verdict.line).toContain(r.worstReserveRatio.toFixed(2));
    expect(h.printedOn).toBe('2024-05-01');
    expect(h.existingLine).toMatch(/^Points; Canister coil, 1\.5 ohm/);
    expect(h.plan.switching).toMatch(/^Current-limited breakerless module: /);
    expect(h.plan.moduleFeed).toBe('Module fed from terminal 15');
    expect(byLabel(POINTS).sheet.header.plan.switching).toBe('Points kept');
  });
});

describe('bad input', () => {
  it('refuses a firing order that does not name every cylinder, naming the field', () => {
    const c = byLabel(LIMITED);
    expect(() => buildSheet({ ...c.input, about: { ...c.input.about, firingOrder: '1-3-4' } })).toThrow(SheetInputError);
    expect(() => buildSheet({ ...c.input, about: { ...c.input.about, firingOrder: '1-3-4' } })).toThrow(/about\.firingOrder/);
  });
  it('refuses a printed date that is not YYYY-MM-DD, naming the field', () => {
    const c = byLabel(LIMITED);
    expect(() => buildSheet({ ...c.input, printedOn: 'today' })).toThrow(/printedOn/);
  });
  it('refuses a module plan without its module, naming the field', () => {
    const c = byLabel(LIMITED);
    expect(() => buildSheet({ ...c.input, setup: { ...c.input.setup, module: null } })).toThrow(/setup\.module/);
  });
});
