/**
 * Small valid records for the store tests, one per kind. Figures are typical of their kind
 * (from memory) and only need to pass the schema; the checker's own tests judge the physics.
 */
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import type { EngineInput, PartInput, PlanInput, ReadingInput } from '../../db/schema.js';

export function tempDir(label: string): { dir: string; cleanup(): void } {
  const dir = mkdtempSync(join(tmpdir(), `store-${label}-`));
  return { dir, cleanup: () => rmSync(dir, { recursive: true, force: true }) };
}

export const coilIn: Extract<PartInput, { kind: 'coil' }> = {
  kind: 'coil',
  name: 'Test coil 1.5 ohm',
  notes: '',
  primaryResistanceOhm20C: 1.5,
  primaryInductanceH: 0.006,
  secondaryResistanceOhm: 8000,
  turnsRatio: 90,
  secondaryInductanceH: null,
  forBallast: true,
  ratedVoltageV: 12,
  maxDissipationW: null,
};

export const ballastIn: PartInput = {
  kind: 'ballast',
  name: 'Test ballast',
  notes: 'iron wire',
  ballastType: 'iron-wire',
  coldResistanceOhm: 1.5,
  thermalResistanceKPerW: 25,
};

export const moduleIn: PartInput = {
  kind: 'module',
  name: 'Test module',
  notes: '',
  moduleType: 'breakerless-current-limited',
  supplyMinV: 8,
  supplyMaxV: 16,
  earthPolarities: ['negative'],
  minCoilResistanceOhm: 0.6,
  maxCurrentA: 8,
  currentLimitA: 6,
  switchSaturationV: 1.8,
  primaryClampV: 400,
  fixedDutyFraction: null,
  maxDutyFraction: 0.75,
  stallShutOff: true,
  maxSparkRateHz: 600,
  tachOutput: true,
  needsSuppressedLeads: false,
  cd: null,
};

export const cdModuleIn: PartInput = {
  ...(moduleIn as Extract<PartInput, { kind: 'module' }>),
  name: 'Test CD module',
  moduleType: 'capacitive-discharge',
  currentLimitA: null,
  maxDutyFraction: null,
  primaryClampV: null,
  cd: { capacitorUf: 1, chargeVoltageV: 400, chargerPowerW: 40, multiSparkBelowRpm: 3000 },
};

export const tachIn: PartInput = { kind: 'tach', name: 'Test tach', notes: '', senses: 'coil-negative-pulses' };
export const leadsIn: PartInput = { kind: 'leads', name: 'Test leads', notes: '', core: 'carbon', resistancePerLeadOhm: 12000 };
export const plugIn: PartInput = { kind: 'plug', name: 'Test plug', notes: '', resistor: true, resistorOhm: 5000, gapMinMm: 0.6, gapMaxMm: 1.1 };

export const everyKind: readonly PartInput[] = [coilIn, ballastIn, moduleIn, cdModuleIn, tachIn, leadsIn, plugIn];

export function engineIn(parts: { coilId?: number | null; ballastId?: number | null } = {}): EngineInput {
  return {
    name: 'Test four',
    notes: '',
    yearText: 'about 1965',
    modelText: 'saloon',
    cylinders: 4,
    cycle: 'four-stroke',
    firingOrder: '1-3-4-2',
    boreMm: 80,
    strokeMm: 80,
    conRodMm: 130,
    compressionRatio: 8.5,
    idleRpm: 800,
    crankingRpm: 150,
    redlineRpm: 6000,
    systemVoltageV: 12,
    earthPolarity: 'negative',
    charging: 'dynamo',
    pointsDwellDeg: 60,
    pointsGapMm: 0.4,
    pointsFloatRpm: null,
    staticTimingDegBtdc: 8,
    advanceCurve: [
      { rpm: 800, advanceDeg: 0 },
      { rpm: 1500, advanceDeg: 8 },
      { rpm: 2500, advanceDeg: 16 },
      { rpm: 4000, advanceDeg: 24 },
    ],
    existing: {
      trigger: 'points',
      coilPartId: parts.coilId ?? null,
      ballast: parts.ballastId ? 'discrete' : 'none',
      ballastPartId: parts.ballastId ?? null,
      crankingBypass: Boolean(parts.ballastId),
      condenserUf: 0.22,
      tachPartId: null,
      leadsPartId: null,
      plugPartId: null,
      plugGapMm: 0.6,
    },
    conditions: { harnessResistanceOhm: 0.1 },
  };
}

export function planIn(engineId: number, ids: Partial<Pick<PlanInput, 'moduleId' | 'coilId' | 'ballastId' | 'tachId' | 'leadsId' | 'plugId'>> = {}): PlanInput {
  return {
    engineId,
    name: 'Test plan',
    notes: '',
    status: 'draft',
    moduleId: ids.moduleId ?? null,
    coilId: ids.coilId ?? null,
    ballastId: ids.ballastId ?? null,
    crankingBypass: false,
    moduleFeed: 'switched-15',
    tachId: ids.tachId ?? null,
    leadsId: ids.leadsId ?? null,
    plugId: ids.plugId ?? null,
    plugGapMm: 0.8,
  };
}

export function readingIn(planId: number, value = 3.1): ReadingInput {
  return { planId, quantity: 'coil-primary-resistance', value, unit: 'ohm', takenOn: '2024-03-09', note: '' };
}
