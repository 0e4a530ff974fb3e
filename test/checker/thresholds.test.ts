/**
 * Every verdict threshold tested from both sides, with the case just inside each limit, so that a
 * shifted threshold fails a test; the figure behind each verdict is worked out here by hand from
 * the laws (copper law, Ohm's law, the RL charge, the spark-duration law) and the labelled
 * defaults, never taken from the checker. Also the search's tie-break (equal worst ratio, more
 * energy at redline first).
 *
 * Defaults used by hand below, as the checker labels them (conditions.ts):
 *   running supply 14.0 V (workshop documentation), under-bonnet 80 degC (common practice),
 *   harness 0.1 ohm, transfer efficiency 0.8, arc 700 V (all from memory);
 *   copper R = R20 (1 + 0.00393 (T - 20)) (annealed copper, IACS).
 */
import { describe, expect, it } from 'vitest';
import { checkSetup, searchBest, type RuleId, type SetupReport, type Verdict } from '../../electron/checker/index.js';
import { ballastCoil, coil, fourCylinder, ironBallast, module, moduleSetup, pointsSetup } from './fixtures.js';

const rule = (r: SetupReport, id: RuleId) => {
  const x = r.rules.find((y) => y.id === id);
  if (!x) throw new Error(`no rule ${id}`);
  return x;
};
const verdict = (r: SetupReport, id: RuleId): Verdict => rule(r, id).verdict;
const figure = (r: SetupReport, id: RuleId, name: string): number => {
  const f = rule(r, id).figures.find((x) => x.name === name);
  if (!f) throw new Error(`no figure "${name}" in ${id}`);
  return f.value;
};

const copper = (r20: number, c: number): number => r20 * (1 + 0.00393 * (c - 20));
const RUN_V = 14.0;
const HARNESS = 0.1;
const HOT_C = 80;
/** A part in 10^4 either side of a limit: far above the solver's and the grid's rounding, far below any real change. */
const IN = 1 - 1e-4;
const OUT = 1 + 1e-4;

const fixedDuty = (over = {}) => module({ name: 'Fixed duty', moduleType: 'breakerless-fixed-duty', currentLimitA: null, maxDutyFraction: null, fixedDutyFraction: 0.6, ...over });

describe('the hot coil resistance (under-bonnet default 80 degC, copper law)', () => {
  it('pins the hot primary at R20 (1 + 0.00393 x 60) = 1.2358 R20 and the total at that plus harness and contacts', () => {
    const r = checkSetup(fourCylinder, pointsSetup());
    // 3.0 ohm at 20 degC -> 3.7074 ohm at 80 degC (a changed under-bonnet default or coefficient moves it).
    expect(r.circuit.coilResistanceHotOhm).toBeCloseTo(copper(3, HOT_C), 9);
    expect(r.circuit.coilResistanceHotOhm).toBeCloseTo(3.7074, 9);
    expect(r.circuit.coilResistanceColdOhm).toBeCloseTo(3, 12);
    // Points: + 0.1 ohm harness + 0.1 ohm contact (both from memory).
    expect(r.circuit.primaryResistanceHotOhm).toBeCloseTo(3.7074 + 0.1 + 0.1, 9);
    // Ohm's law: 14 V / 3.9074 ohm.
    expect(r.circuit.finalCurrentRunningA).toBeCloseTo(14 / 3.9074, 9);
  });
});

describe('peak-current: 0.9 of the rating is a caution, above the rating a fail', () => {
  // Fixed duty 0.6 on the 3 ohm, 8 mH coil: at the lowest running rpm the dwell is many time
  // constants, so the peak is the final current (14 - 1.5 V switch drop) / (3.7074 + 0.1 ohm).
  const peak = (RUN_V - 1.5) / (copper(3, HOT_C) + HARNESS);
  const at = (ratingA: number) => checkSetup(fourCylinder, moduleSetup(fixedDuty({ maxCurrentA: ratingA })));
  it(`peaks at (14 - 1.5) / 3.8074 = ${peak.toFixed(4)} A`, () => {
    expect(figure(at(8), 'peak-current', 'peak current at break')).toBeCloseTo(peak, 6);
  });
  it('cautions just above 0.9 of the rating and passes just below it', () => {
    expect(verdict(at((peak / 0.9) * IN), 'peak-current')).toBe('caution');
    expect(verdict(at((peak / 0.9) * OUT), 'peak-current')).toBe('pass');
  });
  it('fails just above the rating and cautions just below it', () => {
    expect(verdict(at(peak * IN), 'peak-current')).toBe('fail');
    expect(verdict(at(peak * OUT), 'peak-current')).toBe('caution');
  });
});

describe('peak-current on points: above 5 A a caution, above 7 A a fail (from memory)', () => {
  // A 1 mH coil charges fully at every running rpm (tau = 1 mH / R, well under the shortest dwell
  // here), so the peak is 14 V / (R20 x 1.2358 + 0.1 harness + 0.1 contact). R20 is chosen by hand
  // to put that a part in 10^4 either side of each limit.
  const r20For = (amps: number): number => (RUN_V / amps - 0.2) / 1.2358;
  const at = (amps: number) => checkSetup(fourCylinder, pointsSetup({ coil: coil({ primaryResistanceOhm20C: { value: r20For(amps), provenance: 'catalogue' }, primaryInductanceH: 0.001 }) }));
  it('reads the peak the copper and Ohm laws give', () => {
    expect(figure(at(6), 'peak-current', 'peak current at break')).toBeCloseTo(6, 5);
  });
  it('fails just above 7 A and cautions just below', () => {
    expect(verdict(at(7 * OUT), 'peak-current')).toBe('fail');
    expect(verdict(at(7 * IN), 'peak-current')).toBe('caution');
  });
  it('cautions just above 5 A and passes just below', () => {
    expect(verdict(at(5 * OUT), 'peak-current')).toBe('caution');
    expect(verdict(at(5 * IN), 'peak-current')).toBe('pass');
  });
});

describe('coil-resistance-floor at exact equality (below the minimum fails; at it passes)', () => {
  // The cold coil is its 20 degC catalogue value (ambient 20 degC): 3.0 ohm exactly.
  it('passes a 3.0 ohm coil on a 3.0 ohm floor and fails it on a floor a hair higher', () => {
    expect(verdict(checkSetup(fourCylinder, moduleSetup(fixedDuty({ minCoilResistanceOhm: 3 }))), 'coil-resistance-floor')).toBe('pass');
    expect(verdict(checkSetup(fourCylinder, moduleSetup(fixedDuty({ minCoilResistanceOhm: 3 * OUT }))), 'coil-resistance-floor')).toBe('fail');
  });
  it('with a ballast and cranking bypass: passes when the coil alone equals the floor, cautions a hair above', () => {
    // 1.5 ohm coil + 1.5 ohm iron ballast: 3.0 ohm running cold, 1.5 ohm while the bypass shorts the ballast.
    const at = (floor: number) => checkSetup(fourCylinder, moduleSetup(fixedDuty({ minCoilResistanceOhm: floor }), { coil: ballastCoil(), ballast: ironBallast(), crankingBypass: true }));
    expect(verdict(at(1.5), 'coil-resistance-floor')).toBe('pass');
    expect(verdict(at(1.5 * OUT), 'coil-resistance-floor')).toBe('caution');
    // Coil and ballast together 3.0 ohm cold: at the floor a caution (cranking), a hair above a fail.
    expect(verdict(at(3), 'coil-resistance-floor')).toBe('caution');
    expect(verdict(at(3 * OUT), 'coil-resistance-floor')).toBe('fail');
  });
});

describe('module-heat: above 15 W a caution, above 30 W a fail (from memory)', () => {
  // A fixed-duty module with a 0.4 ohm, 0.1 mH coil: tau = 0.1 mH / 0.594 ohm = 0.17 ms, so at the
  // lowest running rpm the coil is fully charged and the switch loss is V_sat x I / 2 x duty, with
  // I = (14 - V_sat) / (0.4 x 1.2358 + 0.1). The duty is chosen by hand to land just either side.
  const sat = 4;
  const i = (RUN_V - sat) / (copper(0.4, HOT_C) + HARNESS);
  const wattsPerDuty = sat * 0.5 * i;
  const low = coil({ primaryResistanceOhm20C: { value: 0.4, provenance: 'catalogue' }, primaryInductanceH: 0.0001 });
  const at = (watts: number) => checkSetup(fourCylinder, moduleSetup(fixedDuty({ fixedDutyFraction: watts / wattsPerDuty, switchSaturationV: sat, maxCurrentA: 40, minCoilResistanceOhm: 0 }), { coil: low }));
  it('dissipates V_sat I duty / 2 by hand', () => {
    expect(figure(at(20), 'module-heat', 'highest module dissipation')).toBeCloseTo(20, 4);
  });
  it('cautions just above 15 W and passes just below', () => {
    expect(verdict(at(15 * OUT), 'module-heat')).toBe('caution');
    expect(verdict(at(15 * IN), 'module-heat')).toBe('pass');
  });
  it('fails just above 30 W and cautions just below', () => {
    expect(verdict(at(30 * OUT), 'module-heat')).toBe('fail');
    expect(verdict(at(30 * IN), 'module-heat')).toBe('caution');
  });
});

describe('off-time: off time / spark duration under 0.3 fails, under 1 cautions (our limits)', () => {
  // A fixed-duty module on a 2 mH, n = 300 coil (Ls = n^2 Lp = 180 H), carbon leads 5 kohm + the
  // coil's 8 kohm secondary. At redline (6000 rpm, four cylinders, four-stroke: 200 sparks a
  // second, a 5 ms period) the coil charges for d T: i = I_f (1 - e^(-d T / tau)), tau = Lp / R,
  // I_f = (14 - 1.5) / 3.8074; the spark lasts (Ls / Rs) ln(1 + Rs Is0 / V_arc), Is0 = 0.8 i / n.
  // The ratio is least at redline (shortest period), and the duty is solved by hand for each target.
  const lp = 0.002;
  const n = 300;
  const r = copper(3, HOT_C) + HARNESS;
  const iF = (RUN_V - 1.5) / r;
  const tau = lp / r;
  const period = 120 / (6000 * 4);
  const rs = 8000 + 5000;
  const ratioAt = (d: number): number => {
    const i = iF * (1 - Math.exp((-d * period) / tau));
    const is0 = (0.8 * i) / n;
    const duration = ((n * n * lp) / rs) * Math.log(1 + (rs * is0) / 700);
    return ((1 - d) * period) / duration;
  };
  /** The duty whose redline ratio is `target` (the ratio falls as the duty rises). */
  const dutyFor = (target: number): number => {
    let a = 0.05;
    let b = 0.99;
    for (let k = 0; k < 80; k++) {
      const m = 0.5 * (a + b);
      if (ratioAt(m) > target) a = m;
      else b = m;
    }
    return 0.5 * (a + b);
  };
  const at = (d: number) => checkSetup(fourCylinder, moduleSetup(fixedDuty({ fixedDutyFraction: d }), { coil: coil({ primaryInductanceH: lp, turnsRatio: n }) }));
  it('gives the least ratio the charge and spark-duration laws give at redline', () => {
    const d = dutyFor(0.6);
    const rep = at(d);
    expect(figure(rep, 'off-time', 'least off time / spark duration')).toBeCloseTo(0.6, 6);
    expect(figure(rep, 'off-time', 'at rpm')).toBe(6000);
  });
  it('fails just under 0.3 and cautions just over', () => {
    expect(verdict(at(dutyFor(0.3 * IN)), 'off-time')).toBe('fail');
    expect(verdict(at(dutyFor(0.3 * OUT)), 'off-time')).toBe('caution');
  });
  it('cautions just under 1 and passes just over', () => {
    expect(verdict(at(dutyFor(1 * IN)), 'off-time')).toBe('caution');
    expect(verdict(at(dutyFor(1 * OUT)), 'off-time')).toBe('pass');
  });
});

describe("the module-heat case held at the limit (rules.test.ts's caution, pinned)", () => {
  // Current-limited, 5 A limit, 3 ms hold (measured), maximum duty 0.8, 0.4 ohm 3 mH coil, 1.5 V
  // drop. By hand at each running rpm: I_f = 12.5 / 0.59432, tau = 3 mH / 0.59432, time to the
  // limit t_l = -tau ln(1 - 5 / I_f), dwell = min(t_l + 3 ms, 0.8 T), and the module's loss
  // V_sat x 5 / 2 x dwell / T + (14 - 1.5 - 5 x 0.59432) x 5 x (dwell - t_l) / T.
  it('gives the largest of those losses, between 15 and 30 W: a caution', () => {
    const low = coil({ primaryResistanceOhm20C: { value: 0.4, provenance: 'catalogue' }, primaryInductanceH: 0.003 });
    const rep = checkSetup(fourCylinder, moduleSetup(module({ currentLimitA: 5, maxCurrentA: 40, minCoilResistanceOhm: 0 }), { coil: low }), { currentLimitHoldS: { value: 3e-3, provenance: 'measured' } });
    const r = copper(0.4, HOT_C) + HARNESS;
    const iF = (RUN_V - 1.5) / r;
    const tl = -(0.003 / r) * Math.log(1 - 5 / iF);
    let most = 0;
    for (const p of rep.points.filter((x) => x.supplyCase === 'running')) {
      const t = 120 / (p.rpm * 4);
      const dwell = Math.min(tl + 3e-3, 0.8 * t);
      const w = (1.5 * 0.5 * 5 * dwell) / t + ((RUN_V - 1.5 - 5 * r) * 5 * (dwell - tl)) / t;
      most = Math.max(most, w);
    }
    expect(most).toBeGreaterThan(15);
    expect(most).toBeLessThan(30);
    expect(figure(rep, 'module-heat', 'highest module dissipation')).toBeCloseTo(most, 6);
    expect(verdict(rep, 'module-heat')).toBe('caution');
  });
});

describe("the search's tie-break: equal worst ratio, more energy at redline first", () => {
  it('ranks the coil storing more at redline first when both are held at the clamp everywhere', () => {
    // Both coils n = 100 behind a 150 V clamp: the secondary is n x 150 V = 15 kV at every rpm
    // (both exceed it even cranking), so the worst reserve ratio is the same. At redline the
    // current-limited module (6 A, never reached: I_f = 12.5 / 3.8074 = 3.28 A) charges for its
    // maximum duty, 0.8 x 5 ms: i = I_f (1 - e^(-4 ms / tau)), tau = Lp / 3.8074, E = 0.5 Lp i^2.
    const r = copper(3, HOT_C) + HARNESS;
    const iF = (RUN_V - 1.5) / r;
    const energy = (lp: number): number => 0.5 * lp * (iF * (1 - Math.exp(-4e-3 / (lp / r)))) ** 2;
    // 6 mH: 27.4 mJ; 8 mH: 31.2 mJ, so the 8 mH coil, second in the bin, must rank first.
    expect(energy(0.008)).toBeGreaterThan(energy(0.006));
    const c6 = coil({ name: 'six millihenry', primaryInductanceH: 0.006 });
    const c8 = coil({ name: 'eight millihenry', primaryInductanceH: 0.008 });
    const out = searchBest({
      engine: fourCylinder,
      existing: pointsSetup(),
      coils: [c6, c8],
      modules: [module({ primaryClampV: 150 })],
      ballasts: [],
      tach: null,
      leads: pointsSetup().leads,
      plug: pointsSetup().plug,
      plugGapM: 0.7e-3,
      options: { rpmPoints: 40, skipGapSuggestion: true },
      topN: 2,
    });
    expect(out.top.map((t) => t.coilIndex)).toEqual([1, 0]);
    const [first, second] = out.top;
    expect(first!.report.keyPoints.redline.storedEnergyJ).toBeCloseTo(energy(0.008), 9);
    expect(second!.report.keyPoints.redline.storedEnergyJ).toBeCloseTo(energy(0.006), 9);
    // The same worst ratio: the clamp, 15 kV, over the same required voltage.
    const worst = (rep: SetupReport): number => Math.min(...rep.points.filter((p) => p.rpm <= fourCylinder.redlineRpm).map((p) => p.availableV / p.requiredV));
    expect(worst(first!.report)).toBe(worst(second!.report));
    expect(first!.report.points.every((p) => p.availableV === 15_000)).toBe(true);
  });
});
