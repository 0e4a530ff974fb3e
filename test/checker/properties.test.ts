/**
 * Laws as properties (fast-check, 10 000 runs each; the seed is printed on failure).
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { airBreakdownV, chargeCurrentA, checkSetup, finalCurrentA, IRON_RESISTIVITY_TABLE, ironBallastResistanceOhm, paschenBreakdownFromReducedV, reducedGapCm, type EngineSpec, type ModuleSpec, type SetupReport, type SetupSpec, type SwitchingKind } from '../../electron/checker/index.js';
import { coil, fourCylinder, ironBallast, module, pointsSetup } from './fixtures.js';

const RUNS = 10_000;
// FC_SEED replays a failing run exactly (the seed is printed on failure). On CI (CI=true) the runs
// use one fixed seed unless FC_SEED says otherwise, so a landing run is reproducible; a developer's
// run draws a fresh seed each time and so keeps exploring new cases.
const CI_SEED = 20261201;
const seedText = process.env.FC_SEED ?? (process.env.CI === 'true' ? String(CI_SEED) : undefined);
const replaySeed = seedText === undefined ? {} : { seed: Number(seedText) };
const params = (numRuns = RUNS): fc.Parameters<unknown> => ({ numRuns, verbose: 1, ...replaySeed });

/** Assert with fast-check and print the seed and counterexample on failure. */
function check<T>(prop: fc.IProperty<T>, numRuns = RUNS): void {
  const out = fc.check(prop, params(numRuns) as fc.Parameters<T>);
  if (out.failed) {
    console.error(`property failed: seed ${out.seed}`, JSON.stringify(out.counterexample), String(out.errorInstance));
  }
  expect(out.failed, `seed ${out.seed}: ${String(out.errorInstance)}`).toBe(false);
}

const pos = (min: number, max: number) => fc.double({ min, max, noNaN: true, noDefaultInfinity: true });

const engineArb: fc.Arbitrary<EngineSpec> = fc
  .record({
    cylinders: fc.integer({ min: 1, max: 16 }),
    two: fc.boolean(),
    boreMm: pos(30, 200),
    strokeMm: pos(30, 250),
    rodFactor: pos(1.05, 5),
    cr: pos(1.5, 25),
    idle: pos(300, 2000),
    crankFrac: pos(0.05, 0.95),
    redFactor: pos(1.2, 12),
    six: fc.boolean(),
    posEarth: fc.boolean(),
    dwellFrac: pos(0.05, 0.95),
    float: fc.option(pos(500, 20000), { nil: null }),
    staticDeg: pos(-10, 40),
    adv: fc.array(pos(-10, 60), { maxLength: 5 }),
  })
  .map((r) => ({
    name: 'random',
    cylinders: r.cylinders,
    cycle: r.two ? 'two-stroke' : 'four-stroke',
    boreM: r.boreMm / 1000,
    strokeM: r.strokeMm / 1000,
    conRodM: (r.strokeMm / 2000) * r.rodFactor,
    compressionRatio: r.cr,
    idleRpm: r.idle,
    crankingRpm: Math.min(1000, r.idle * r.crankFrac),
    redlineRpm: Math.min(20000, r.idle * r.redFactor),
    systemVoltageV: r.six ? 6 : 12,
    earthPolarity: r.posEarth ? 'positive' : 'negative',
    pointsDwellDeg: (360 / r.cylinders) * r.dwellFrac,
    pointsFloatRpm: r.float,
    staticTimingDegBtdc: r.staticDeg,
    advanceCurve: r.adv.map((a, i) => ({ rpm: 500 + i * 1000, advanceDeg: a })),
  }));

const kinds: SwitchingKind[] = ['points', 'magneto', 'transistor-points', 'breakerless-fixed-duty', 'breakerless-current-limited', 'capacitive-discharge'];

const setupArb: fc.Arbitrary<SetupSpec> = fc
  .record({
    kind: fc.constantFrom(...kinds),
    r20: pos(0.1, 20),
    lp: pos(1e-4, 0.1),
    rs: pos(1, 50000),
    n: fc.option(pos(10, 400), { nil: null }),
    ls: pos(0.01, 1000),
    ballast: fc.option(fc.record({ r: pos(0.1, 10), type: fc.constantFrom('iron-wire' as const, 'ceramic' as const, 'harness-wire' as const), theta: fc.option(pos(0.1, 200), { nil: null }) }), { nil: null }),
    bypass: fc.boolean(),
    after: fc.boolean(),
    clamp: fc.option(pos(10, 1000), { nil: null }),
    limit: pos(0.5, 30),
    duty: pos(0.05, 0.95),
    cdC: pos(0.1e-6, 10e-6),
    cdV: pos(50, 1000),
    cdP: pos(1, 500),
    supplyMin: pos(1, 12),
    sat: pos(0, 5),
    condenser: fc.option(pos(0.01e-6, 2e-6), { nil: null }),
    gap: pos(0.1e-3, 3e-3),
    magA: pos(0.1, 10),
    magRpm: pos(100, 10000),
    reversed: fc.boolean(),
  })
  .map((r) => {
    const m: ModuleSpec | null =
      r.kind === 'points' || r.kind === 'magneto'
        ? null
        : module({
            moduleType: r.kind,
            currentLimitA: r.kind === 'breakerless-current-limited' ? r.limit : null,
            maxDutyFraction: r.duty,
            fixedDutyFraction: r.duty,
            primaryClampV: r.clamp,
            supplyMinV: r.supplyMin,
            switchSaturationV: r.sat,
            cd: r.kind === 'capacitive-discharge' ? { capacitorF: r.cdC, chargeVoltageV: r.cdV, chargerPowerW: r.cdP, multiSparkBelowRpm: 3000 } : null,
          });
    return pointsSetup({
      switching: r.kind,
      coil: coil({ primaryResistanceOhm20C: { value: r.r20, provenance: 'catalogue' }, primaryInductanceH: r.lp, secondaryResistanceOhm: r.rs, turnsRatio: r.n, secondaryInductanceH: r.n === null ? r.ls : null }),
      ballast: r.ballast ? ironBallast({ ballastType: r.ballast.type, coldResistanceOhm: { value: r.ballast.r, provenance: 'catalogue' }, thermalResistanceKPerW: r.ballast.theta }) : null,
      crankingBypass: r.bypass,
      moduleFeed: r.after ? 'after-ballast' : 'switched-15',
      module: m,
      condenserF: r.condenser,
      plugGapM: r.gap,
      magneto: { ratedCurrentA: r.magA, fullOutputRpm: r.magRpm },
      coilWiring: r.reversed ? 'reversed' : 'as-marked-for-earth',
    });
  });

/** Every number anywhere in a value is finite. */
function allFinite(v: unknown, path = ''): string | null {
  if (typeof v === 'number') return Number.isFinite(v) ? null : path;
  if (Array.isArray(v)) {
    for (let i = 0; i < v.length; i++) {
      const bad = allFinite(v[i], `${path}[${i}]`);
      if (bad) return bad;
    }
    return null;
  }
  if (v && typeof v === 'object') {
    for (const [k, x] of Object.entries(v)) {
      const bad = allFinite(x, `${path}.${k}`);
      if (bad) return bad;
    }
  }
  return null;
}

/**
 * Where "never less current for a higher supply" is a law of a self-heated iron ballast.
 * Iron's resistivity rises faster than T (k = d ln rho / d ln T is about 1.7 near 450 K), so a
 * self-heated iron ballast can act as a barretter. At a stable equilibrium of
 * T = T_amb + theta I^2 R(T) with I = V / (R_rest + R(T)), differentiating gives
 * d ln I / d ln V = (1 - k h) / (1 - k h (1 - 2w)), with h = (T - T_amb) / T and
 * w = R / (R_rest + R); the denominator is positive wherever the equilibrium is stable, so the
 * current falls with supply exactly where k h > 1: a wire glowing at more than about 2.4 times its
 * ambient in kelvin. The law is stated where the rest of the circuit is at least the hot ballast
 * and k h stays under 0.9 (room for the idle waveform's shape) at EVERY temperature the ballast
 * passes through between the two supplies, which is how real ballasts are used. Within one row
 * of the resistivity table rho = c + b T, so k h = b (T - T_amb) / (c + b T) is monotone and its
 * largest value on an interval is at an end or at a table row (taken with the slope on each side,
 * never a difference straddling the kink).
 */
const UNDER_BONNET_K = 80 + 273.15; // the under-bonnet default (common practice), not overridden here
function khOnSide(tK: number, slopeSide: -1 | 1): number {
  const dt = 1e-3 * slopeSide;
  const rho = ironBallastResistanceOhm(1, tK);
  const k = ((ironBallastResistanceOhm(1, tK + dt) - rho) / dt) * (tK / rho);
  return (k * (tK - UNDER_BONNET_K)) / tK;
}
function belowPlateauBetween(t1K: number, t2K: number): boolean {
  const a = Math.min(t1K, t2K);
  const b = Math.max(t1K, t2K);
  const at = [a, b, ...IRON_RESISTIVITY_TABLE.map((row) => row[0]).filter((t) => t > a && t < b)];
  return at.every((t) => (t > a ? khOnSide(t, -1) : 0) < 0.9 && (t < b ? khOnSide(t, 1) : 0) < 0.9);
}
function supplyLawApplies(s: SetupSpec, lo: SetupReport, hi: SetupReport): boolean {
  if (s.ballast === null || s.ballast.ballastType !== 'iron-wire') return true;
  const rest = (r: SetupReport): number => r.circuit.primaryResistanceHotOhm - r.circuit.ballastResistanceHotOhm;
  if (!(hi.circuit.ballastResistanceHotOhm <= rest(hi) && lo.circuit.ballastResistanceHotOhm <= rest(lo))) return false;
  if (!belowPlateauBetween(lo.circuit.ballastTemperatureHotK, hi.circuit.ballastTemperatureHotK)) return false;
  return lo.points.every((p, i) => {
    if (p.supplyCase === 'cranking') return true;
    const q = hi.points[i]!;
    return belowPlateauBetween(p.ballastTemperatureK!, q.ballastTemperatureK!) && p.primaryResistanceOhm - rest(lo) <= rest(lo) && q.primaryResistanceOhm - rest(hi) <= rest(hi);
  });
}

describe('laws of the checker (fast-check)', () => {
  it('gives only finite outputs for every valid engine and setup', () => {
    check(
      fc.property(engineArb, setupArb, fc.integer({ min: 3, max: 24 }), fc.boolean(), (e, s, n, paschen) => {
        const r = checkSetup(e, s, undefined, { rpmPoints: n, breakdownModel: paschen ? 'paschen' : 'empirical-air' });
        const bad = allFinite(r);
        if (bad) throw new Error(`not finite at ${bad}`);
        return r.points.length === n && r.rules.length > 0;
      }),
    );
  });

  it('never gives a current above V/R', () => {
    check(
      fc.property(pos(0, 20), pos(0, 5), pos(0.01, 30), pos(1e-5, 0.1), pos(0, 0.1), (v, sw, r, l, t) => {
        const iF = finalCurrentA(v, sw, r);
        const i = chargeCurrentA(iF, l / r, t);
        return iF <= v / r + 1e-12 && i <= iF + 1e-12 && i >= 0;
      }),
    );
  });

  it('never raises the stored energy with rpm at a fixed dwell angle (points, running supply)', () => {
    check(
      fc.property(engineArb, setupArb, (e, s) => {
        const r = checkSetup({ ...e, pointsFloatRpm: null }, { ...s, switching: 'points', module: null, ballast: null }, undefined, { rpmPoints: 12, skipGapSuggestion: true });
        const run = r.points.slice(1);
        for (let i = 1; i < run.length; i++) if (run[i]!.storedEnergyJ > run[i - 1]!.storedEnergyJ * (1 + 1e-9) + 1e-15) return false;
        return true;
      }),
    );
  });

  it('never needs less voltage for a wider gap', () => {
    check(
      fc.property(pos(0.05e-3, 3e-3), pos(0, 3e-3), pos(1e4, 5e6), pos(250, 1500), (g, dg, p, t) => {
        const a = airBreakdownV(reducedGapCm(g, p, t));
        const b = airBreakdownV(reducedGapCm(g + dg, p, t));
        const pa = paschenBreakdownFromReducedV(reducedGapCm(g, p, t));
        const pb = paschenBreakdownFromReducedV(reducedGapCm(g + dg, p, t));
        return b >= a - 1e-9 && pb >= pa - 1e-9;
      }),
    );
  });

  it('never gives less current for a higher supply', () => {
    check(
      fc.property(engineArb, setupArb, pos(6, 16), pos(0, 4), (e, s, v, dv) => {
        const opts = { rpmPoints: 8, skipGapSuggestion: true };
        const lo = checkSetup(e, s, { runningSupplyV: { value: v, provenance: 'measured' }, crankingSupplyV: { value: v * 0.7, provenance: 'measured' } }, opts);
        const hi = checkSetup(e, s, { runningSupplyV: { value: v + dv, provenance: 'measured' }, crankingSupplyV: { value: (v + dv) * 0.7, provenance: 'measured' } }, opts);
        // The law holds only where k h < 1 all the way from the lower supply's equilibrium to the
        // higher one, not just at the two ends: the current is the integral of d ln I over the
        // path, and a stretch above the plateau between them can outweigh the ends (seed 926856145,
        // below). The ballast's temperature rises with the supply at a stable equilibrium, so the
        // path is every temperature between the two answers at the same rpm.
        fc.pre(supplyLawApplies(s, lo, hi));
        // Final current, and current at break for every inductive point.
        // Tolerance: the ballast temperature is settled to about 1e-4 K (ballast.ts), a few parts in
        // 10^7 of the current; allow 1 ppm.
        const below = (a: number, b: number): boolean => a < b * (1 - 1e-6) - 1e-12;
        if (below(hi.circuit.finalCurrentRunningA, lo.circuit.finalCurrentRunningA)) return false;
        for (let i = 0; i < lo.points.length; i++) if (below(hi.points[i]!.currentAtBreakA, lo.points[i]!.currentAtBreakA)) return false;
        return true;
      }),
    );
  });
});

/**
 * Seed 926856145, kept as a fixed case: a one-cylinder engine whose iron ballast reaches about
 * 827 degC at 12.44 V. The current really does fall from 8.44 V to 12.44 V in the model: between
 * the two answers the wire passes through 700 to 1000 K, where k h > 1 (above), so the property's
 * old precondition, which looked only at the two ends, let a case outside the law through. The
 * checker's answers are worked out again here by hand from the energy balance
 * T = T_amb + theta <i^2> R(T) (Incropera & DeWitt, ch. 1 and 3), the copper law (IACS,
 * 0.00393 /K), Ohm's law and the RL charge, so the case also shows the solver settles on the one
 * stable equilibrium there is (no fold point: g(T) changes sign once).
 */
describe('seed 926856145 (iron ballast on the barretter plateau), a fixed case', () => {
  const engine: EngineSpec = { name: 'random', cylinders: 1, cycle: 'four-stroke', boreM: 0.03, strokeM: 0.03, conRodM: 0.01575, compressionRatio: 1.5, idleRpm: 300, crankingRpm: 15, redlineRpm: 360, systemVoltageV: 12, earthPolarity: 'negative', pointsDwellDeg: 179.5667758897308, pointsFloatRpm: null, staticTimingDegBtdc: 0, advanceCurve: [] };
  const r20 = 0.8325963667334321;
  const lp = 0.0001;
  const ballastCold = 0.10538108835291199;
  const theta = 43.71803190412381;
  const setup = pointsSetup({
    switching: 'transistor-points',
    coil: coil({ primaryResistanceOhm20C: { value: r20, provenance: 'catalogue' }, primaryInductanceH: lp, secondaryResistanceOhm: 1, turnsRatio: null, secondaryInductanceH: 0.01 }),
    ballast: ironBallast({ coldResistanceOhm: { value: ballastCold, provenance: 'catalogue' }, thermalResistanceKPerW: theta }),
    module: module({ moduleType: 'transistor-points', currentLimitA: null, maxDutyFraction: 0.05, fixedDutyFraction: 0.05, primaryClampV: null, supplyMinV: 1, switchSaturationV: 0, cd: null }),
    condenserF: null,
    plugGapM: 0.0001,
  });
  const vLo = 8.439148942214162;
  const vHi = vLo + 3.9999999999999973;
  const at = (v: number): SetupReport => checkSetup(engine, setup, { runningSupplyV: { value: v, provenance: 'measured' }, crankingSupplyV: { value: v * 0.7, provenance: 'measured' } }, { rpmPoints: 8, skipGapSuggestion: true });

  // Iron resistivity, micro-ohm cm against K: the remembered handbook rows the checker also uses
  // (from memory; 300 to 600 K as in the design note), copied so a changed row shows here.
  const rows: Array<[number, number]> = [[293, 9.61], [300, 9.98], [400, 16.1], [500, 23.7], [600, 32.9], [700, 44.0], [800, 57.1], [900, 72.4], [1000, 87.0], [1100, 103.0], [1200, 112.0]];
  const rho = (t: number): number => {
    let i = 1;
    while (i < rows.length - 1 && t > rows[i]![0]) i++;
    const [t0, r0] = rows[i - 1]!;
    const [t1, r1] = rows[i]!;
    return r0 + ((r1 - r0) * (t - t0)) / (t1 - t0);
  };
  const ambientK = 80 + 273.15; // under-bonnet default, 80 degC (common practice)
  const ballastAt = (t: number): number => (ballastCold * rho(t)) / rho(293.15);
  // Coil at 80 degC by the copper law, plus the 0.1 ohm harness default (from memory); a transistor has no contact resistance.
  const rest = r20 * (1 + 0.00393 * (80 - 20)) + 0.1;
  // Spark rate rpm x cylinders / 120 (four-stroke): 2.5 /s at 300 rpm, a 0.4 s period; cam dwell fraction deg x cyl / 360.
  const period = 120 / (300 * 1);
  const dwell = ((179.5667758897308 * 1) / 360) * period;
  /** g(T) = T_amb + theta <i^2> R_b(T) - T, with <i^2> of the RL charge over the dwell. */
  const g = (v: number, t: number): number => {
    const rb = ballastAt(t);
    const iF = v / (rest + rb);
    const tau = lp / (rest + rb);
    const integral = iF * iF * (dwell - 2 * tau * (1 - Math.exp(-dwell / tau)) + 0.5 * tau * (1 - Math.exp((-2 * dwell) / tau)));
    return ambientK + theta * (integral / period) * rb - t;
  };
  /** Every equilibrium between the surroundings and 1500 K above, by a 0.5 K scan and bisection. */
  const equilibria = (v: number): number[] => {
    const roots: number[] = [];
    for (let t = ambientK; t < ambientK + 1500; t += 0.5) {
      if (g(v, t) > 0 && g(v, t + 0.5) <= 0) {
        let a = t;
        let b = t + 0.5;
        for (let k = 0; k < 60; k++) {
          const m = 0.5 * (a + b);
          if (g(v, m) > 0) a = m;
          else b = m;
        }
        roots.push(0.5 * (a + b));
      } else if (g(v, t) <= 0 && g(v, t + 0.5) > 0) roots.push(Number.NaN); // an unstable crossing
    }
    return roots;
  };

  it('has one stable equilibrium at each supply, and the checker settles on it (no fold point)', () => {
    for (const v of [vLo, vHi]) {
      const roots = equilibria(v);
      expect(roots.length, `equilibria at ${v} V`).toBe(1);
      const r = at(v);
      expect(Math.abs(r.circuit.ballastTemperatureHotK - roots[0]!), `ballast temperature at ${v} V`).toBeLessThan(1e-3);
      // Ohm's law at that temperature.
      expect(r.circuit.finalCurrentRunningA / (v / (rest + ballastAt(roots[0]!)))).toBeCloseTo(1, 6);
    }
    // The higher supply's wire sits at about 827 degC, where its resistance about equals the rest of the circuit.
    const hot = equilibria(vHi)[0]!;
    expect(hot - 273.15).toBeGreaterThan(820);
    expect(hot - 273.15).toBeLessThan(835);
    expect(ballastAt(hot) / rest).toBeCloseTo(1, 2);
  });

  it('gives less current at the higher supply, as the energy balance does, and the law\'s precondition now leaves it out', () => {
    const iLo = vLo / (rest + ballastAt(equilibria(vLo)[0]!));
    const iHi = vHi / (rest + ballastAt(equilibria(vHi)[0]!));
    expect(iHi).toBeLessThan(iLo);
    const lo = at(vLo);
    const hi = at(vHi);
    expect(hi.circuit.finalCurrentRunningA).toBeLessThan(lo.circuit.finalCurrentRunningA);
    expect(hi.circuit.finalCurrentRunningA / iHi).toBeCloseTo(1, 6);
    // On the way from 609 K to 1100 K the wire passes 800 K, where k h is over 1 by the table rows:
    // k = (57.1 - 44.0) / 100 x 800 / 57.1 = 1.835, h = (800 - 353.15) / 800 = 0.559.
    expect((((57.1 - 44.0) / 100) * 800) / 57.1 * ((800 - ambientK) / 800)).toBeGreaterThan(1);
    expect(supplyLawApplies(setup, lo, hi)).toBe(false);
  });
});

void fourCylinder;
