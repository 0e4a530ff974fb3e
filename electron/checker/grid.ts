/**
 * Everything about one engine under one set of conditions that does not depend on the ignition
 * fitted: the rpm points, spark rate and period, spark angle and the cylinder state at the spark.
 * Built once and shared by every setup checked on that engine (the parts-bin search relies on it).
 */
import { kelvin } from './conditions.js';
import { POLYTROPIC_INDEX, type CompressedState } from './compression.js';
import { sparkRateHz } from './dwell.js';
import { cylinderStateInto, sparkAngleDegBtdc } from './required.js';
import type { EngineSpec, ResolvedConditions } from './types.js';
import { ATM_PA, REFERENCE_TEMPERATURE_K } from './breakdown.js';

export interface RpmGrid {
  n: number;
  rpm: Float64Array;
  /** 1 where the point is computed on the cranking supply. */
  cranking: Uint8Array;
  /**
   * 1 at a running point below a dynamo's cut-in speed, where the coil sees the battery at rest
   * rather than the regulated supply (always 0 with an alternator).
   */
  resting: Uint8Array;
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
    resting: new Uint8Array(n),
    sparkRateHz: new Float64Array(n),
    periodS: new Float64Array(n),
    sparkAngleDegBtdc: new Float64Array(n),
    pressurePa: new Float64Array(n),
    temperatureK: new Float64Array(n),
    densityFactor: new Float64Array(n),
  };
}

/** How the charge is compressed: pressure at inlet closing, charge temperature running and cranking, polytropic index, dynamo cut-in. */
interface ChargeState {
  p1Pa: number;
  /** Warm charge of a running engine (the inlet charge temperature). */
  runningT1K: number;
  /** A cranking engine's charge is at ambient: cold walls and manifold have not warmed it yet. */
  crankingT1K: number;
  polytropicIndex: number;
  /** Below this rpm a dynamo car's coil sees the battery at rest; 0 with an alternator. */
  cutInRpm: number;
}

function fillPoint(g: RpmGrid, i: number, rpm: number, cranking: boolean, engine: EngineSpec, cs: ChargeState, scratch: CompressedState): void {
  g.rpm[i] = rpm;
  g.cranking[i] = cranking ? 1 : 0;
  g.resting[i] = !cranking && rpm < cs.cutInRpm ? 1 : 0;
  const p1Pa = cs.p1Pa;
  const t1K = cranking ? cs.crankingT1K : cs.runningT1K;
  const f = sparkRateHz(rpm, engine.cylinders, engine.cycle);
  g.sparkRateHz[i] = f;
  g.periodS[i] = f > 0 ? 1 / f : 1;
  const angle = sparkAngleDegBtdc(engine.staticTimingDegBtdc, engine.advanceCurve, rpm);
  g.sparkAngleDegBtdc[i] = angle;
  const rodRatio = engine.conRodM / Math.max(1e-9, engine.strokeM / 2);
  cylinderStateInto(scratch, engine.compressionRatio, rodRatio, angle, p1Pa, t1K, cs.polytropicIndex);
  g.pressurePa[i] = scratch.pressurePa;
  g.temperatureK[i] = scratch.temperatureK;
  g.densityFactor[i] = (scratch.pressurePa / ATM_PA) * (REFERENCE_TEMPERATURE_K / Math.max(1, scratch.temperatureK));
}

/**
 * The sweep's point count is this many at least and at most (the command line and the plan file
 * take the same). Three at least, so the sweep always holds cranking, the entered idle and redline.
 */
export const MIN_RPM_POINTS = 3;
export const MAX_RPM_POINTS = 2000;

/** A requested point count made whole and kept within MIN_RPM_POINTS..MAX_RPM_POINTS (200 when not a number). */
export function rpmPointCount(rpmPoints: number): number {
  return Math.max(MIN_RPM_POINTS, Math.min(MAX_RPM_POINTS, Math.floor(Number.isFinite(rpmPoints) ? rpmPoints : 200)));
}

/** `x` rounded to a multiple of 1/inv (inv a whole number, so 0.1 steps come out as 0.3, never 0.30000000000000004). */
const roundTo = (x: number, inv: number): number => Math.round(x * inv) / inv;

/** The coarsest of 1, 1/2, 1/5, 1/10, 1/20 ... rpm (as its inverse) that is no larger than `step`. */
function roundingFor(step: number): number {
  let inv = 1;
  for (let k = 0; k < 12 && 1 / inv > step; k++) inv *= k % 3 === 1 ? 2.5 : 2;
  return inv;
}

/** `count` strictly rising values from `lo` to `hi` (both exact), the inner ones round; written into out[from..]. */
function fillEven(out: Float64Array, from: number, count: number, lo: number, hi: number): void {
  const step = (hi - lo) / (count - 1);
  const inv = roundingFor(step);
  for (let j = 0; j < count; j++) out[from + j] = j === 0 ? lo : j === count - 1 ? hi : roundTo(lo + step * j, inv);
  // Rounding never reorders points at least one rounding unit apart; a tiny range keeps its exact values.
  for (let j = 1; j < count; j++) if (!(out[from + j]! > out[from + j - 1]!)) {
    for (let m = 1; m < count - 1; m++) out[from + m] = lo + step * m;
    return;
  }
}

/**
 * The sweep's rpm: `n` points, cranking first, then evenly from cranking to 110 % of redline on
 * round values (whole rpm wherever the step allows), with the entered idle and redline exactly
 * in place of their nearest points. With n = 3 (the fewest a check asks for, MIN_RPM_POINTS) the
 * points are cranking, idle and redline; called directly with n = 2, cranking and redline; with
 * n = 1, cranking alone; with none, none.
 */
export function sweepRpm(engine: EngineSpec, n: number): Float64Array {
  // No points asked for: none (the anchor trimming below would never end).
  if (n < 1) return new Float64Array(0);
  const out = new Float64Array(n);
  const crank = Math.max(1, engine.crankingRpm);
  const rawTop = Math.max(crank * 1.01, engine.redlineRpm * 1.1);
  const top = roundTo(rawTop, roundingFor(rawTop - crank));
  out[0] = crank;
  // The entered speeds that must appear exactly, rising, above cranking and within the sweep.
  const anchors = [engine.idleRpm, engine.redlineRpm].filter((a, i, all) => a > crank && a <= top && all.indexOf(a) === i).sort((a, b) => a - b);
  while (anchors.length > n - 1) anchors.shift();
  if (n - 1 === anchors.length) {
    anchors.forEach((a, i) => (out[i + 1] = a));
    return out;
  }
  fillEven(out, 0, n, crank, top);
  // Put each anchor on its nearest point, keeping room for the anchors above it and order below it
  // (an anchor exactly halfway between two points takes the lower one, leaving the upper for later).
  const fixed: number[] = [0];
  anchors.forEach((a, k) => {
    const lowest = fixed[fixed.length - 1]! + 1;
    const highest = n - 1 - (anchors.length - 1 - k) - (a < top ? 1 : 0);
    let best = lowest;
    for (let i = lowest; i <= highest; i++) if (Math.abs(out[i]! - a) < Math.abs(out[best]! - a)) best = i;
    out[best] = a;
    fixed.push(best);
  });
  if (fixed[fixed.length - 1] !== n - 1) fixed.push(n - 1);
  // Between two fixed points, re-space evenly wherever an anchor pushed aside broke the order.
  for (let f = 1; f < fixed.length; f++) {
    const a = fixed[f - 1]!;
    const b = fixed[f]!;
    let ordered = true;
    for (let i = a + 1; i <= b; i++) if (!(out[i]! > out[i - 1]!)) ordered = false;
    if (!ordered && b - a > 1) fillEven(out, a, b - a + 1, out[a]!, out[b]!);
  }
  return out;
}

/**
 * Everything `buildGrids` reads, as a flat list of values: the point count, the engine's speeds,
 * cylinders, cycle, timing, geometry and charging, the charge conditions, and the advance curve.
 */
function gridInputs(engine: EngineSpec, c: ResolvedConditions, n: number): unknown[] {
  const key: unknown[] = [
    n, engine.crankingRpm, engine.idleRpm, engine.redlineRpm, engine.cylinders, engine.cycle, engine.staticTimingDegBtdc,
    engine.conRodM, engine.strokeM, engine.compressionRatio, engine.charging,
    c.volumetricEfficiency.value, c.ambientPressurePa.value, c.inletChargeC.value, c.ambientC.value, c.polytropicIndex.value, c.dynamoCutInRpm.value,
    engine.advanceCurve.length,
  ];
  for (const row of engine.advanceCurve) key.push(row.rpm, row.advanceDeg);
  return key;
}

/** The grids built last and what they were built from (every check of one engine asks for the same grids). */
let lastGrids: { inputs: unknown[]; grids: EngineGrids } | null = null;

/**
 * `buildGrids`, answered from the last call when every value it reads is the same (`Object.is`):
 * a check, a comparison and a search on one engine and one set of conditions share one set of
 * grids. Grids are only ever read once built, so sharing them changes nothing.
 */
export function gridsFor(engine: EngineSpec, c: ResolvedConditions, rpmPoints: number): EngineGrids {
  const inputs = gridInputs(engine, c, rpmPointCount(rpmPoints));
  const last = lastGrids;
  if (last && last.inputs.length === inputs.length && last.inputs.every((v, i) => Object.is(v, inputs[i]))) return last.grids;
  const grids = buildGrids(engine, c, rpmPoints);
  lastGrids = { inputs, grids };
  return grids;
}

/**
 * Forget the remembered grids, so the next `gridsFor` builds afresh. The mutation run calls it
 * before each test file (test/mutation/forget-grids.ts): a grid built under one planted bug must
 * not answer a check run under the next. The required-voltage and carry-weight caches are keyed by
 * the grids, so they start afresh with them.
 */
export function forgetLastGrids(): void {
  lastGrids = null;
}

export function buildGrids(engine: EngineSpec, c: ResolvedConditions, rpmPoints: number): EngineGrids {
  const n = rpmPointCount(rpmPoints);
  const n1 = c.polytropicIndex.value;
  const cs: ChargeState = {
    p1Pa: c.volumetricEfficiency.value * c.ambientPressurePa.value,
    runningT1K: kelvin(c.inletChargeC.value),
    crankingT1K: kelvin(c.ambientC.value),
    polytropicIndex: Number.isFinite(n1) && n1 >= 1 ? n1 : POLYTROPIC_INDEX,
    cutInRpm: engine.charging === 'dynamo' && Number.isFinite(c.dynamoCutInRpm.value) ? c.dynamoCutInRpm.value : 0,
  };
  const scratch: CompressedState = { pressurePa: 0, temperatureK: 0 };
  const crank = Math.max(1, engine.crankingRpm);
  const rpms = sweepRpm(engine, n);
  const sweep = emptyGrid(n);
  let redlineIndex = 0;
  let idleIndex = n - 1;
  for (let i = 0; i < n; i++) {
    const rpm = rpms[i]!;
    fillPoint(sweep, i, rpm, i === 0, engine, cs, scratch);
    if (rpm <= engine.redlineRpm * (1 + 1e-9)) redlineIndex = i;
    if (rpm >= engine.idleRpm && i < idleIndex && i > 0) idleIndex = i;
  }
  const key = emptyGrid(4);
  fillPoint(key, 0, crank, true, engine, cs, scratch);
  fillPoint(key, 1, engine.idleRpm, false, engine, cs, scratch);
  fillPoint(key, 2, 0.5 * (engine.idleRpm + engine.redlineRpm), false, engine, cs, scratch);
  fillPoint(key, 3, engine.redlineRpm, false, engine, cs, scratch);
  return { sweep, key, redlineIndex, idleIndex };
}
