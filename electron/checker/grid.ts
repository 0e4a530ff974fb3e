/**
 * Everything about one engine under one set of conditions that does not depend on the ignition
 * fitted: the rpm points, spark rate and period, spark angle and the cylinder state at the spark.
 * Built once and shared by every setup checked on that engine (the parts-bin search relies on it).
 */
import { kelvin } from './conditions.js';
import type { CompressedState } from './compression.js';
import { sparkRateHz } from './dwell.js';
import { cylinderStateInto, sparkAngleDegBtdc } from './required.js';
import type { EngineSpec, ResolvedConditions } from './types.js';
import { ATM_PA, REFERENCE_TEMPERATURE_K } from './breakdown.js';

export interface RpmGrid {
  n: number;
  rpm: Float64Array;
  /** 1 where the point is computed on the cranking supply. */
  cranking: Uint8Array;
  sparkRateHz: Float64Array;
  periodS: Float64Array;
  sparkAngleDegBtdc: Float64Array;
  pressurePa: Float64Array;
  temperatureK: Float64Array;
  /** (p / 1 atm)(293 K / T): multiply by the gap in cm to get the reduced gap. */
  densityFactor: Float64Array;
}

export interface EngineGrids {
  /** Cranking speed (on the cranking supply) then running points up to 110 % of redline. */
  sweep: RpmGrid;
  /** Four points: cranking, idle, mid-range, redline. */
  key: RpmGrid;
  /** Index in `sweep` of the last point at or below redline. */
  redlineIndex: number;
  /** Index in `sweep` of the first point at or above idle. */
  idleIndex: number;
}

function emptyGrid(n: number): RpmGrid {
  return {
    n,
    rpm: new Float64Array(n),
    cranking: new Uint8Array(n),
    sparkRateHz: new Float64Array(n),
    periodS: new Float64Array(n),
    sparkAngleDegBtdc: new Float64Array(n),
    pressurePa: new Float64Array(n),
    temperatureK: new Float64Array(n),
    densityFactor: new Float64Array(n),
  };
}

function fillPoint(g: RpmGrid, i: number, rpm: number, cranking: boolean, engine: EngineSpec, p1Pa: number, t1K: number, scratch: CompressedState): void {
  g.rpm[i] = rpm;
  g.cranking[i] = cranking ? 1 : 0;
  const f = sparkRateHz(rpm, engine.cylinders, engine.cycle);
  g.sparkRateHz[i] = f;
  g.periodS[i] = f > 0 ? 1 / f : 1;
  const angle = sparkAngleDegBtdc(engine.staticTimingDegBtdc, engine.advanceCurve, rpm);
  g.sparkAngleDegBtdc[i] = angle;
  const rodRatio = engine.conRodM / Math.max(1e-9, engine.strokeM / 2);
  cylinderStateInto(scratch, engine.compressionRatio, rodRatio, angle, p1Pa, t1K);
  g.pressurePa[i] = scratch.pressurePa;
  g.temperatureK[i] = scratch.temperatureK;
  g.densityFactor[i] = (scratch.pressurePa / ATM_PA) * (REFERENCE_TEMPERATURE_K / Math.max(1, scratch.temperatureK));
}

export function buildGrids(engine: EngineSpec, c: ResolvedConditions, rpmPoints: number): EngineGrids {
  const n = Math.max(2, Math.min(5000, Math.floor(Number.isFinite(rpmPoints) ? rpmPoints : 200)));
  const p1 = c.volumetricEfficiency.value * c.ambientPressurePa.value;
  const t1 = kelvin(c.inletChargeC.value);
  const scratch: CompressedState = { pressurePa: 0, temperatureK: 0 };
  const crank = Math.max(1, engine.crankingRpm);
  const top = Math.max(crank * 1.01, engine.redlineRpm * 1.1);
  const sweep = emptyGrid(n);
  let redlineIndex = 0;
  let idleIndex = n - 1;
  for (let i = 0; i < n; i++) {
    const rpm = crank + ((top - crank) * i) / (n - 1);
    fillPoint(sweep, i, rpm, i === 0, engine, p1, t1, scratch);
    if (rpm <= engine.redlineRpm * (1 + 1e-9)) redlineIndex = i;
    if (rpm >= engine.idleRpm && i < idleIndex && i > 0) idleIndex = i;
  }
  const key = emptyGrid(4);
  fillPoint(key, 0, crank, true, engine, p1, t1, scratch);
  fillPoint(key, 1, engine.idleRpm, false, engine, p1, t1, scratch);
  fillPoint(key, 2, 0.5 * (engine.idleRpm + engine.redlineRpm), false, engine, p1, t1, scratch);
  fillPoint(key, 3, engine.redlineRpm, false, engine, p1, t1, scratch);
  return { sweep, key, redlineIndex, idleIndex };
}
