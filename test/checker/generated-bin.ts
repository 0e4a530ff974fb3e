/**
 * A generated parts bin of invented coils, modules and ballasts (no real products), for the search
 * equivalence test and the search timing probe. A seeded generator makes it repeatable. The ranges
 * are chosen so that most rules both pass and fail somewhere in the bin: low-resistance ballast
 * coils against module floors and ratings, 6 V coils, positive-earth-only modules, slow modules,
 * CD units with and without a tach output, copper leads on modules that want suppression.
 */
import type { BallastSpec, CoilSpec, ModuleSpec, ModuleType, SearchInput, SetupSpec } from '../../electron/checker/index.js';
import { fourCylinder, pointsSetup } from './fixtures.js';

/** Small, fast, seeded generator (mulberry32): the same seed gives the same bin. */
export function seededRandom(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

const catalogue = 'catalogue' as const;

export function generatedCoils(count: number, rnd: () => number): CoilSpec[] {
  const out: CoilSpec[] = [];
  for (let i = 0; i < count; i++) {
    const r = 0.6 + 4 * rnd();
    const withN = rnd() < 0.7;
    const lp = 0.003 + 0.009 * rnd();
    out.push({
      name: `Bin coil ${i + 1}`,
      primaryResistanceOhm20C: { value: r, provenance: rnd() < 0.2 ? 'measured' : catalogue },
      primaryInductanceH: lp,
      secondaryResistanceOhm: 5000 + 7000 * rnd(),
      turnsRatio: withN ? 50 + 80 * rnd() : null,
      secondaryInductanceH: withN ? null : lp * (60 + 60 * rnd()) ** 2,
      forBallast: r < 2 && rnd() < 0.8,
      ratedVoltageV: rnd() < 0.1 ? 6 : 12,
      maxDissipationW: rnd() < 0.5 ? null : 40 + 50 * rnd(),
    });
  }
  return out;
}

const TYPES: readonly ModuleType[] = ['breakerless-current-limited', 'breakerless-fixed-duty', 'transistor-points', 'capacitive-discharge'];

export function generatedModules(count: number, rnd: () => number): ModuleSpec[] {
  const out: ModuleSpec[] = [];
  for (let i = 0; i < count; i++) {
    const t = TYPES[i % TYPES.length]!;
    const cd = t === 'capacitive-discharge';
    const limited = t === 'breakerless-current-limited';
    const earth = rnd();
    out.push({
      name: `Bin module ${i + 1}`,
      moduleType: t,
      supplyMinV: 4 + 4 * rnd(),
      // Every fifth a six-volt unit's 9 V maximum, which a 12 V car's running supply exceeds.
      supplyMaxV: i % 5 === 4 ? 9 : 16,
      cutOutV: rnd() < 0.3 ? 3 + 2 * rnd() : null,
      earthPolarities: earth < 0.1 ? ['positive'] : earth < 0.3 ? ['negative', 'positive'] : ['negative'],
      minCoilResistanceOhm: cd ? 0 : 3 * rnd(),
      maxCurrentA: 5 + 7 * rnd(),
      currentLimitA: limited ? 4 + 3 * rnd() : !cd && rnd() < 0.2 ? 6 + 2 * rnd() : null,
      switchSaturationV: t === 'transistor-points' ? 0.8 + 0.8 * rnd() : 1 + rnd(),
      primaryClampV: rnd() < 0.6 ? 300 + 150 * rnd() : null,
      fixedDutyFraction: t === 'breakerless-fixed-duty' ? 0.4 + 0.3 * rnd() : null,
      maxDutyFraction: limited ? 0.7 + 0.2 * rnd() : null,
      stallShutOff: rnd() < 0.5,
      maxSparkRateHz: 150 + 450 * rnd(),
      tachOutput: rnd() < 0.5,
      needsSuppressedLeads: rnd() < 0.3,
      cd: cd ? { capacitorF: 0.5e-6 + 1e-6 * rnd(), chargeVoltageV: 300 + 150 * rnd(), chargerPowerW: 20 + 40 * rnd(), multiSparkBelowRpm: rnd() < 0.4 ? 1500 + 1500 * rnd() : null } : null,
    });
  }
  return out;
}

/** Iron-wire ballasts first (they self-heat, the expensive case), then fixed ceramic ones. */
export function generatedBallasts(count: number, rnd: () => number): BallastSpec[] {
  const out: BallastSpec[] = [];
  for (let i = 0; i < count; i++) {
    const iron = i % 2 === 0;
    out.push({
      name: `Bin ballast ${i + 1}`,
      ballastType: iron ? 'iron-wire' : 'ceramic',
      coldResistanceOhm: { value: 1 + rnd(), provenance: catalogue },
      thermalResistanceKPerW: rnd() < 0.5 ? null : 5 + 6 * rnd(),
    });
  }
  return out;
}

export interface BinSize {
  coils: number;
  modules: number;
  /** Ballasts on the shelf; each gives two options (with and without a cranking bypass) besides none. */
  ballasts: number;
  seed: number;
  rpmPoints?: number;
  topN?: number;
}

export function generatedSearch(size: BinSize, existing: SetupSpec = pointsSetup()): SearchInput {
  const rnd = seededRandom(size.seed);
  return {
    engine: fourCylinder,
    existing,
    coils: generatedCoils(size.coils, rnd),
    modules: generatedModules(size.modules, rnd),
    ballasts: generatedBallasts(size.ballasts, rnd),
    tach: { name: 'Dash tachometer', senses: 'coil-negative-pulses' },
    leads: { name: 'Copper leads', core: 'copper', resistancePerLeadOhm: 50 },
    plug: { name: 'Plain plug', resistor: false, resistorOhm: 0, gapMinM: 0.5e-3, gapMaxM: 1.1e-3 },
    plugGapM: 0.8e-3,
    options: { rpmPoints: size.rpmPoints ?? 200 },
    topN: size.topN ?? 5,
  };
}
