/**
 * The adapter from stored (schema-shaped, invented) engine, parts, plans and readings to checker
 * inputs. The stored shapes are parsed with the real zod schemas first.
 */
import { describe, expect, it } from 'vitest';
import { engine as engineSchema, part as partSchema, plan as planSchema, reading as readingSchema, type Engine, type Part, type Plan, type Reading } from '../../db/schema.js';
import { checkSetup, compareSetups, searchBest } from '../../electron/checker/index.js';
import { comparisonInput, conditionInputs, engineSpec, existingSetupSpec, planSetupSpec, searchInput, SetupAdapterError } from '../../electron/setup/index.js';

const storedEngine: Engine = engineSchema.parse({
  id: 1, name: 'Workshop saloon', notes: '', yearText: '1966', modelText: 'four-door', cylinders: 4, cycle: 'four-stroke',
  firingOrder: '1-3-4-2', boreMm: 80.26, strokeMm: 88.9, conRodMm: 155.6, compressionRatio: 8.3, idleRpm: 750, crankingRpm: 180,
  redlineRpm: 5800, systemVoltageV: 12, earthPolarity: 'positive', charging: 'dynamo', pointsDwellDeg: 54, pointsGapMm: 0.38,
  pointsFloatRpm: null, staticTimingDegBtdc: 8, advanceCurve: [{ rpm: 1000, advanceDeg: 0 }, { rpm: 3500, advanceDeg: 22 }],
  existing: { trigger: 'points', coilPartId: 10, ballast: 'none', ballastPartId: null, crankingBypass: false, condenserUf: 0.22, tachPartId: 40, leadsPartId: 50, plugPartId: 60, plugGapMm: 0.64 },
  conditions: { crankingSupplyV: 9.1, ambientC: -1 },
  updatedAt: '2024-05-01T00:00:00.000Z',
});
const parts: Part[] = [
  { id: 10, kind: 'coil', name: 'Standard coil', notes: '', primaryResistanceOhm20C: 3.2, primaryInductanceH: 0.008, secondaryResistanceOhm: 8500, turnsRatio: 95, secondaryInductanceH: null, forBallast: false, ratedVoltageV: 12, maxDissipationW: null },
  { id: 11, kind: 'coil', name: 'Ballast coil', notes: '', primaryResistanceOhm20C: 1.5, primaryInductanceH: 0.005, secondaryResistanceOhm: 7000, turnsRatio: null, secondaryInductanceH: 50, forBallast: true, ratedVoltageV: 12, maxDissipationW: 60 },
  { id: 20, kind: 'ballast', name: 'Iron ballast', notes: '', ballastType: 'iron-wire', coldResistanceOhm: 1.5, thermalResistanceKPerW: 10 },
  { id: 30, kind: 'module', name: 'Limiter', notes: '', moduleType: 'breakerless-current-limited', supplyMinV: 6, supplyMaxV: 16, earthPolarities: ['negative', 'positive'], minCoilResistanceOhm: 0.8, maxCurrentA: 8, currentLimitA: 5.5, switchSaturationV: 1.6, primaryClampV: 380, fixedDutyFraction: null, maxDutyFraction: 0.75, stallShutOff: true, maxSparkRateHz: 500, tachOutput: true, needsSuppressedLeads: true, cd: null },
  { id: 31, kind: 'module', name: 'Discharger', notes: '', moduleType: 'capacitive-discharge', supplyMinV: 8, supplyMaxV: 16, earthPolarities: ['negative', 'positive'], minCoilResistanceOhm: 0, maxCurrentA: 10, currentLimitA: null, switchSaturationV: 1, primaryClampV: null, fixedDutyFraction: null, maxDutyFraction: null, stallShutOff: true, maxSparkRateHz: 600, tachOutput: true, needsSuppressedLeads: false, cd: { capacitorUf: 1, chargeVoltageV: 420, chargerPowerW: 50, multiSparkBelowRpm: 3000 } },
  { id: 40, kind: 'tach', name: 'Dash tach', notes: '', senses: 'coil-negative-pulses' },
  { id: 50, kind: 'leads', name: 'Carbon leads', notes: '', core: 'carbon', resistancePerLeadOhm: 6000 },
  { id: 60, kind: 'plug', name: 'Plug', notes: '', resistor: false, resistorOhm: 0, gapMinMm: 0.6, gapMaxMm: 0.9 },
].map((p) => partSchema.parse({ ...p, updatedAt: '2024-05-01T00:00:00.000Z' }));
const plan: Plan = planSchema.parse({ id: 5, engineId: 1, name: 'Limiter conversion', notes: '', status: 'draft', moduleId: 30, coilId: 11, ballastId: null, crankingBypass: false, moduleFeed: 'switched-15', tachId: null, leadsId: null, plugId: null, plugGapMm: 0.7, updatedAt: '2024-05-01' });
const readings: Reading[] = [
  { id: 1, planId: 5, quantity: 'coil-primary-resistance', value: 1.38, unit: 'ohm', takenOn: '2024-05-02', note: '' },
  { id: 2, planId: 5, quantity: 'coil-primary-resistance', value: 1.41, unit: 'ohm', takenOn: '2024-05-03', note: 'second meter' },
  { id: 3, planId: 5, quantity: 'supply-voltage-cranking', value: 9.3, unit: 'V', takenOn: '2024-05-03', note: '' },
].map((r) => readingSchema.parse({ ...r, updatedAt: '2024-05-03T00:00:00.000Z' }));

describe('setup adapter', () => {
  it('converts millimetres to metres and keeps the engine figures', () => {
    const e = engineSpec(storedEngine);
    expect(e.boreM).toBeCloseTo(0.08026, 8);
    expect(e.conRodM).toBeCloseTo(0.1556, 8);
    expect(e.earthPolarity).toBe('positive');
  });

  it('marks engine conditions as overrides and a measured cranking voltage as measured', () => {
    const c = conditionInputs(storedEngine, readings);
    expect(c.ambientC).toEqual({ value: -1, provenance: 'engine override' });
    expect(c.crankingSupplyV).toEqual({ value: 9.3, provenance: 'measured' });
    expect(conditionInputs(storedEngine).crankingSupplyV).toEqual({ value: 9.1, provenance: 'engine override' });
  });

  it('lets a measured coil primary resistance override the catalogue value, marked measured', () => {
    const s = planSetupSpec(storedEngine, plan, parts, readings);
    // Latest reading (1.41 ohm) read at the engine's ambient of -1 degC, corrected to 20 degC by the
    // copper law (IACS 0.00393 /K): 1.41 / (1 + 0.00393 x -21) = 1.5407 ohm.
    expect(s.coil.primaryResistanceOhm20C.provenance).toBe('measured');
    expect(s.coil.primaryResistanceOhm20C.value).toBeCloseTo(1.41 / (1 - 0.00393 * 21), 6);
    const r = checkSetup(engineSpec(storedEngine), s, conditionInputs(storedEngine, readings));
    expect(r.inputs.find((f) => f.name.startsWith('coil primary'))?.provenance).toBe('measured');
    expect(r.inputs.find((f) => f.name === 'crankingSupplyV')?.provenance).toBe('measured');
    // Without readings the catalogue value stands.
    expect(planSetupSpec(storedEngine, plan, parts).coil.primaryResistanceOhm20C).toEqual({ value: 1.5, provenance: 'catalogue' });
  });

  it('builds the existing points setup with its condenser in farad and its plug range in metres', () => {
    const s = existingSetupSpec(storedEngine, parts);
    expect(s.switching).toBe('points');
    expect(s.condenserF).toBeCloseTo(0.22e-6, 12);
    expect(s.plug?.gapMaxM).toBeCloseTo(0.9e-3, 12);
    expect(s.tach?.senses).toBe('coil-negative-pulses');
  });

  it('takes the switching from the module, drops the condenser, and keeps the existing tach, leads and plug', () => {
    const s = planSetupSpec(storedEngine, plan, parts);
    expect(s.switching).toBe('breakerless-current-limited');
    expect(s.condenserF).toBeNull();
    expect(s.leads?.name).toBe('Carbon leads');
    expect(s.coil.turnsRatio).toBeNull();
    expect(s.coil.secondaryInductanceH).toBe(50);
  });

  it('converts a CD module\'s capacitor from microfarad to farad', () => {
    const s = planSetupSpec(storedEngine, { ...plan, moduleId: 31 }, parts);
    expect(s.module?.cd?.capacitorF).toBeCloseTo(1e-6, 12);
  });

  it('refuses a part of the wrong kind with a plain sentence', () => {
    expect(() => planSetupSpec(storedEngine, { ...plan, coilId: 20 }, parts)).toThrow(SetupAdapterError);
    expect(() => planSetupSpec(storedEngine, { ...plan, coilId: 99 }, parts)).toThrow(/not in the parts list/);
  });

  it('feeds the comparison and the parts-bin search end to end', () => {
    const cmp = compareSetups(comparisonInput(storedEngine, [plan, { ...plan, id: 6, name: 'CD conversion', moduleId: 31, coilId: null }], parts, new Map([[5, readings]])));
    expect(cmp.rows.map((r) => r.label)).toEqual(['Existing setup', 'Limiter conversion', 'CD conversion']);
    const found = searchBest(searchInput(storedEngine, parts, 3));
    // 2 coils x 2 modules x (none + 1 ballast x 2 bypass options) = 12 combinations.
    expect(found.evaluated).toBe(12);
    expect(found.top).toHaveLength(3);
  });
});
