/** The deck exporter is pure: no Node built-ins, no Electron, no DOM, no database (architecture.md). */
import { readdirSync, readFileSync } from 'node:fs';
import { join, resolve } from 'node:path';
import { describe, expect, it } from 'vitest';
import { checkSetup, DEFAULT_COUPLING_K } from '../../electron/checker/index.js';
import { buildDeck, circuitFromReport, DeckError, defaultCouplingK, spiceNumber } from '../../electron/spice/index.js';
import { cdModule, fourCylinder, moduleSetup, pointsSetup } from '../checker/fixtures.js';

const dir = resolve(import.meta.dirname, '../../electron/spice');

describe('electron/spice', () => {
  it('imports only its own modules and the pure checker', () => {
    for (const file of readdirSync(dir).filter((f) => f.endsWith('.ts'))) {
      const text = readFileSync(join(dir, file), 'utf8');
      for (const m of text.matchAll(/from\s+'([^']+)'/g)) {
        const spec = m[1]!;
        expect(spec.startsWith('./') || spec === '../checker/index.js', `${file} imports ${spec}`).toBe(true);
      }
    }
  });

  it('writes mega as Meg and milli as m (SPICE reads M as milli)', () => {
    expect(spiceNumber(100e6)).toBe('100Meg');
    expect(spiceNumber(8e-3)).toBe('8m');
    expect(spiceNumber(0.25e-6)).toBe('250n');
    expect(spiceNumber(80e-12)).toBe('80p');
    expect(() => spiceNumber(Number.NaN)).toThrow();
  });

  it('draws its coupling element with the k the checker\'s capacitive-discharge closed form uses (one labelled default)', () => {
    const circuit = {
      title: 'coupling',
      primary: { supplyV: 14, harnessResistanceOhm: 0.1, ballastResistanceOhm: 0, coilResistanceOhm: 3, primaryInductanceH: 8e-3, contactResistanceOhm: 0, switchDropV: 0, currentLimitA: null, dwellS: 3e-3, condenserF: null, primaryClampV: null },
      secondary: { turnsRatio: 100, secondaryCapacitanceF: 70e-12, secondaryResistanceOhm: 8000 },
      cd: { capacitorF: 1e-6, chargeVoltageV: 400 },
    };
    expect(defaultCouplingK).toBe(DEFAULT_COUPLING_K.value);
    expect(DEFAULT_COUPLING_K.provenance).toBe('default (from memory)');
    for (const scenario of ['break', 'cd'] as const) {
      const k = /^K1 L1 L2 (\S+)$/m.exec(buildDeck(circuit, scenario).text);
      expect(Number(k?.[1]), scenario).toBe(DEFAULT_COUPLING_K.value);
    }
  });

  it("draws the engine's own coupling (its resolved working condition) in decks made from a report, and a deck option still wins", () => {
    // 0.98 is the low end of the 0.98 to 0.999 quoted for oil-filled canister coils (from memory); any value other than the default shows the point.
    const conditions = { couplingK: { value: 0.98, provenance: 'engine override' as const } };
    for (const [scenario, spec] of [['break', pointsSetup()], ['cd', moduleSetup(cdModule())]] as const) {
      const report = checkSetup(fourCylinder, spec, conditions, { skipGapSuggestion: true });
      expect(report.circuit.couplingK).toBe(0.98);
      const circuit = circuitFromReport(spec, report, 3000);
      expect(Number(/^K1 L1 L2 (\S+)$/m.exec(buildDeck(circuit, scenario).text)?.[1]), scenario).toBe(0.98);
      expect(Number(/^K1 L1 L2 (\S+)$/m.exec(buildDeck(circuit, scenario, { couplingK: 0.999 }).text)?.[1]), scenario).toBe(0.999);
    }
  });

  it('refuses a circuit with an impossible value, naming the field', () => {
    const bad = {
      title: 'bad',
      primary: { supplyV: 14, harnessResistanceOhm: 0, ballastResistanceOhm: 0, coilResistanceOhm: -3, primaryInductanceH: 8e-3, contactResistanceOhm: 0, switchDropV: 0, currentLimitA: null, dwellS: 3e-3, condenserF: null, primaryClampV: null },
      secondary: { turnsRatio: 100, secondaryCapacitanceF: 70e-12, secondaryResistanceOhm: 8000 },
      cd: null,
    };
    expect(() => buildDeck(bad, 'break')).toThrow(DeckError);
    expect(() => buildDeck(bad, 'break')).toThrow(/primary\.coilResistanceOhm: must be more than 0/);
    expect(() => buildDeck({ ...bad, primary: { ...bad.primary, coilResistanceOhm: 3 } }, 'cd')).toThrow(/cd: a capacitive-discharge deck needs/);
  });
});
