/**
 * Whole-setup behaviour: comparison, search ranking, gap suggestion, fouled plugs, CD charging,
 * and the SPICE-facing circuit values.
 */
import { describe, expect, it } from 'vitest';
import { cdChargeVoltageV, checkSetup, circuitAtRpm, compareSetups, parallelRlcPeakVPerA, searchBest, suggestPlugGap } from '../../electron/checker/index.js';
import { ballastCoil, cdModule, coil, fourCylinder, ironBallast, module, moduleSetup, pointsSetup } from './fixtures.js';

describe('comparison', () => {
  it('lays the existing setup beside up to three candidates at cranking, idle, mid-range and redline', () => {
    const c = compareSetups({ engine: fourCylinder, existing: pointsSetup(), candidates: [moduleSetup(module()), moduleSetup(cdModule()), pointsSetup({ label: 'Ballast', coil: ballastCoil(), ballast: ironBallast(), crankingBypass: true })] });
    expect(c.rows).toHaveLength(4);
    expect(c.rows[0]!.cranking.supplyCase).toBe('cranking');
    expect(c.rows[0]!.redline.rpm).toBe(6000);
    expect(c.existing.points).toHaveLength(200);
    expect(c.existing.points.at(-1)!.rpm).toBeCloseTo(6600, 6);
  });
  it('refuses more than three candidates with a plain sentence', () => {
    expect(() => compareSetups({ engine: fourCylinder, existing: pointsSetup(), candidates: [pointsSetup(), pointsSetup(), pointsSetup(), pointsSetup()] })).toThrow(/at most 3/);
  });
  it('reports each condition with its provenance', () => {
    const r = checkSetup(fourCylinder, pointsSetup(), { ambientC: { value: -12, provenance: 'engine override' } });
    expect(r.inputs.find((f) => f.name === 'runningSupplyV')?.provenance).toBe('default (workshop documentation)');
    expect(r.inputs.find((f) => f.name === 'ambientC')?.provenance).toBe('engine override');
    // Workshop load-test criterion: 8.7 V at -12 degC.
    expect(r.circuit.crankingSupplyV).toBeCloseTo(8.7, 6);
  });
});

describe('parts-bin search', () => {
  it('ranks combinations without a fail first and counts what each rule rejected', () => {
    const coils = [coil(), ballastCoil(), coil({ name: 'Weak', turnsRatio: 40 })];
    const modules = [module({ name: 'Floor 3', moduleType: 'breakerless-fixed-duty', fixedDutyFraction: 0.6, currentLimitA: null, maxDutyFraction: null, minCoilResistanceOhm: 3 }), module()];
    const r = searchBest({ engine: fourCylinder, existing: pointsSetup(), coils, modules, ballasts: [ironBallast()], tach: null, leads: null, plug: null, plugGapM: 0.7e-3, topN: 4 });
    expect(r.evaluated).toBe(3 * 2 * 3);
    expect(r.top).toHaveLength(4);
    expect(r.top[0]!.report.verdict).not.toBe('fail');
    for (let i = 1; i < r.top.length; i++) {
      const a = r.top[i - 1]!.report;
      const b = r.top[i]!.report;
      if ((a.verdict === 'fail') === (b.verdict === 'fail')) expect(a.worstReserveRatio).toBeGreaterThanOrEqual(b.worstReserveRatio - 1e-12);
    }
    expect(r.rejectedByRule['coil-resistance-floor']).toBeGreaterThan(0);
    expect(r.withoutFail).toBeLessThan(r.evaluated);
  });
});

describe('plug gap suggestion', () => {
  it('suggests a smaller gap for a weaker coil, within the plug range', () => {
    const strong = suggestPlugGap(fourCylinder, pointsSetup({ plug: null }));
    const weak = suggestPlugGap(fourCylinder, pointsSetup({ plug: null, coil: coil({ turnsRatio: 60 }) }));
    expect(weak.suggestedGapM!).toBeLessThan(strong.suggestedGapM!);
    const ranged = suggestPlugGap(fourCylinder, pointsSetup());
    expect(ranged.suggestedGapM!).toBeLessThanOrEqual(1.1e-3);
    expect(ranged.suggestedGapM!).toBeGreaterThanOrEqual(0.5e-3);
  });
  it('keeps the margin at the suggested gap and loses it just above', () => {
    const setup = pointsSetup({ plug: null, coil: coil({ turnsRatio: 60 }) });
    const g = suggestPlugGap(fourCylinder, setup).suggestedGapM!;
    expect(checkSetup(fourCylinder, { ...setup, plugGapM: g }).worstReserveRatio).toBeGreaterThanOrEqual(1.25);
    expect(checkSetup(fourCylinder, { ...setup, plugGapM: g * 1.02 }).worstReserveRatio).toBeLessThan(1.25);
  });
});

describe('fouled plug (parallel RLC, closed form)', () => {
  it('tends to the lossless peak sqrt(L/C) as the shunt goes to infinity', () => {
    expect(parallelRlcPeakVPerA(80, 100e-12, 1e12) / Math.sqrt(80 / 100e-12)).toBeCloseTo(1, 3);
  });
  it('is continuous through critical damping (R = 0.5 sqrt(L/C))', () => {
    const rc = 0.5 * Math.sqrt(80 / 100e-12);
    const a = parallelRlcPeakVPerA(80, 100e-12, rc * 0.999);
    const b = parallelRlcPeakVPerA(80, 100e-12, rc);
    const c = parallelRlcPeakVPerA(80, 100e-12, rc * 1.001);
    expect(Math.abs(a - b) / b).toBeLessThan(0.01);
    expect(Math.abs(c - b) / b).toBeLessThan(0.01);
  });
  it('leaves CD with more of its clean peak than points on a fouled plug (faster rise)', () => {
    const pts = checkSetup(fourCylinder, pointsSetup()).keyPoints.idle;
    const cd = checkSetup(fourCylinder, moduleSetup(cdModule())).keyPoints.idle;
    expect(cd.fouledPeakV / cd.availableV).toBeGreaterThan(pts.fouledPeakV / pts.availableV);
  });
});

describe('capacitive discharge', () => {
  it('labels the coupling coefficient its peak rests on, as a default from memory', () => {
    const r = checkSetup(fourCylinder, moduleSetup(cdModule()));
    const k = r.inputs.find((f) => f.name === 'coil coupling coefficient');
    expect(k?.provenance).toBe('default (from memory)');
    // Oil-filled canister coils: 0.98 to 0.999 (from memory).
    expect(k!.value).toBeGreaterThanOrEqual(0.98);
    expect(k!.value).toBeLessThan(1);
    expect(checkSetup(fourCylinder, pointsSetup()).inputs.some((f) => f.name === 'coil coupling coefficient')).toBe(false);
  });
  it('charges fully when the period allows and falls as sqrt(2 P T / C) when it does not', () => {
    // 1 uF to 400 V needs 80 mJ; a 40 W charger takes 2 ms.
    expect(cdChargeVoltageV(400, 1e-6, 40, 0.01, 14, 8, 6)).toBeCloseTo(400, 9);
    expect(cdChargeVoltageV(400, 1e-6, 40, 1e-3, 14, 8, 6)).toBeCloseTo(Math.sqrt((2 * 40 * 1e-3) / 1e-6), 9);
  });
  it('falls below its minimum supply and stops below its cut-out', () => {
    expect(cdChargeVoltageV(400, 1e-6, 40, 0.01, 7, 8, 6)).toBeCloseTo(350, 9);
    expect(cdChargeVoltageV(400, 1e-6, 40, 0.01, 5.9, 8, 6)).toBe(0);
  });
  it('marks the multi-spark band below its rpm', () => {
    const r = checkSetup(fourCylinder, moduleSetup(cdModule({ cd: { capacitorF: 1e-6, chargeVoltageV: 400, chargerPowerW: 40, multiSparkBelowRpm: 3000 } })));
    expect(r.keyPoints.idle.multiSpark).toBe(true);
    expect(r.keyPoints.redline.multiSpark).toBe(false);
  });
});

describe('circuit values for SPICE', () => {
  it('gives the primitive circuit at a key rpm, matching the report', () => {
    const r = checkSetup(fourCylinder, pointsSetup());
    const c = circuitAtRpm(r, 6000);
    expect(c.currentAtBreakA).toBeCloseTo(r.keyPoints.redline.currentAtBreakA, 2);
    expect(c.primaryInductanceH).toBe(0.008);
    expect(c.condenserF).toBeCloseTo(0.22e-6, 12);
    expect(c.turnsRatio).toBe(100);
    expect(c.secondaryInductanceH).toBeCloseTo(80, 9);
    expect(c.cd).toBeNull();
    const cd = circuitAtRpm(checkSetup(fourCylinder, moduleSetup(cdModule())), 3000);
    expect(cd.cd?.chargeVoltageV).toBeCloseTo(400, 6);
  });
});
