/**
 * The engine editor's working conditions (renderer/screens/engines/form-model.ts and
 * conditions-text.ts): typed in workshop units and stored in SI (SI prefixes: kilo 10^3, milli
 * 10^-3, pico 10^-12), a blank box stored as absent, a bad value refused on its own path, and the
 * default with its label shown beside a blank box.
 */
import { describe, expect, it } from 'vitest';
import { conditionByKey, type Engine } from '../../db/schema.js';
import { conditionLabel, defaultsContext, provenanceText } from '../../renderer/screens/engines/conditions-text.js';
import { engineToForm, formToInput } from '../../renderer/screens/engines/form-model.js';
import { engineIn } from '../db/samples.js';

const stored = (conditions: Engine['conditions']): Engine => ({ ...engineIn(), conditions, id: 7 }) as Engine;

describe('working conditions in the engine form', () => {
  it('shows stored SI values in the typed unit and stores typed values in SI', () => {
    const f = engineToForm(stored({ ambientPressurePa: 84_000, secondaryCapacitanceF: 9e-11, currentLimitHoldS: 0.0008, secondaryCeilingV: 30_000 }), 'mm');
    expect(f.conditions.ambientPressurePa).toBe('84'); // 84 000 Pa = 84 kPa
    expect(f.conditions.secondaryCapacitanceF).toBe('90'); // 9 x 10^-11 F = 90 pF
    expect(f.conditions.currentLimitHoldS).toBe('0.8'); // 8 x 10^-4 s = 0.8 ms
    expect(f.conditions.secondaryCeilingV).toBe('30'); // 30 000 V = 30 kV
    expect(f.conditions.ambientC).toBe('');
    const typed = { ...f, conditions: { ...f.conditions, ambientC: '-18', fouledShuntOhm: '250', ambientPressurePa: '' } };
    const r = formToInput(typed);
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    // Blank = the default: the key is left out, not stored as zero.
    expect(r.input.conditions).toEqual({ ambientC: -18, fouledShuntOhm: 250_000, secondaryCapacitanceF: 9e-11, currentLimitHoldS: 0.0008, secondaryCeilingV: 30_000 });
  });

  it('refuses a value outside its range beside that box, in the typed unit', () => {
    const f = engineToForm(stored({}), 'mm');
    const r = formToInput({ ...f, conditions: { ...f.conditions, couplingK: '1', ambientPressurePa: '30' } });
    expect(r.ok).toBe(false);
    if (r.ok) return;
    expect(r.errors['conditions.couplingK']).toMatch(/^Coil coupling between windings must be from 0\.9 to 0\.9999\./);
    // Beside a box typed in kPa the plan file's pascal key is left out of the sentence.
    expect(r.errors['conditions.ambientPressurePa']).toBe('Air pressure must be from 50 to 110 kPa. Sea level is 101.3 kPa; 50 kPa is higher than any road.');
    const words = formToInput({ ...f, conditions: { ...f.conditions, marginRatio: 'plenty' } });
    expect(words.ok ? '' : words.errors['conditions.marginRatio']).toContain('Voltage margin wanted must be a number');
  });

  it('says where each value comes from: the default with its label, or this engine’s own', () => {
    const f = engineToForm(stored({}), 'mm');
    const six = defaultsContext({ ...f, systemVoltageV: '6' });
    // 6 V running supply: 7.2 V (from memory); 12 V: 14 V, the middle of a 13.5 to 14.5 V regulated range (workshop documentation).
    expect(provenanceText(conditionByKey.runningSupplyV, '', six)).toMatch(/^Blank: 7\.2 V, default \(from memory\)\. A reading taken on a plan’s wiring sheet wins/);
    expect(provenanceText(conditionByKey.runningSupplyV, '13.8', defaultsContext(f))).toMatch(/^Set for this engine \(engine override\); blank gives 14 V, default \(workshop documentation\)\./);
    // The cranking default follows the air temperature typed: 8.5 V at -18 degC (workshop load-test table).
    const cold = defaultsContext({ ...f, conditions: { ...f.conditions, ambientC: '-18' } });
    expect(provenanceText(conditionByKey.crankingSupplyV, '', cold)).toMatch(/^Blank: 8\.5 V, default \(workshop documentation\)\./);
    expect(conditionLabel(conditionByKey.volumetricEfficiency)).toBe('Volumetric efficiency (0.3 to 1.3)');
    expect(conditionLabel(conditionByKey.ambientPressurePa)).toBe('Air pressure (kPa)');
  });
});
