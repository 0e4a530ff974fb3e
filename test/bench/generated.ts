/**
 * Invented parts for the benchmark, generated from a fixed seed so every run times the same work.
 * No value here describes any real product.
 */
import type { BallastSpec, CoilSpec, EngineSpec, ModuleSpec, ModuleType, SetupSpec } from '../../electron/checker/index.js';

/** A small deterministic generator (Park-Miller minimal standard), so the bins are repeatable. */
export function seeded(seed: number): () => number {
  let s = seed % 2147483647;
  if (s <= 0) s += 2147483646;
  return () => {
    s = (s * 16807) % 2147483647;
    return (s - 1) / 2147483646;
  };
}

const between = (r: () => number, lo: number, hi: number): number => lo + (hi - lo) * r();

export const benchEngine: EngineSpec = {
  name: 'Bench four-cylinder',
  cylinders: 4,
  cycle: 'four-stroke',
  boreM: 0.08,
  strokeM: 0.078,
  conRodM: 0.13,
  compressionRatio: 8.8,
  idleRpm: 750,
  crankingRpm: 180,
  redlineRpm: 6000,
  systemVoltageV: 12,
  earthPolarity: 'negative',
  pointsDwellDeg: 60,
  pointsFloatRpm: 6500,
  staticTimingDegBtdc: 8,
  advanceCurve: [
    { rpm: 800, advanceDeg: 0 },
    { rpm: 2000, advanceDeg: 12 },
    { rpm: 4500, advanceDeg: 24 },
  ],
};

export function generatedCoil(r: () => number, i: number): CoilSpec {
  const ohm = between(r, 0.6, 4.0);
  return {
    name: `Bench coil ${i + 1}`,
    primaryResistanceOhm20C: { value: ohm, provenance: 'catalogue' },
    primaryInductanceH: between(r, 4e-3, 12e-3),
    secondaryResistanceOhm: between(r, 5000, 12000),
    turnsRatio: Math.round(between(r, 60, 120)),
    secondaryInductanceH: null,
    forBallast: ohm < 2,
    ratedVoltageV: 12,
    maxDissipationW: null,
  };
}

const types: readonly ModuleType[] = ['transistor-points', 'breakerless-fixed-duty', 'breakerless-current-limited', 'capacitive-discharge'];

export function generatedModule(r: () => number, i: number): ModuleSpec {
  const moduleType = types[i % types.length]!;
  const limited = moduleType === 'breakerless-current-limited';
  return {
    name: `Bench module ${i + 1}`,
    moduleType,
    supplyMinV: between(r, 6, 9),
    supplyMaxV: 16,
    earthPolarities: r() < 0.7 ? ['negative'] : ['negative', 'positive'],
    minCoilResistanceOhm: limited ? 0 : between(r, 0.5, 3),
    maxCurrentA: between(r, 5, 10),
    currentLimitA: limited ? between(r, 4.5, 7) : null,
    switchSaturationV: moduleType === 'capacitive-discharge' ? 0 : between(r, 1.2, 2.0),
    primaryClampV: moduleType === 'capacitive-discharge' ? null : between(r, 350, 450),
    fixedDutyFraction: moduleType === 'breakerless-fixed-duty' ? between(r, 0.4, 0.7) : null,
    maxDutyFraction: limited ? between(r, 0.7, 0.9) : null,
    stallShutOff: r() < 0.5,
    maxSparkRateHz: between(r, 300, 800),
    tachOutput: r() < 0.5,
    needsSuppressedLeads: r() < 0.5,
    cd:
      moduleType === 'capacitive-discharge'
        ? { capacitorF: between(r, 0.5e-6, 2e-6), chargeVoltageV: between(r, 250, 550), chargerPowerW: between(r, 20, 60), multiSparkBelowRpm: r() < 0.5 ? 3000 : null }
        : null,
  };
}

export const benchBallast: BallastSpec = {
  name: 'Bench iron-wire ballast',
  ballastType: 'iron-wire',
  coldResistanceOhm: { value: 1.5, provenance: 'catalogue' },
  thermalResistanceKPerW: null,
};

export function setupOf(label: string, coil: CoilSpec, module: ModuleSpec | null, ballast: BallastSpec | null, bypass: boolean): SetupSpec {
  return {
    label,
    switching: module ? module.moduleType : 'points',
    coil,
    ballast,
    crankingBypass: bypass,
    moduleFeed: 'switched-15',
    module,
    condenserF: module ? null : 0.22e-6,
    tach: null,
    leads: { name: 'Bench carbon leads', core: 'carbon', resistancePerLeadOhm: 10000 },
    plug: { name: 'Bench plug', resistor: true, resistorOhm: 5000, gapMinM: 0.6e-3, gapMaxM: 1.1e-3 },
    plugGapM: 0.8e-3,
    magneto: null,
  };
}
