/**
 * A stored engine to the checker's engine spec (millimetres to metres), and its condition
 * overrides plus measured supply readings to the checker's condition inputs.
 */
import { conditionKeys, type Engine, type Reading } from '../../db/schema.js';
import type { ConditionInputs, EngineSpec } from '../checker/types.js';
import { latestReading } from './parts.js';

export function engineSpec(e: Engine): EngineSpec {
  return {
    name: e.name,
    cylinders: e.cylinders,
    cycle: e.cycle,
    boreM: e.boreMm / 1000,
    strokeM: e.strokeMm / 1000,
    conRodM: e.conRodMm / 1000,
    compressionRatio: e.compressionRatio,
    idleRpm: e.idleRpm,
    crankingRpm: e.crankingRpm,
    redlineRpm: e.redlineRpm,
    systemVoltageV: e.systemVoltageV,
    earthPolarity: e.earthPolarity,
    pointsDwellDeg: e.pointsDwellDeg,
    pointsFloatRpm: e.pointsFloatRpm ?? null,
    staticTimingDegBtdc: e.staticTimingDegBtdc,
    advanceCurve: e.advanceCurve.map((r) => ({ rpm: r.rpm, advanceDeg: r.advanceDeg })),
    charging: e.charging,
  };
}

/** Engine overrides ('engine override'), then measured supply voltages on top ('measured'). */
export function conditionInputs(e: Engine, readings?: readonly Reading[]): ConditionInputs {
  const out: ConditionInputs = {};
  const o = e.conditions;
  // Every settable condition, from the one list (db/conditions.ts); its keys are the checker's ConditionName.
  for (const key of conditionKeys) {
    const v = o[key];
    if (typeof v === 'number' && Number.isFinite(v)) out[key] = { value: v, provenance: 'engine override' };
  }
  const crank = latestReading(readings, 'supply-voltage-cranking');
  if (crank && crank.value > 0) out.crankingSupplyV = { value: crank.value, provenance: 'measured' };
  const run = latestReading(readings, 'supply-voltage-running');
  if (run && run.value > 0) out.runningSupplyV = { value: run.value, provenance: 'measured' };
  return out;
}
