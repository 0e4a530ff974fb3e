/**
 * Invented engines and parts for the checker tests (no real products).
 */
import type { BallastSpec, CoilSpec, EngineSpec, ModuleSpec, SetupSpec } from '../../electron/checker/index.js';
import type { Baseline } from '../../electron/checker/rules/context.js';

export const fourCylinder: EngineSpec = {
  name: 'Test four',
  cylinders: 4,
  cycle: 'four-stroke',
  boreM: 0.0802,
  strokeM: 0.0889,
  conRodM: 0.1556, // l/a = 3.5
  compressionRatio: 8,
  idleRpm: 800,
  crankingRpm: 180,
  redlineRpm: 6000,
  systemVoltageV: 12,
  earthPolarity: 'negative',
  pointsDwellDeg: 54,
  pointsFloatRpm: null,
  staticTimingDegBtdc: 8,
  advanceCurve: [
    { rpm: 1000, advanceDeg: 0 },
    { rpm: 3000, advanceDeg: 20 },
    { rpm: 4500, advanceDeg: 24 },
  ],
};

export const catalogue = 'catalogue' as const;

export function coil(over: Partial<CoilSpec> = {}): CoilSpec {
  return {
    name: 'Oil-filled 3 ohm',
    primaryResistanceOhm20C: { value: 3.0, provenance: catalogue },
    primaryInductanceH: 0.008,
    secondaryResistanceOhm: 8000,
    turnsRatio: 100,
    secondaryInductanceH: null,
    forBallast: false,
    ratedVoltageV: 12,
    maxDissipationW: null,
    ...over,
  };
}

export const ballastCoil = (): CoilSpec =>
  coil({ name: 'Ballast coil 1.5 ohm', primaryResistanceOhm20C: { value: 1.5, provenance: catalogue }, primaryInductanceH: 0.005, forBallast: true });

export function ironBallast(over: Partial<BallastSpec> = {}): BallastSpec {
  return { name: 'Iron wire 1.5 ohm', ballastType: 'iron-wire', coldResistanceOhm: { value: 1.5, provenance: catalogue }, thermalResistanceKPerW: null, ...over };
}

export function module(over: Partial<ModuleSpec> = {}): ModuleSpec {
  return {
    name: 'Current-limited unit',
    moduleType: 'breakerless-current-limited',
    supplyMinV: 6,
    supplyMaxV: 16,
    earthPolarities: ['negative'],
    minCoilResistanceOhm: 0.5,
    maxCurrentA: 8,
    currentLimitA: 6,
    switchSaturationV: 1.5,
    primaryClampV: 400,
    fixedDutyFraction: null,
    maxDutyFraction: 0.8,
    stallShutOff: true,
    maxSparkRateHz: 400,
    tachOutput: false,
    needsSuppressedLeads: false,
    cd: null,
    ...over,
  };
}

export const cdModule = (over: Partial<ModuleSpec> = {}): ModuleSpec =>
  module({
    name: 'CD unit',
    moduleType: 'capacitive-discharge',
    currentLimitA: null,
    maxDutyFraction: null,
    primaryClampV: null,
    minCoilResistanceOhm: 0,
    tachOutput: true,
    cd: { capacitorF: 1e-6, chargeVoltageV: 400, chargerPowerW: 40, multiSparkBelowRpm: null },
    ...over,
  });

export function pointsSetup(over: Partial<SetupSpec> = {}): SetupSpec {
  return {
    label: 'Existing points',
    switching: 'points',
    coil: coil(),
    ballast: null,
    crankingBypass: false,
    moduleFeed: 'switched-15',
    module: null,
    condenserF: 0.22e-6,
    tach: null,
    leads: { name: 'Carbon', core: 'carbon', resistancePerLeadOhm: 5000 },
    plug: { name: 'Plug', resistor: false, resistorOhm: 0, gapMinM: 0.5e-3, gapMaxM: 1.1e-3 },
    plugGapM: 0.7e-3,
    magneto: null,
    ...over,
  };
}

export function moduleSetup(m: ModuleSpec, over: Partial<SetupSpec> = {}): SetupSpec {
  return pointsSetup({ label: m.name, switching: m.moduleType, module: m, condenserF: null, ...over });
}

/**
 * An existing setup that delivers the same spark energy and duration at each of `n` points
 * (stored energy 50 mJ, worst reserve 2): the rules' baseline, for tests of the relative limits.
 */
export function uniformBaseline(energyJ: number, durationS: number, n: number): Baseline {
  return {
    label: 'the existing setup',
    energyJ: new Float64Array(n).fill(0.05),
    sparkEnergyJ: new Float64Array(n).fill(energyJ),
    durationS: new Float64Array(n).fill(durationS),
    worstRatio: 2,
  };
}
