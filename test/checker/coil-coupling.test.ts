/**
 * The coil's own coupling, when its maker gives one, wins over the engine's working condition for
 * the capacitive-discharge peak (the only figure that uses it: the transfer rings through the
 * leakage inductance 2 (1 - k) Lp, the usual two-winding leakage model), and the report says where
 * the value came from. The store refuses an implausible coupling beside the field.
 */
import { describe, expect, it } from 'vitest';
import { coil as coilSchema } from '../../db/schema.js';
import { checkSetup } from '../../electron/checker/index.js';
import { cdModule, coil, fourCylinder, moduleSetup } from './fixtures.js';

const options = { rpmPoints: 40, skipGapSuggestion: true };
const idlePeak = (r: ReturnType<typeof checkSetup>): number => r.keyPoints.idle.availableV;

describe('the coil coupling', () => {
  it('gives the same CD peak from the coil as from the engine condition, and another than the default', () => {
    const fromCoil = checkSetup(fourCylinder, moduleSetup(cdModule(), { coil: coil({ couplingK: 0.98 }) }), undefined, options);
    const fromEngine = checkSetup(fourCylinder, moduleSetup(cdModule()), { couplingK: { value: 0.98, provenance: 'engine override' } }, options);
    const byDefault = checkSetup(fourCylinder, moduleSetup(cdModule()), undefined, options);
    expect(idlePeak(fromCoil)).toBe(idlePeak(fromEngine));
    expect(idlePeak(fromCoil)).not.toBeCloseTo(idlePeak(byDefault), 0);
    const figure = fromCoil.inputs.find((f) => f.name === 'coil coupling coefficient')!;
    expect(figure).toMatchObject({ value: 0.98, provenance: 'catalogue' });
  });

  it('the coil wins over an engine condition', () => {
    const both = checkSetup(fourCylinder, moduleSetup(cdModule(), { coil: coil({ couplingK: 0.999 }) }), { couplingK: { value: 0.98, provenance: 'engine override' } }, options);
    const coilOnly = checkSetup(fourCylinder, moduleSetup(cdModule(), { coil: coil({ couplingK: 0.999 }) }), undefined, options);
    expect(idlePeak(both)).toBe(idlePeak(coilOnly));
  });

  it('the store refuses a coupling of 1 or more, or of 0.9 or less, beside the field', () => {
    const base = { kind: 'coil', name: 'Coil', notes: '', primaryResistanceOhm20C: 3, primaryInductanceH: 0.008, secondaryResistanceOhm: 8000, turnsRatio: 90, secondaryInductanceH: null, forBallast: false, ratedVoltageV: 12, maxDissipationW: null };
    for (const k of [1, 1.2, 0.9, 0.5]) {
      const r = coilSchema.safeParse({ ...base, couplingK: k });
      expect(r.success, String(k)).toBe(false);
      expect(r.error!.issues[0]!.path).toEqual(['couplingK']);
    }
    expect(coilSchema.safeParse({ ...base, couplingK: 0.995 }).success).toBe(true);
    expect(coilSchema.safeParse({ ...base, couplingK: null }).success).toBe(true);
  });
});
