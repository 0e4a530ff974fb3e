/**
 * prepareSetup (prepare.ts): one setup on one engine resolved into the circuit numbers the sweep
 * needs, each field held to the law or the documented default it stands for. Written against the
 * mutation-testing survivors (npm run mutate).
 *
 * Sources, each named again beside its check:
 * - the copper law R(T) = R20 (1 + 0.00393 (T - 20 degC)), annealed copper at 20 degC (IACS; the
 *   coefficient primary.ts states);
 * - Ohm's law, the final current I_f = (V - V_switch) / R, and the series sum of resistances;
 * - the RL step i = I_f (1 - e^(-t/tau)), tau = L / R, and the mean square of a current, (1/T) times
 *   the integral of i^2, which for the ramp is
 *   td - 2 tau (1 - e^(-td/tau)) + (tau/2)(1 - e^(-2 td/tau)) times I_f^2 (any circuits text);
 * - the steady-state energy balance of a self-heated resistor, T = T_amb + theta P (Incropera &
 *   DeWitt, Fundamentals of Heat and Mass Transfer, ch. 1 and 3), closed-form for a ceramic
 *   ballast whose resistance does not move with temperature;
 * - spark rate = rpm x cylinders / 120 on a four-stroke; dwell fraction = dwell angle x cylinders / 360;
 * - a supply V through a feed R to a load of constant power P: V_m = V - R P / V_m, the larger root
 *   (V + sqrt(V^2 - 4 R P)) / 2 of the quadratic;
 * - charge sharing between C and the reflected n^2 Cs, V_cm = C V / (C + n^2 Cs), the overshoot of a
 *   series RLC step exp(-pi zeta / sqrt(1 - zeta^2)), zeta = (R/2) sqrt(C_ser / L), and its peak
 *   time pi / (omega_0 sqrt(1 - zeta^2)) (Ogata, Modern Control Engineering, second-order step
 *   response); the leakage inductance 2 (1 - k) Lp of coupled coils (cd.ts's stated law);
 * - the reflected condenser C/n^2 in the secondary, and the first peak of an underdamped parallel
 *   RLC, I0 sqrt(L/C) e^(-alpha t*), alpha = 1/(2RC), t* = atan(omega_d / alpha) / omega_d
 *   (Alexander & Sadiku, Fundamentals of Electric Circuits, ch. 8);
 * - the product's documented defaults (conditions.ts `defaultConditions` and
 *   `secondaryCeilingDefaultV`, `DEFAULT_COUPLING_K`), thresholds and issue sentences (prepare.ts),
 *   the reversed-polarity factor 1/0.9 (breakdown.ts), and 0 degC = 273.15 K.
 */
import { describe, expect, it } from 'vitest';
import { resolveConditions } from '../../electron/checker/conditions.js';
import { prepareSetup, type PreparedSetup } from '../../electron/checker/prepare.js';
import type { BallastSpec, ConditionInputs, EngineSpec, ModuleSpec, SetupSpec } from '../../electron/checker/index.js';
import { ballastCoil, catalogue, cdModule, coil, fourCylinder, module, moduleSetup, pointsSetup } from './fixtures.js';

// ---------------------------------------------------------------- the laws, worked here

/** Copper law, alpha = 0.00393 /K (IACS annealed copper at 20 degC, primary.ts). */
const cu = (r20: number, tC: number): number => r20 * (1 + 0.00393 * (tC - 20));
const K = (c: number): number => c + 273.15;
/** Integral over [0, t] of (1 - e^(-u/tau))^2 du. */
const rampSquare = (t: number, tau: number): number => t - 2 * tau * (1 - Math.exp(-t / tau)) + (tau / 2) * (1 - Math.exp((-2 * t) / tau));
/** The larger root of V_m^2 - V V_m + R P = 0. */
const underPowerLoad = (v: number, r: number, p: number): number => (v + Math.sqrt(v * v - 4 * r * p)) / 2;

function close(got: number, want: number, rel = 1e-9, what = ''): void {
  if (!(Math.abs(got - want) <= rel * Math.max(1, Math.abs(want)))) expect.fail(`${what}: ${got}, expected ${want}`);
}

const measured = (value: number) => ({ value, provenance: 'measured' as const });
/** Every condition prepare.ts reads, measured (so no default enters unless a test says so). */
function inputs(over: ConditionInputs = {}): ConditionInputs {
  return {
    runningSupplyV: measured(14.2),
    crankingSupplyV: measured(9.3),
    restingBatteryV: measured(12.5),
    harnessResistanceOhm: measured(0.15),
    pointsContactResistanceOhm: measured(0.12),
    ambientC: measured(15),
    underBonnetC: measured(70),
    ballastThermalResistanceKPerW: measured(10),
    dynamoCutInRpm: measured(1100),
    secondaryCapacitanceF: measured(80e-12),
    transferEfficiency: measured(0.75),
    fouledShuntOhm: measured(2e6),
    arcVoltageV: measured(650),
    couplingK: measured(0.99),
    currentLimitHoldS: measured(0.4e-3),
    ...over,
  };
}

const dynamoCar: EngineSpec = { ...fourCylinder, name: 'Dynamo four', charging: 'dynamo', pointsFloatRpm: 5200 };
const alternatorCar: EngineSpec = { ...fourCylinder, name: 'Alternator four', charging: 'alternator', pointsFloatRpm: 5200 };
const ceramic = (cold: number, over: Partial<BallastSpec> = {}): BallastSpec => ({ name: 'Ceramic block', ballastType: 'ceramic', coldResistanceOhm: { value: cold, provenance: catalogue }, thermalResistanceKPerW: null, ...over });
const fixedDutyModule = (over: Partial<ModuleSpec> = {}): ModuleSpec => module({ name: 'Fixed-duty unit', moduleType: 'breakerless-fixed-duty', currentLimitA: null, maxDutyFraction: null, fixedDutyFraction: 0.6, ...over });
const transistorModule = (over: Partial<ModuleSpec> = {}): ModuleSpec => module({ name: 'Transistor unit', moduleType: 'transistor-points', currentLimitA: null, maxDutyFraction: null, primaryClampV: null, ...over });

function prep(engine: EngineSpec, setup: SetupSpec, over: ConditionInputs = {}): PreparedSetup {
  return prepareSetup(engine, setup, resolveConditions(engine, inputs(over)), 'empirical-air');
}
const missing = (what: string, fallback: string): string => `${what} is missing or not a positive number; ${fallback} was assumed.`;

// ---------------------------------------------------------------- resistances, currents, supplies

describe('points behind a ceramic ballast on a dynamo car idling below cut-in', () => {
  // Ballast coil 1.5 ohm / 5 mH, ceramic 1.6 ohm, harness 0.15, contact 0.12, 15 degC air, 70 degC under the bonnet.
  const setup = pointsSetup({ coil: ballastCoil(), ballast: ceramic(1.6) });
  // Prepared inside each test (not when the file loads), so a planted mutant is seen.
  const P = (): PreparedSetup => prep(dynamoCar, setup);
  const coilCold = cu(1.5, 15);
  const coilHot = cu(1.5, 70);
  const rRun = coilHot + 0.15 + 0.12 + 1.6;

  it('copper law hot and cold; series sums running and cold (Ohm)', () => {
    close(P().coilColdOhm, coilCold, 1e-12, 'coil cold');
    close(P().coilHotOhm, coilHot, 1e-12, 'coil hot');
    expect(P().contactOhm).toBe(0.12);
    expect(P().harnessOhm).toBe(0.15);
    close(P().rRunningOhm, rRun, 1e-12, 'running R');
    close(P().rColdOhm, coilCold + 0.15 + 0.12 + 1.6, 1e-12, 'cold R');
    expect(P().ballastHotOhm).toBe(1.6);
    expect(P().ironBallast).toBeNull();
  });

  it('final currents on the running and resting supplies (Ohm, no switch drop with points)', () => {
    expect(P().runningSupplyV).toBe(14.2);
    expect(P().restingSupplyV).toBe(12.5);
    close(P().iFinalRunningA, 14.2 / rRun, 1e-12, 'running I');
    close(P().iFinalRestingA, 12.5 / rRun, 1e-12, 'resting I');
    close(P().tauRunningS, 0.005 / rRun, 1e-12, 'tau');
  });

  it('the ceramic ballast settles at T_amb + theta <i^2> R, charged at idle from the resting battery (below cut-in)', () => {
    // Idle 800 rpm, four cylinders, four-stroke: 800 x 4 / 120 sparks/s; cam dwell 54 deg x 4 / 360 = 0.6.
    const period = 120 / (800 * 4);
    const td = 0.6 * period;
    const iF = 12.5 / rRun; // the resting battery: idle 800 rpm < cut-in 1100 rpm
    const tau = 0.005 / rRun;
    const ms = (iF * iF * rampSquare(td, tau)) / period;
    close(P().ballastHotK, K(70) + 10 * ms * 1.6, 1e-9, 'ballast hot K');
    close(P().ballastColdK, K(15), 1e-12, 'ballast cold K');
  });

  it('the points float rpm is the engine\'s', () => {
    expect(P().floatRpm).toBe(5200);
  });
});

describe('the supply the coil sees at idle', () => {
  const setup = pointsSetup({ coil: ballastCoil(), ballast: ceramic(1.6) });
  const rRun = cu(1.5, 70) + 0.15 + 0.12 + 1.6;
  const hotK = (v: number): number => {
    const period = 120 / (800 * 4);
    const iF = v / rRun;
    return K(70) + 10 * ((iF * iF * rampSquare(0.6 * period, 0.005 / rRun)) / period) * 1.6;
  };
  it('a dynamo at its cut-in speed charges: idle at the cut-in rpm is on the running supply', () => {
    // "A dynamo gives nothing below its cut-in speed" (prepare.ts): at 800 rpm = cut-in it gives.
    close(prep(dynamoCar, setup, { dynamoCutInRpm: measured(800) }).ballastHotK, hotK(14.2), 1e-9, 'at cut-in');
    close(prep(dynamoCar, setup, { dynamoCutInRpm: measured(700) }).ballastHotK, hotK(14.2), 1e-9, 'above cut-in');
    close(prep(dynamoCar, setup, { dynamoCutInRpm: measured(900) }).ballastHotK, hotK(12.5), 1e-9, 'below cut-in');
  });
  it('an alternator car rests on its running supply whatever the resting battery reads', () => {
    const p = prep(alternatorCar, setup);
    expect(p.restingSupplyV).toBe(14.2);
    close(p.ballastHotK, hotK(14.2), 1e-9, 'alternator');
  });
  it('an unusable resting reading falls back to 12.4 V, or 6.2 V on 6 V (conditions.ts: a healthy battery at rest)', () => {
    expect(prep(dynamoCar, setup, { restingBatteryV: measured(-1) }).restingSupplyV).toBe(12.4);
    expect(prep({ ...dynamoCar, systemVoltageV: 6 }, setup, { restingBatteryV: measured(-1) }).restingSupplyV).toBe(6.2);
    // 0 V is a reading (non-negative), kept as it is.
    expect(prep(dynamoCar, setup, { restingBatteryV: measured(0) }).restingSupplyV).toBe(0);
  });
  it('harness: 0 ohm is kept, a negative reading falls back to 0.1 ohm (conditions.ts default, from memory)', () => {
    expect(prep(dynamoCar, setup, { harnessResistanceOhm: measured(0) }).harnessOhm).toBe(0);
    expect(prep(dynamoCar, setup, { harnessResistanceOhm: measured(-1) }).harnessOhm).toBe(0.1);
  });
  it('an engine that does not idle: the period is taken as 1 s and the heating stays finite', () => {
    // rpm 0: no sparks, so prepare.ts takes a 1 s period; cam dwell 0.6 of it.
    const p = prep({ ...alternatorCar, idleRpm: 0 }, setup);
    const iF = 14.2 / rRun;
    close(p.ballastHotK, K(70) + 10 * iF * iF * rampSquare(0.6, 0.005 / rRun) * 1.6, 1e-9, 'idle 0');
  });
});

describe('a magneto', () => {
  const mag = pointsSetup({ switching: 'magneto', magneto: { ratedCurrentA: 4, fullOutputRpm: 1500 }, ballast: ceramic(1.6) });
  // Prepared inside each test (not when the file loads), so a planted mutant is seen.
  const P = (): PreparedSetup => prep(dynamoCar, mag);
  it('has no battery supply and no battery current; its contact is still the points contact', () => {
    expect([P().runningSupplyV, P().crankingSupplyV, P().restingSupplyV, P().iFinalRunningA, P().iFinalRestingA]).toEqual([0, 0, 0, 0, 0]);
    expect(P().contactOhm).toBe(0.12);
    expect(P().floatRpm).toBeNull();
  });
  it('a ballast on a magneto is not heated by the battery: it stays at the surroundings', () => {
    close(P().ballastHotK, K(15), 1e-12, 'magneto ballast');
  });
  it('a magneto without its rating is an issue', () => {
    expect(prep(dynamoCar, pointsSetup({ switching: 'magneto', magneto: null })).issues).toContain('A magneto needs its rated break current and the rpm of full output.');
  });
});

// ---------------------------------------------------------------- modules

describe('a current-limited module behind a ceramic ballast', () => {
  const m = module(); // limit 6 A, max duty 0.8, saturation 1.5 V, clamp 400 V
  const rRun = cu(1.5, 70) + 0.15 + 1.2; // no points contact with a module
  const iRun = (14.2 - 1.5) / rRun;
  const iRest = (12.5 - 1.5) / rRun;
  it('fed after the ballast it loses the harness and ballast drops (Ohm)', () => {
    const p = prep(dynamoCar, moduleSetup(m, { coil: ballastCoil(), ballast: ceramic(1.2), moduleFeed: 'after-ballast' }));
    expect(p.contactOhm).toBe(0);
    close(p.rRunningOhm, rRun, 1e-12, 'R');
    close(p.moduleSupplyRunningV!, 14.2 - (0.15 + 1.2) * iRun, 1e-12, 'module running');
    close(p.moduleSupplyRestingV!, 12.5 - (0.15 + 1.2) * iRest, 1e-12, 'module resting');
    expect(p.floatRpm).toBeNull();
    expect(p.limitA).toBe(6);
  });
  it('fed from terminal 15 it loses only the harness drop', () => {
    const p = prep(dynamoCar, moduleSetup(m, { coil: ballastCoil(), ballast: ceramic(1.2), moduleFeed: 'switched-15' }));
    close(p.moduleSupplyRunningV!, 14.2 - 0.15 * iRun, 1e-12, 'module running');
    close(p.moduleSupplyRestingV!, 12.5 - 0.15 * iRest, 1e-12, 'module resting');
  });
  it('a long feed (40 ohm harness): the same law, V - R_feed I, through the heavy drop', () => {
    const p = prep(dynamoCar, moduleSetup(m, { coil: ballastCoil(), ballast: ceramic(1.2), moduleFeed: 'after-ballast' }), { harnessResistanceOhm: measured(40) });
    const r = cu(1.5, 70) + 41.2;
    close(p.moduleSupplyRunningV!, 14.2 - 41.2 * ((14.2 - 1.5) / r), 1e-12, 'running');
    close(p.moduleSupplyRestingV!, 12.5 - 41.2 * ((12.5 - 1.5) / r), 1e-12, 'resting');
  });
  it('the secondary is capped at the lower of n x clamp and the coil ceiling (30 kV default, conditions.ts)', () => {
    const p = prep(dynamoCar, moduleSetup(m));
    expect(p.clampCapV).toBe(100 * 400);
    expect(p.ceilingV).toBe(30_000);
    expect(p.capV).toBe(30_000);
  });
  it('a missing current limit or maximum duty is an issue each; the limit then falls back to the maximum current', () => {
    const noLimit = prep(dynamoCar, moduleSetup(module({ currentLimitA: null, maxCurrentA: 8 })));
    expect(noLimit.issues).toContain('A current-limited module needs its current limit and maximum duty.');
    expect(noLimit.limitA).toBe(8);
    const noDuty = prep(dynamoCar, moduleSetup(module({ maxDutyFraction: null })));
    expect(noDuty.issues).toContain('A current-limited module needs its current limit and maximum duty.');
    expect(noDuty.maxDuty).toBe(0.8);
    expect(prep(dynamoCar, moduleSetup(module())).issues).toEqual([]);
  });
  it('a clamp of 0 V or below is no clamp', () => {
    expect(prep(dynamoCar, moduleSetup(module({ primaryClampV: 0 }))).clampV).toBeNull();
    expect(prep(dynamoCar, moduleSetup(module({ primaryClampV: -5 }))).clampV).toBeNull();
    expect(prep(dynamoCar, moduleSetup(module({ primaryClampV: 0 }))).clampCapV).toBe(Infinity);
  });
  it('a module of another type than the setup is an issue', () => {
    expect(prep(dynamoCar, moduleSetup(module(), { switching: 'breakerless-fixed-duty' })).issues).toContain(
      'The module chosen is a breakerless-current-limited module, but the setup is described as breakerless-fixed-duty.',
    );
  });
});

describe('other modules', () => {
  it('a fixed-duty module with a current limit of 0 A has no limit; without its duty it is an issue', () => {
    const p = prep(alternatorCar, moduleSetup(fixedDutyModule({ currentLimitA: 0 })));
    expect(p.limitA).toBe(Infinity);
    expect(p.fixedDuty).toBe(0.6);
    const q = prep(alternatorCar, moduleSetup(fixedDutyModule({ fixedDutyFraction: null })));
    expect(q.issues).toContain('A fixed-duty module needs its duty fraction; 0.5 was assumed.');
    expect(q.fixedDuty).toBe(0.5);
    expect(prep(alternatorCar, moduleSetup(fixedDutyModule({ currentLimitA: 5 }))).limitA).toBe(5);
  });
  it('transistor-assisted points keep the points float rpm; an inductive module with a CD stage listed is still linear (Ohm)', () => {
    const m = transistorModule({ cd: { capacitorF: 1e-6, chargeVoltageV: 400, chargerPowerW: 40, multiSparkBelowRpm: null } });
    const p = prep(alternatorCar, moduleSetup(m));
    expect(p.floatRpm).toBe(5200);
    const r = cu(3, 70) + 0.15;
    const i = (14.2 - 1.5) / r;
    close(p.moduleSupplyRunningV!, 14.2 - 0.15 * i, 1e-12, 'transistor module supply');
    close(p.iFinalRunningA, i, 1e-12, 'I');
  });
  it('points with a module chosen: an issue, the module ignored', () => {
    const p = prep(alternatorCar, pointsSetup({ module: module() }));
    expect(p.issues).toContain('Points and magneto setups switch the coil themselves; the module chosen is ignored.');
    expect(p.moduleSupplyRunningV).toBeNull();
  });
});

// ---------------------------------------------------------------- the CD stage

describe('a capacitive-discharge unit', () => {
  // 1 uF, 400 V, 40 W charger; coil 3 ohm, 8 mH, n = 100, Rs 8000 + carbon lead 5000; Cs 80 pF; eta 0.75; k 0.99.
  const lp = 0.008;
  const n = 100;
  const cs = 80e-12;
  const rs = 8000 + 5000;
  const leak = 2 * (1 - 0.99) * lp;
  const peak = (rLoop: number): number => {
    const refl = n * n * cs;
    const ser = (1e-6 * refl) / (1e-6 + refl);
    const zeta = (rLoop / 2) * Math.sqrt(ser / leak);
    return n * 0.75 * (1e-6 / (1e-6 + refl)) * (1 + Math.exp((-Math.PI * zeta) / Math.sqrt(1 - zeta * zeta)));
  };
  const rise = (rLoop: number): number => {
    const refl = n * n * cs;
    const ser = (1e-6 * refl) / (1e-6 + refl);
    const zeta = (rLoop / 2) * Math.sqrt(ser / leak);
    return Math.PI / ((1 / Math.sqrt(leak * ser)) * Math.sqrt(1 - zeta * zeta));
  };

  it('peak per volt and rise time, hot and cold loop (primary winding + Rs / n^2)', () => {
    const p = prep(alternatorCar, moduleSetup(cdModule()));
    const hot = cu(3, 70) + rs / (n * n);
    const cold = cu(3, 15) + rs / (n * n);
    close(p.cd!.peakPerChargeV, peak(hot), 1e-9, 'peak hot');
    close(p.cd!.peakPerChargeCrankingV, peak(cold), 1e-9, 'peak cold');
    close(p.cd!.riseS, rise(hot), 1e-9, 'rise hot');
    close(p.cd!.riseCrankingS, rise(cold), 1e-9, 'rise cold');
    expect(p.couplingK).toBe(0.99);
  });

  it('the charger loads its feed as a constant power (quadratic root); after the ballast the feed includes it', () => {
    const p = prep(dynamoCar, moduleSetup(cdModule(), { ballast: ceramic(0.6), moduleFeed: 'after-ballast' }));
    close(p.moduleSupplyRunningV!, underPowerLoad(14.2, 0.15 + 0.6, 40), 1e-12, 'CD running');
    close(p.moduleSupplyRestingV!, underPowerLoad(12.5, 0.15 + 0.6, 40), 1e-12, 'CD resting');
    const q = prep(dynamoCar, moduleSetup(cdModule(), { moduleFeed: 'switched-15' }));
    close(q.moduleSupplyRunningV!, underPowerLoad(14.2, 0.15, 40), 1e-12, 'CD 15');
  });

  it('a ceramic ballast carrying the charger input P / V settles at T_amb + theta (P/V)^2 R', () => {
    const p = prep(alternatorCar, moduleSetup(cdModule(), { ballast: ceramic(1.2) }));
    const i = 40 / 14.2;
    close(p.ballastHotK, K(70) + 10 * i * i * 1.2, 1e-10, 'CD ballast');
  });

  it('a CD unit without its stage is an issue and has no peak', () => {
    const p = prep(alternatorCar, moduleSetup(cdModule({ cd: null })));
    expect(p.issues).toContain('A capacitive-discharge module needs its capacitor, charge voltage and charger power.');
    expect(p.cd!.capacitorF).toBe(0);
    close(p.moduleSupplyRunningV!, 14.2 - 0.15 * ((14.2 - 1.5) / (cu(3, 70) + 0.15)), 1e-12, 'no stage: linear');
  });
});

// ---------------------------------------------------------------- the secondary

describe('secondary constants', () => {
  it('Ls: the coil\'s own when positive, else n^2 Lp', () => {
    expect(prep(alternatorCar, pointsSetup({ coil: coil({ secondaryInductanceH: 0 }) })).secondaryInductanceH).toBeCloseTo(100 * 100 * 0.008, 12);
    expect(prep(alternatorCar, pointsSetup({ coil: coil({ secondaryInductanceH: 50 }) })).secondaryInductanceH).toBe(50);
    expect(prep(alternatorCar, pointsSetup({ coil: coil({ secondaryInductanceH: null }) })).secondaryInductanceH).toBeCloseTo(80, 12);
  });
  it('Rs is winding + lead + plug resistor in series', () => {
    const s = pointsSetup({ plug: { name: 'Resistor plug', resistor: true, resistorOhm: 5000, gapMinM: 0.5e-3, gapMaxM: 1.1e-3 } });
    expect(prep(alternatorCar, s).secondaryResistanceOhm).toBe(8000 + 5000 + 5000);
  });
  it('a condenser of 0 F or below counts as none', () => {
    expect(prep(alternatorCar, pointsSetup({ condenserF: -1e-7 })).condenserF).toBe(0);
  });
  it('the coil\'s rating is the ceiling when positive; 0 or below takes the default 30 kV (conditions.ts)', () => {
    expect(prep(alternatorCar, pointsSetup({ coil: coil({ ratedSecondaryV: 35_000 }) })).ceilingV).toBe(35_000);
    expect(prep(alternatorCar, pointsSetup({ coil: coil({ ratedSecondaryV: 0 }) })).ceilingV).toBe(30_000);
    expect(prep(alternatorCar, pointsSetup({ coil: coil({ ratedSecondaryV: -1 }) })).ceilingV).toBe(30_000);
  });
  it('coupling: the coil\'s own in (0, 1), else the default 0.995 (DEFAULT_COUPLING_K)', () => {
    const k = (c: number): number => prep(alternatorCar, pointsSetup({ coil: coil({ couplingK: c }) })).couplingK;
    expect(k(0.97)).toBe(0.97);
    expect(k(0)).toBe(0.995);
    expect(k(1)).toBe(0.995);
    expect(k(1.5)).toBe(0.995);
    expect(k(-0.5)).toBe(0.995);
    expect(k(NaN)).toBe(0.995);
  });
  it('fouled first peak per primary ampere: (eta / n) x the underdamped parallel RLC peak', () => {
    const p = prep(alternatorCar, pointsSetup());
    const L = 100 * 100 * 0.008;
    const C = 80e-12 + 0.22e-6 / (100 * 100);
    const R = 2e6;
    const alpha = 1 / (2 * R * C);
    const w0 = 1 / Math.sqrt(L * C);
    const wd = Math.sqrt(w0 * w0 - alpha * alpha);
    const t = Math.atan(wd / alpha) / wd;
    close(p.fouledVPerA, (0.75 / 100) * Math.sqrt(L / C) * Math.exp(-alpha * t), 1e-9, 'fouled');
  });
  it('reversed coil wiring multiplies the breakdown voltage by 1/0.9 (breakdown.ts)', () => {
    close(prep(alternatorCar, pointsSetup({ coilWiring: 'reversed' })).polarityFactor, 1 / 0.9, 1e-15, 'reversed');
    expect(prep(alternatorCar, pointsSetup()).polarityFactor).toBe(1);
  });
});

// ---------------------------------------------------------------- fallbacks named in the issues

describe('each unusable input is named with the value assumed', () => {
  it('conditions', () => {
    const p = prep(alternatorCar, pointsSetup(), {
      secondaryCapacitanceF: measured(0),
      transferEfficiency: measured(0),
      fouledShuntOhm: measured(0),
      arcVoltageV: measured(0),
      secondaryCeilingV: { value: 0, provenance: 'engine override' },
    });
    expect(p.issues).toEqual(expect.arrayContaining([
      missing('The secondary capacitance', '7e-11'),
      missing('The transfer efficiency', '0.8'),
      missing('The fouled-plug shunt', '500000'),
      missing('The arc voltage', '700'),
      missing('The secondary ceiling', '30000'),
    ]));
  });
  it('parts', () => {
    const p = prep(alternatorCar, pointsSetup({ coil: coil({ primaryResistanceOhm20C: { value: 0, provenance: catalogue } }), ballast: ceramic(0) }));
    expect(p.issues).toEqual(expect.arrayContaining([missing('The coil primary resistance', '3'), missing('The ballast resistance', '1.5')]));
    const q = prep(alternatorCar, moduleSetup(cdModule({ cd: { capacitorF: 0, chargeVoltageV: 400, chargerPowerW: 40, multiSparkBelowRpm: null } })));
    expect(q.issues).toContain(missing('The CD capacitor', '0.000001'));
  });
});
