/**
 * The conversion checker's public surface: pure functions over the plain types in `types.ts`.
 *
 * - `checkSetup`     one setup on one engine: sweep, key points, key-on, rules, gap suggestion.
 * - `compareSetups`  the existing setup beside up to three candidates.
 * - `searchBest`     every module x coil x ballast option from a parts bin, ranked.
 * - `suggestPlugGap` the largest gap that keeps the margin at the worst rpm.
 * - `circuitAtRpm`   the primitive circuit values at one rpm, for a SPICE deck.
 * The physics functions are exported too, for tests and for the SPICE cross-checks.
 */
import { toReport } from './report.js';
import { analyse, createSession } from './session.js';
import type { Baseline } from './rules/context.js';
import type { CheckOptions, ConditionInputs, EngineSpec, PlugGapSuggestion, SetupReport, SetupSpec } from './types.js';

export * from './types.js';
export { resolveConditions, defaultConditions, conditionUnits, kelvin, crankingFloorV, CRANKING_FLOOR_TABLE, DEFAULT_COUPLING_K, secondaryCeilingDefaultV, secondaryCeilingFor } from './conditions.js';
export { compareSetups, MAX_CANDIDATES } from './compare.js';
export { searchBest } from './search.js';
export { circuitAtRpm } from './report.js';
export { RULES, worstVerdict } from './rules/index.js';
export { COPPER_ALPHA_PER_K, copperResistanceOhm, copperResistanceAt20COhm, finalCurrentA } from './primary.js';
export { IRON_RESISTIVITY_TABLE, ironResistivityMicroOhmCm, ironBallastResistanceOhm, selfHeatedTemperatureK } from './thermal.js';
export { chargeCurrentA, timeToReachS, inductorEnergyJ, meanSquareCurrentA2 } from './charge.js';
export { sparkRateHz, dwellFractionFromAngle, floatedDwellFraction, currentLimitedDwellS } from './dwell.js';
export { turnsRatio, effectiveSecondaryCapacitanceF, availableSecondaryV, voltsPerAmp, secondaryRiseTimeS, inductiveSparkDurationS, secondaryDampingFactor, inductiveSparkEnergyJ } from './secondary.js';
export { parallelRlcPeakVPerA, cdFouledFraction, reflectedShuntOhm, fouledChargeTauS, fouledTimeToLimitS, fouledFluxCurrentA } from './fouled.js';
export { capacitorEnergyJ, rechargeTimeS, cdChargeVoltageV, cdSecondaryPeakV, cdSparkDurationS, leakageInductanceH, cdTransferDampingRatio, cdOvershootFraction, cdRiseTimeS, cdSparkEnergyJ, cdEnergyFallsFromRpm, type CdTransferLoop } from './cd.js';
export { volumeRatioAtAngle, sweptVolumeM3, clearanceVolumeM3 } from './geometry.js';
export { compressInto, POLYTROPIC_INDEX, type CompressedState } from './compression.js';
export { reducedGapCm, airBreakdownV, paschenBreakdownV, paschenBreakdownFromReducedV, REVERSED_POLARITY_FACTOR, ATM_PA } from './breakdown.js';
export { sparkAngleDegBtdc, cylinderStateInto, breakdownV } from './required.js';
export { magnetoBreakCurrentA } from './magneto.js';

/**
 * Check one setup on one engine. With `baseline` (the existing setup's report on the same engine,
 * conditions and options) the energy rule compares against it.
 */
export function checkSetup(engine: EngineSpec, setup: SetupSpec, conditions?: ConditionInputs, options?: CheckOptions, baseline?: SetupReport): SetupReport {
  const s = createSession(engine, conditions, options);
  let base: Baseline | null = null;
  if (baseline && baseline.points.length === s.grids.sweep.n) {
    base = {
      label: baseline.label,
      energyJ: Float64Array.from(baseline.points, (p) => p.storedEnergyJ),
      sparkEnergyJ: Float64Array.from(baseline.points, (p) => p.sparkEnergyJ),
      durationS: Float64Array.from(baseline.points, (p) => p.sparkDurationS),
      worstRatio: baseline.worstReserveRatio,
    };
  }
  return toReport(s, analyse(s, setup, base, !(options?.skipGapSuggestion ?? false)));
}

/** The largest plug gap whose reserve meets the margin at the worst rpm (within the plug's range when known). */
export function suggestPlugGap(engine: EngineSpec, setup: SetupSpec, conditions?: ConditionInputs, options?: CheckOptions): PlugGapSuggestion {
  const s = createSession(engine, conditions, options);
  const a = analyse(s, setup, null, true);
  return a.gap!;
}
