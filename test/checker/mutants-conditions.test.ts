/**
 * The working conditions: the cranking floor from the battery load-test table, the defaults with
 * the label of where each came from, the unit of each, and how a caller's value overrides one.
 * Written against the mutation-testing survivors (npm run mutate).
 */
import { describe, expect, it } from 'vitest';
import { conditionUnits, crankingFloorV, defaultConditions, kelvin, resolveConditions } from '../../electron/checker/conditions.js';
import type { ConditionName } from '../../electron/checker/index.js';
import { fourCylinder } from './fixtures.js';

// Battery load-test pass floor, as printed in workshop manuals: 9.6 / 9.4 / 9.1 / 8.7 / 8.5 V at
// 21 / 10 / -1 / -12 / -18 degC.
describe('cranking floor from the battery load-test table', () => {
  it('gives the printed value at each row', () => {
    expect(crankingFloorV(21)).toBe(9.6);
    expect(crankingFloorV(10)).toBe(9.4);
    expect(crankingFloorV(-1)).toBe(9.1);
    expect(crankingFloorV(-12)).toBe(8.7);
    expect(crankingFloorV(-18)).toBe(8.5);
  });
  it('interpolates linearly between rows (worked by hand)', () => {
    // Half-way from 10 to 21 degC: 9.4 + 0.2 x 5.5 / 11 = 9.5 V.
    expect(crankingFloorV(15.5)).toBeCloseTo(9.5, 12);
    // 0 degC, between -1 (9.1 V) and 10 (9.4 V): 9.1 + 0.3 x 1 / 11.
    expect(crankingFloorV(0)).toBeCloseTo(9.1 + (0.3 * 1) / 11, 12);
    // -15 degC, between -18 (8.5) and -12 (8.7): 8.5 + 0.2 x 3 / 6 = 8.6 V.
    expect(crankingFloorV(-15)).toBeCloseTo(8.6, 12);
  });
  it('holds flat beyond both ends', () => {
    expect(crankingFloorV(-40)).toBe(8.5);
    expect(crankingFloorV(-18.0001)).toBe(8.5);
    expect(crankingFloorV(40)).toBe(9.6);
    expect(crankingFloorV(21.0001)).toBe(9.6);
    expect(crankingFloorV(Number.NaN)).toBe(8.5);
  });
});

describe('the defaults and where each comes from', () => {
  it('labels each default with its source', () => {
    const c = defaultConditions(fourCylinder);
    // Workshop manuals: the regulated running supply and the load-test floor.
    expect(c.runningSupplyV).toEqual({ value: 14.0, provenance: 'default (workshop documentation)' });
    // 20 degC, between 10 degC (9.4 V) and 21 degC (9.6 V): 9.4 + 0.2 x 10 / 11.
    expect(c.crankingSupplyV.value).toBeCloseTo(9.4 + (0.2 * 10) / 11, 12);
    expect(c.crankingSupplyV.provenance).toBe('default (workshop documentation)');
    expect(c.ambientC).toEqual({ value: 20, provenance: 'default (common practice)' });
    expect(c.underBonnetC).toEqual({ value: 80, provenance: 'default (common practice)' });
    expect(c.ambientPressurePa).toEqual({ value: 101_325, provenance: 'default (standard value)' });
    expect(c.harnessResistanceOhm).toEqual({ value: 0.1, provenance: 'default (from memory)' });
    expect(c.marginRatio).toEqual({ value: 1.25, provenance: 'default (common practice)' });
    expect(c.restingBatteryV).toEqual({ value: 12.4, provenance: 'default (common practice)' });
    expect(c.couplingK).toEqual({ value: 0.995, provenance: 'default (from memory)' });
  });
  it('gives a 6 V car its own supplies: 7.2 V charging, half the 12 V cranking floor, 6.2 V at rest', () => {
    const c = defaultConditions({ ...fourCylinder, systemVoltageV: 6 }, 21);
    expect(c.runningSupplyV).toEqual({ value: 7.2, provenance: 'default (from memory)' });
    expect(c.crankingSupplyV).toEqual({ value: 9.6 / 2, provenance: 'default (from memory)' });
    expect(c.restingBatteryV).toEqual({ value: 6.2, provenance: 'default (common practice)' });
  });
  it('gives every condition its SI unit', () => {
    const expected: Record<ConditionName, string> = {
      runningSupplyV: 'V', crankingSupplyV: 'V', harnessResistanceOhm: 'ohm', ambientC: 'degC', underBonnetC: 'degC',
      volumetricEfficiency: '', ambientPressurePa: 'Pa', inletChargeC: 'degC', pointsContactResistanceOhm: 'ohm',
      secondaryCapacitanceF: 'F', transferEfficiency: '', arcVoltageV: 'V', fouledShuntOhm: 'ohm',
      ballastThermalResistanceKPerW: 'K/W', coilDissipationLimitW: 'W', currentLimitHoldS: 's', marginRatio: '',
      polytropicIndex: '', couplingK: '', dynamoCutInRpm: 'rpm', restingBatteryV: 'V', secondaryCeilingV: 'V',
    };
    expect(conditionUnits).toEqual(expected);
  });
});

describe('a caller\'s values over the defaults', () => {
  it('takes a finite value with its label, and the cranking default follows the ambient temperature given', () => {
    const c = resolveConditions(fourCylinder, { ambientC: { value: -12, provenance: 'measured' }, runningSupplyV: { value: 13.6, provenance: 'engine override' } });
    expect(c.ambientC).toEqual({ value: -12, provenance: 'measured' });
    expect(c.runningSupplyV).toEqual({ value: 13.6, provenance: 'engine override' });
    // The load-test floor at -12 degC is 8.7 V.
    expect(c.crankingSupplyV.value).toBe(8.7);
  });
  it('ignores a non-finite value (the default stands) and an ambient of NaN', () => {
    const c = resolveConditions(fourCylinder, { ambientC: { value: Number.NaN, provenance: 'measured' }, harnessResistanceOhm: { value: Number.POSITIVE_INFINITY, provenance: 'measured' } });
    expect(c.ambientC).toEqual({ value: 20, provenance: 'default (common practice)' });
    expect(c.harnessResistanceOhm).toEqual({ value: 0.1, provenance: 'default (from memory)' });
    // 0 degC is a real temperature, not "none given": the floor there is 9.1 + 0.3 / 11 V.
    expect(resolveConditions(fourCylinder, { ambientC: { value: 0, provenance: 'measured' } }).crankingSupplyV.value).toBeCloseTo(9.1 + 0.3 / 11, 12);
  });
  it('returns the defaults untouched without inputs', () => {
    expect(resolveConditions(fourCylinder)).toEqual(defaultConditions(fourCylinder));
  });
  it('converts Celsius to kelvin by adding 273.15', () => {
    expect(kelvin(0)).toBe(273.15);
    expect(kelvin(-273.15)).toBe(0);
  });
});
