/**
 * The report (report.ts) and its per-setup figures (report-figures.ts), held to what their headers
 * and comments promise: every figure under its own name and unit, shown for the kinds of system it
 * belongs to; the spark energy at a point without voltage is nothing; the inputs listed with their
 * provenance; each operating point's reserve, ceiling flag, CD charge and no-spark sentence; and the
 * SPICE circuit interpolated linearly between the sweep points around an rpm. Written against the
 * mutation-testing survivors (npm run mutate).
 *
 * Sources, each named again beside its check:
 * - the RL step i = I_f (1 - e^(-t/tau)), so the limit I_lim is reached at t = -tau ln(1 - I_lim/I_f)
 *   (any circuits text);
 * - the energy in a capacitor 0.5 C V^2, refilled by a charger of power P in 0.5 C V^2 / P;
 * - spark rate = rpm x cylinders / 120 on a four-stroke, rpm x cylinders / 60 on a two-stroke
 *   (one spark per cylinder every two, or every one, revolutions);
 * - charge sharing between C and the reflected n^2 Cs, V_cm = C V / (C + n^2 Cs), and the first
 *   overshoot of a series RLC step response, exp(-pi zeta / sqrt(1 - zeta^2)) with
 *   zeta = (R / 2) sqrt(C_ser / L) (Ogata, Modern Control Engineering, second-order step response);
 * - the energy an inductor gives an arc of constant voltage V_a through a resistance R over a time T,
 *   (V_a / R)(L I0 - V_a T), never more than 0.5 L I0^2 (integrating V_a i(t) dt over the discharge);
 * - 1 bar = 1e5 Pa, 0 degC = 273.15 K, 1 kV = 1000 V;
 * - linear interpolation between two tabulated points (the contract in circuitAtRpm's comment).
 */
import { describe, expect, it } from 'vitest';
import { checkSetup, circuitAtRpm } from '../../electron/checker/index.js';
import type { EngineSpec, Figure, OperatingPoint, Provenance, SetupReport, SetupSpec } from '../../electron/checker/index.js';
import type { EngineGrids, RpmGrid } from '../../electron/checker/grid.js';
import { prepareSetup, type PreparedSetup } from '../../electron/checker/prepare.js';
import { setupFigures, sparkEnergyAt } from '../../electron/checker/report-figures.js';
import { createSession } from '../../electron/checker/session.js';
import { createWorkspace, type Workspace } from '../../electron/checker/sweep.js';
import { ballastCoil, cdModule, coil, fourCylinder, ironBallast, module, moduleSetup, pointsSetup } from './fixtures.js';

const OPTIONS = { rpmPoints: 12 };

type Row = [name: string, value: number, unit: string, provenance?: Provenance];

/** The figures in order, each with its name, unit and provenance exactly and its value to a part in 1e9. */
function expectFigures(got: Figure[], want: Row[]): void {
  expect(got.map((f) => [f.name, f.unit, f.provenance])).toEqual(want.map(([name, , unit, provenance]) => [name, unit, provenance]));
  want.forEach(([name, value], i) => {
    const g = got[i]!.value;
    if (Math.abs(g - value) > 1e-9 * Math.max(1, Math.abs(value))) expect.fail(`${name}: ${g}, expected ${value}`);
  });
}

/** The first `n` points of a key grid (a grid of fewer points than the usual four). */
function firstPoints(g: RpmGrid, n: number): RpmGrid {
  return {
    n,
    rpm: g.rpm.slice(0, n),
    cranking: g.cranking.slice(0, n),
    resting: g.resting.slice(0, n),
    sparkRateHz: g.sparkRateHz.slice(0, n),
    periodS: g.periodS.slice(0, n),
    sparkAngleDegBtdc: g.sparkAngleDegBtdc.slice(0, n),
    pressurePa: g.pressurePa.slice(0, n),
    temperatureK: g.temperatureK.slice(0, n),
    densityFactor: g.densityFactor.slice(0, n),
  };
}

/** A key grid with one more point after the four (110 % of redline, the last point copied with its rpm raised). */
function withFifth(g: RpmGrid, rpm: number): RpmGrid {
  const add = <T extends Float64Array | Uint8Array>(a: T, x: number): T => {
    const out = new (a.constructor as new (n: number) => T)(a.length + 1);
    out.set(a);
    out[a.length] = x;
    return out;
  };
  const last = g.n - 1;
  return {
    n: g.n + 1,
    rpm: add(g.rpm, rpm),
    cranking: add(g.cranking, 0),
    resting: add(g.resting, 0),
    sparkRateHz: add(g.sparkRateHz, g.sparkRateHz[last]!),
    periodS: add(g.periodS, g.periodS[last]!),
    sparkAngleDegBtdc: add(g.sparkAngleDegBtdc, g.sparkAngleDegBtdc[last]!),
    pressurePa: add(g.pressurePa, g.pressurePa[last]! * 0.9),
    temperatureK: add(g.temperatureK, g.temperatureK[last]! - 10),
    densityFactor: add(g.densityFactor, g.densityFactor[last]!),
  };
}

const NAMES = ['cranking', 'idle', 'mid-range', 'redline'];

/** The cylinder figures at each named key point (Pa to bar, K to degC), with the ballast's where there is one. */
function keyRows(kg: RpmGrid, ballastK: Float64Array | null): Row[] {
  const rows: Row[] = [];
  for (let k = 0; k < Math.min(kg.n, 4); k++) {
    const name = NAMES[k]!;
    rows.push([`cylinder pressure at the spark, ${name} (${Math.round(kg.rpm[k]!)} rpm)`, kg.pressurePa[k]! / 1e5, 'bar']);
    rows.push([`cylinder temperature at the spark, ${name}`, kg.temperatureK[k]! - 273.15, 'degC']);
    if (ballastK) rows.push([`ballast temperature, ${name}`, ballastK[k]! - 273.15, 'degC']);
  }
  return rows;
}

/** A sweep workspace whose columns are longer than its n points (a buffer sized for a larger grid). */
function sweepWith(uncappedV: number[], n: number): Workspace {
  const ws = createWorkspace(uncappedV.length);
  ws.uncappedV.set(uncappedV);
  return { ...ws, n };
}

function prepared(engine: EngineSpec, setup: SetupSpec, over: Partial<PreparedSetup> = {}): { grids: EngineGrids; p: PreparedSetup } {
  const s = createSession(engine, undefined, OPTIONS);
  return { grids: s.grids, p: { ...prepareSetup(engine, setup, s.conditions, s.model), ...over } };
}

/** The CD secondary peak by charge sharing and the RLC overshoot (Ogata), leakage 2 (1 - k) Lp. */
function cdPeakByLawV(p: PreparedSetup, k: number): number {
  const cd = p.cd!;
  const reflected = p.n * p.n * p.secondaryCapacitanceF;
  const series = (cd.capacitorF * reflected) / (cd.capacitorF + reflected);
  const r = p.coilHotOhm + p.secondaryResistanceOhm / (p.n * p.n);
  const l = 2 * (1 - k) * p.primaryInductanceH;
  const zeta = (r / 2) * Math.sqrt(series / l);
  const overshoot = zeta < 1 ? Math.exp((-Math.PI * zeta) / Math.sqrt(1 - zeta * zeta)) : 0;
  return p.n * p.eta * ((cd.capacitorF * cd.nominalV) / (cd.capacitorF + reflected)) * (1 + overshoot);
}

describe('setup figures: each under its own name and unit, for the systems it belongs to', () => {
  it('a current-limited module with an iron ballast: ceiling, capped points, damping, time to the limit, ballast temperatures', () => {
    const setup = moduleSetup(module(), { coil: ballastCoil(), ballast: ironBallast() });
    // The limit at 6 A; idle drives towards 8 A (reached), cranking towards 5 A (never reached).
    const { grids, p } = prepared(fourCylinder, setup, {
      ceilingV: 30_000, ceilingProvenance: 'catalogue', dampingFactor: 0.9, limitA: 6,
      iFinalRunningA: 8, tauRunningS: 2e-3, iFinalCrankingA: 5, tauCrankingS: 1.5e-3, ballastHotK: 400,
    });
    expect(p.ironBallast).not.toBeNull();
    // Four sweep points: above, at, below and above the ceiling (only strictly above is capped); the
    // fifth slot of the buffer is no point of the sweep and is not counted.
    const ws = sweepWith([30_001, 30_000, 29_000, 41_000, 50_000], 4);
    const keyWs = createWorkspace(4);
    keyWs.ballastK.set([293.15, 373.15, 393.15, 413.15]);
    const want: Row[] = [
      ['coil secondary ceiling (insulation rating)', 30, 'kV', 'catalogue'],
      ['sweep points capped at the ceiling', 2, ''],
      // The secondary resistance leaves 0.9 of the lossless peak: it takes off 10 %.
      ['secondary resistance takes off the peak', 10, '%'],
      // RL step: t = -tau ln(1 - 6/8) = 2 ms x ln 4.
      ['time to reach the current limit, idle', 2 * Math.log(4), 'ms'],
      ['current limit not reached, cranking: the final current', 5, 'A'],
      ...keyRows(grids.key, keyWs.ballastK),
      ['ballast temperature just after a long idle', 400 - 273.15, 'degC'],
    ];
    expectFigures(setupFigures(fourCylinder, grids, p, ws, keyWs), want);
  });

  it('points without a current limit and without a ballast: no limit or ballast figures; a key grid of three points names three', () => {
    const { grids, p } = prepared(fourCylinder, pointsSetup(), { ceilingV: 25_000, ceilingProvenance: 'engine override', dampingFactor: 0.75 });
    expect(p.limitA).toBe(Infinity);
    const three = firstPoints(grids.key, 3);
    const ws = sweepWith([10_000, 26_000, 25_000], 3);
    const want: Row[] = [
      ['coil secondary ceiling (insulation rating)', 25, 'kV', 'engine override'],
      ['sweep points capped at the ceiling', 1, ''],
      ['secondary resistance takes off the peak', 25, '%'],
      ...keyRows(three, null),
    ];
    expectFigures(setupFigures(fourCylinder, { ...grids, key: three }, p, ws, createWorkspace(3)), want);
  });

  it('a magneto: no secondary-damping figure (its peak is the armature\'s, not a battery coil\'s)', () => {
    const setup = pointsSetup({ switching: 'magneto', magneto: { ratedCurrentA: 4, fullOutputRpm: 1500 } });
    const { grids, p } = prepared(fourCylinder, setup, { ceilingV: 20_000, ceilingProvenance: 'catalogue', dampingFactor: 0.8 });
    expect(p.kind).toBe('magneto');
    const want: Row[] = [
      ['coil secondary ceiling (insulation rating)', 20, 'kV', 'catalogue'],
      ['sweep points capped at the ceiling', 0, ''],
      ...keyRows(grids.key, null),
    ];
    expectFigures(setupFigures(fourCylinder, grids, p, sweepWith([1000, 2000], 2), createWorkspace(4)), want);
  });

  const twoStroke: EngineSpec = { ...fourCylinder, name: 'Test twin two-stroke', cylinders: 2, cycle: 'two-stroke' };
  const ceramic = ironBallast({ name: 'Ceramic 1.5 ohm', ballastType: 'ceramic' });
  const cdRows = (p: PreparedSetup, engine: EngineSpec): Row[] => {
    const cd = p.cd!;
    const rechargeS = (0.5 * cd.capacitorF * cd.nominalV ** 2) / cd.chargerPowerW;
    // The firing period 1 / rate equals the recharge time at rate = rpm x cylinders / 120 (four-stroke) or / 60 (two-stroke).
    const revsPerSpark = engine.cycle === 'two-stroke' ? 60 : 120;
    return [
      ['CD recharge time at the nominal charge voltage', rechargeS * 1000, 'ms'],
      ['CD energy starts to fall from', revsPerSpark / (engine.cylinders * rechargeS), 'rpm'],
      ['CD rise time (transfer loop peak time)', cd.riseS * 1e6, 'us'],
      ['coil coupling used', p.couplingK, ''],
      ['CD peak at the coupling used', cdPeakByLawV(p, p.couplingK) / 1000, 'kV'],
      ['CD peak at coupling 0.98', cdPeakByLawV(p, 0.98) / 1000, 'kV'],
      ['CD peak at coupling 0.999', cdPeakByLawV(p, 0.999) / 1000, 'kV'],
    ];
  };

  it('a CD unit with a current limit on a two-stroke, with a ceramic ballast: CD figures, no limit or damping figure; four key points named of five', () => {
    // 1 uF to 400 V on a 40 W charger: 80 mJ, refilled in 2 ms (0.5 C V^2 / P); a two-cylinder
    // two-stroke fires 2 sparks a revolution, so the period falls to 2 ms at 60 / (2 x 2 ms) = 15,000 rpm.
    const setup = moduleSetup(cdModule({ currentLimitA: 6 }), { ballast: ceramic });
    const { grids, p } = prepared(twoStroke, setup);
    expect(p.limitA).toBe(6);
    expect(p.ironBallast).toBeNull();
    const cdFigures = cdRows(p, twoStroke);
    expect(cdFigures[0]![1]).toBeCloseTo(2, 12);
    expect(cdFigures[1]![1]).toBeCloseTo(15_000, 6);
    const five = withFifth(grids.key, 1.1 * twoStroke.redlineRpm);
    const keyWs = createWorkspace(5);
    keyWs.ballastK.set([293.15, 330, 331, 332, 333]);
    const want: Row[] = [
      ['coil secondary ceiling (insulation rating)', p.ceilingV / 1000, 'kV', p.ceilingProvenance],
      ['sweep points capped at the ceiling', 0, ''],
      ...cdFigures,
      ...keyRows(five, keyWs.ballastK),
    ];
    expectFigures(setupFigures(twoStroke, { ...grids, key: five }, p, sweepWith([0, 0, 0], 3), keyWs), want);
  });

  it('a CD unit on a four-stroke: its energy starts to fall at rpm = 120 / (cylinders x recharge time)', () => {
    // 2 ms recharge on a four-cylinder four-stroke: 120 / (4 x 2 ms) = 15,000 rpm.
    const { grids, p } = prepared(fourCylinder, moduleSetup(cdModule()));
    const want: Row[] = [
      ['coil secondary ceiling (insulation rating)', p.ceilingV / 1000, 'kV', p.ceilingProvenance],
      ['sweep points capped at the ceiling', 0, ''],
      ...cdRows(p, fourCylinder),
      ...keyRows(grids.key, null),
    ];
    expect(want[3]![1]).toBeCloseTo(15_000, 6);
    expectFigures(setupFigures(fourCylinder, grids, p, sweepWith([0], 1), createWorkspace(4)), want);
  });
});

describe('spark energy at a point', () => {
  const arcV = 700;
  it('is nothing where no voltage reaches the plug, whatever the primary carried', () => {
    const pts = prepared(fourCylinder, pointsSetup()).p;
    const cd = prepared(fourCylinder, moduleSetup(cdModule())).p;
    const ws = createWorkspace(2);
    // Point 0: no available voltage; point 1: 20 kV available. Both with 5 A at break, 1 ms of spark
    // and a CD charge of 400 V.
    ws.availableV.set([0, 20_000]);
    ws.currentA.set([5, 5]);
    ws.durationS.set([1e-3, 1e-3]);
    ws.cdChargeV.set([400, 400]);
    expect(sparkEnergyAt(pts, ws, 0)).toBe(0);
    expect(sparkEnergyAt(cd, ws, 0)).toBe(0);
    // With voltage: the inductive discharge, I0 = eta x 5 A / n, (V_a / Rs)(Ls I0 - V_a T) capped at 0.5 Ls I0^2.
    const i0 = (pts.eta * 5) / pts.n;
    const stored = 0.5 * pts.secondaryInductanceH * i0 * i0;
    const delivered = (pts.arcV / pts.secondaryResistanceOhm) * (pts.secondaryInductanceH * i0 - pts.arcV * 1e-3);
    expect(pts.arcV).toBe(arcV);
    expect(sparkEnergyAt(pts, ws, 1)).toBeCloseTo(Math.min(stored, delivered), 12);
    expect(sparkEnergyAt(pts, ws, 1)).toBeGreaterThan(0);
    // CD: the capacitor swings from V to 2 V_a - V through a counter-voltage V_a = V_arc / n:
    // charge 2 C (V - V_a) through V_a, times the efficiency (cd.ts's stated model).
    expect(cd.arcV).toBe(arcV);
    const va = arcV / cd.n;
    expect(sparkEnergyAt(cd, ws, 1)).toBeCloseTo(cd.eta * va * 2 * cd.cd!.capacitorF * (400 - va), 12);
  });
});

describe('report inputs: each part value with its unit and provenance', () => {
  it('lists the coil, the coupling of a CD coil, the ballast from the condition, and the leads', () => {
    const setup = moduleSetup(cdModule(), {
      coil: coil({ couplingK: 0.99 }),
      ballast: ironBallast(),
      leads: { name: 'Copper', core: 'copper', resistancePerLeadOhm: 2, resistanceProvenance: 'measured' },
    });
    const r = checkSetup(fourCylinder, setup, { ballastThermalResistanceKPerW: { value: 11, provenance: 'engine override' } }, OPTIONS);
    expect(r.inputs).toContainEqual({ name: 'coil primary resistance at 20 degC', value: 3, unit: 'ohm', provenance: 'catalogue' });
    expect(r.inputs).toContainEqual({ name: 'coil coupling coefficient', value: 0.99, unit: '', provenance: 'catalogue' });
    expect(r.inputs).toContainEqual({ name: 'ballast resistance at 20 degC', value: 1.5, unit: 'ohm', provenance: 'catalogue' });
    expect(r.inputs).toContainEqual({ name: 'ballast thermal resistance', value: 11, unit: 'K/W', provenance: 'engine override' });
    expect(r.inputs).toContainEqual({ name: 'HT lead resistance', value: 2, unit: 'ohm', provenance: 'measured' });
  });
  it('takes a ballast\'s own thermal resistance as catalogue', () => {
    const r = checkSetup(fourCylinder, pointsSetup({ coil: ballastCoil(), ballast: ironBallast({ thermalResistanceKPerW: 6 }) }), undefined, OPTIONS);
    expect(r.inputs).toContainEqual({ name: 'ballast thermal resistance', value: 6, unit: 'K/W', provenance: 'catalogue' });
    expect(r.inputs).toContainEqual({ name: 'ballast resistance at 20 degC', value: 1.5, unit: 'ohm', provenance: 'catalogue' });
  });
});

describe('report points', () => {
  it('give the reserve as available minus required, and no CD charge on an inductive setup', () => {
    const r = checkSetup(fourCylinder, pointsSetup(), undefined, OPTIONS);
    for (const pt of [...r.points, ...Object.values(r.keyPoints)]) {
      expect(pt.requiredV).toBeGreaterThan(0);
      expect(pt.reserveV).toBe(pt.availableV - pt.requiredV);
      expect(pt.cdChargeVoltageV).toBeNull();
    }
  });

  it('flag a point as capped only where the circuit would go above the coil\'s rating', () => {
    // A 250 V primary clamp on a 100:1 coil holds the secondary at 100 x 250 V = 25 kV. Rated at
    // 25 kV, the rating takes nothing off: no point is capped. Rated at 24 kV, every clamped point is.
    const clamped = (ratedV: number): SetupReport =>
      checkSetup(fourCylinder, moduleSetup(module({ primaryClampV: 250 }), { coil: coil({ ratedSecondaryV: ratedV }) }), undefined, OPTIONS);
    const at = clamped(25_000);
    const held = at.points.filter((pt) => pt.availableBeforeCeilingV === 100 * 250);
    expect(held.length).toBeGreaterThan(2);
    expect(at.points.some((pt) => pt.availableBeforeCeilingV < 25_000)).toBe(true);
    expect(at.points.every((pt) => !pt.cappedAtCeiling)).toBe(true);
    expect(at.figures.find((f) => f.name === 'sweep points capped at the ceiling')?.value).toBe(0);
    const over = clamped(24_000);
    const above = over.points.filter((pt) => pt.availableBeforeCeilingV > 24_000).length;
    expect(above).toBeGreaterThanOrEqual(held.length);
    expect(above).toBeLessThan(over.points.length);
    for (const pt of over.points) expect(pt.cappedAtCeiling).toBe(pt.availableBeforeCeilingV > 24_000);
    expect(over.figures.find((f) => f.name === 'sweep points capped at the ceiling')?.value).toBe(above);
  });

  it('say why there is no spark in the words for the supply case: cranking, below the dynamo cut-in, running', () => {
    // A module needing 15 V never switches on a 14 V system; a dynamo car idles at 800 rpm, below
    // its cut-in (about 1,100 rpm, from memory), on the battery at rest (12.4 V, common practice).
    const dynamo: EngineSpec = { ...fourCylinder, charging: 'dynamo' };
    const r = checkSetup(dynamo, moduleSetup(module({ supplyMinV: 15 })), undefined, OPTIONS);
    const cases = { cranking: 0, resting: 0, running: 0 };
    for (const pt of r.points) {
      expect(pt.noSparkReason).not.toBeNull();
      if (pt.supplyCase === 'cranking') {
        cases.cranking++;
        expect(pt.noSparkReason).toMatch(/^No spark while cranking: the module sees [\d.]+ V, below the 15\.00 V/);
      } else if (pt.rpm < 1100) {
        cases.resting++;
        expect(pt.noSparkReason).toMatch(/^No spark below the dynamo's cut-in: the module sees [\d.]+ V, below the 15\.00 V/);
      } else {
        cases.running++;
        expect(pt.noSparkReason).toMatch(/^No spark while running: the module sees [\d.]+ V, below the 15\.00 V/);
      }
    }
    expect(cases.cranking).toBeGreaterThan(0);
    expect(cases.resting).toBeGreaterThan(0);
    expect(cases.running).toBeGreaterThan(0);
  });
});

describe('below-margin rpm', () => {
  it('is the first rpm at or above idle whose reserve is under the 1.25 margin (common practice), and null when none is', () => {
    const weak = checkSetup(fourCylinder, pointsSetup({ coil: coil({ turnsRatio: 35 }) }), undefined, OPTIONS);
    const first = weak.points.find((pt) => pt.rpm >= fourCylinder.idleRpm && pt.reserveRatio < 1.25);
    expect(first).toBeDefined();
    expect(weak.belowMarginFromRpm).toBe(first!.rpm);
    const sound = checkSetup(fourCylinder, pointsSetup(), undefined, OPTIONS);
    expect(sound.points.every((pt) => pt.rpm < fourCylinder.idleRpm || pt.reserveRatio >= 1.25)).toBe(true);
    expect(sound.belowMarginFromRpm).toBeNull();
  });
});

describe('circuit at an rpm: linear between the sweep points around it, the cranking point at or below cranking speed', () => {
  // Four points with values that are not linear in rpm, so any wrong pair or weight shows.
  const base = checkSetup(fourCylinder, moduleSetup(cdModule()), undefined, OPTIONS);
  const pt = (rpm: number, supplyV: number, dwellTimeS: number, availableV: number, cdChargeVoltageV: number): OperatingPoint => ({
    ...base.points[1]!, rpm, supplyV, dwellTimeS, availableV, cdChargeVoltageV, currentAtBreakA: supplyV / 2,
  });
  const report: SetupReport = {
    ...base,
    points: [pt(180, 9.5, 1e-3, 18_000, 300), pt(800, 14, 4e-3, 30_000, 400), pt(1600, 13.8, 3e-3, 27_000, 390), pt(2400, 13.2, 2.6e-3, 25_500, 350)],
  };
  const lerp = (x: number, y: number, t: number): number => x + (y - x) * t;
  const expectAt = (rpm: number, supplyV: number, dwellS: number, availableV: number, chargeV: number): void => {
    const c = circuitAtRpm(report, rpm);
    expect(c.rpm).toBe(rpm);
    expect(c.supplyV).toBeCloseTo(supplyV, 12);
    expect(c.currentAtBreakA).toBeCloseTo(supplyV / 2, 12);
    expect(c.dwellTimeS).toBeCloseTo(dwellS, 15);
    expect(c.availablePeakV).toBeCloseTo(availableV, 8);
    expect(c.cd?.chargeVoltageV).toBeCloseTo(chargeV, 9);
    expect(c.cd?.peakV).toBeCloseTo(availableV, 8);
  };
  it('takes the cranking point below and at cranking speed', () => {
    expectAt(100, 9.5, 1e-3, 18_000, 300);
    expectAt(180, 9.5, 1e-3, 18_000, 300);
  });
  it('takes the first running point between cranking speed and it (no mixing of the two supplies), and at it', () => {
    expectAt(500, 14, 4e-3, 30_000, 400);
    expectAt(800, 14, 4e-3, 30_000, 400);
  });
  it('interpolates linearly between the two running points around the rpm', () => {
    // 2000 rpm is half-way from 1600 to 2400; 1000 rpm a quarter of the way from 800 to 1600.
    expectAt(2000, lerp(13.8, 13.2, 0.5), lerp(3e-3, 2.6e-3, 0.5), lerp(27_000, 25_500, 0.5), lerp(390, 350, 0.5));
    expectAt(1000, lerp(14, 13.8, 0.25), lerp(4e-3, 3e-3, 0.25), lerp(30_000, 27_000, 0.25), lerp(400, 390, 0.25));
  });
  it('holds the last point above the sweep (no extrapolation)', () => {
    expectAt(5000, 13.2, 2.6e-3, 25_500, 350);
  });
  it('gives a one-point report\'s point at any rpm', () => {
    const one: SetupReport = { ...report, points: [report.points[2]!] };
    for (const rpm of [100, 1600, 3000]) {
      const c = circuitAtRpm(one, rpm);
      expect(c.supplyV).toBe(13.8);
      expect(c.cd?.chargeVoltageV).toBe(390);
    }
  });
});
