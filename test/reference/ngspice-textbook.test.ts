/**
 * ngspice against closed forms and published worked examples, before it is trusted to judge the
 * checker. Each check names its source.
 */
import { describe, expect, it } from 'vitest';
import { buildDeck, type SpiceCircuit } from '../../electron/spice/index.js';
import { missingNgspiceMessage, requireNgspice, runNgspice } from './ngspice.js';

/** A bare coil on a battery: only the winding resistance, no feed, ballast or switch drop. */
function bareCoil(supplyV: number, ohm: number, henry: number, dwellS: number, extra: Partial<SpiceCircuit['primary']> = {}): SpiceCircuit {
  return {
    title: 'textbook coil',
    primary: {
      supplyV,
      harnessResistanceOhm: 0,
      ballastResistanceOhm: 0,
      // The ideal switch adds 1 mohm; take it off the winding so the loop is exactly `ohm`.
      coilResistanceOhm: ohm - 1e-3,
      primaryInductanceH: henry,
      contactResistanceOhm: 0,
      switchDropV: 0,
      currentLimitA: null,
      dwellS,
      condenserF: null,
      primaryClampV: null,
      ...extra,
    },
    secondary: { turnsRatio: 100, secondaryCapacitanceF: 80e-12, secondaryResistanceOhm: 0 },
    cd: null,
  };
}

describe('ngspice as a reference', () => {
  it('is installed (the reference tests fail, never skip, without it)', () => {
    expect(() => requireNgspice()).not.toThrow();
    expect(() => requireNgspice('/nonexistent')).toThrow(missingNgspiceMessage);
  });

  it('steps an RL branch to 2.110533 A at 2 ms and 3.905929 A at 10 ms (12 V, 3 ohm, 8 mH)', () => {
    // Closed form i = V/R (1 - exp(-t R / L)): 2.110534 A and 3.905929 A (any circuits text, the
    // first-order step response; the deck is the one in ngspice-notes.md).
    const deck = [
      'RL step',
      'V1 in 0 PWL(0 0 1n 12)',
      'R1 in n1 3',
      'L1 n1 0 8m',
      '.tran 1u 20m 0 1u',
      '.meas tran i2 FIND i(L1) AT=2m',
      '.meas tran i10 FIND i(L1) AT=10m',
      '.end',
      '',
    ].join('\n');
    const r = runNgspice(deck, ['i2', 'i10']);
    const closed = (t: number): number => 4 * (1 - Math.exp((-t * 3) / 8e-3));
    expect(closed(2e-3)).toBeCloseTo(2.110534, 6);
    expect(r.measures.i2!.value).toBeCloseTo(2.110533, 5);
    expect(r.measures.i10!.value).toBeCloseTo(3.905929, 5);
    expect(Math.abs(r.measures.i2!.value - closed(2e-3))).toBeLessThan(2e-6);
  });

  it('charges the automobile ignition example to 3 A and 27 mJ (12 V, 4 ohm, 6 mH)', () => {
    // Alexander & Sadiku, Fundamentals of Electric Circuits, section 7.9: final current V/R = 3 A,
    // stored energy 0.5 L i^2 = 27 mJ. Ten time constants of dwell reach the final value.
    const c = bareCoil(12, 4, 6e-3, 10 * (6e-3 / 4));
    const d = buildDeck(c, 'charge');
    const r = runNgspice(d.text, d.measures);
    expect(r.measures.ibreak_a!.value).toBeCloseTo(3 * (1 - Math.exp(-10)), 3);
    expect(r.measures.ecoil_j!.value).toBeCloseTo(0.027, 4);
    // The integral of the power into L1 is an independent route to the same energy.
    expect(Math.abs(r.measures.einteg_j!.value / 0.027 - 1)).toBeLessThan(0.002);
  });

  it('opens 4.0 A into a coupled coil with a condenser: first peak about -35.0 kV against 34.9 kV lossless', () => {
    // ngspice-notes.md: L1 8 mH, L2 80 H (n = 100), K 0.99, 0.25 uF across the switch, 80 pF on the
    // tower: -35.0 kV about 133 us after opening; lossless sqrt(2E / (C2 + C1/n^2)) = 34.9 kV.
    const c = bareCoil(12, 3, 8e-3, 30e-3, { condenserF: 0.25e-6 });
    const d = buildDeck(c, 'break', { couplingK: 0.99 });
    const r = runNgspice(d.text, d.measures);
    const i = r.measures.ibreak_a!.value;
    expect(i).toBeCloseTo(4.0, 2);
    const lossless = i * Math.sqrt(8e-3 / (80e-12 + 0.25e-6 / 1e4));
    expect(lossless).toBeGreaterThan(34.8e3);
    expect(lossless).toBeLessThan(35.0e3);
    const peak = r.measures.vpeak_v!;
    expect(peak.value / -35.0e3).toBeGreaterThan(0.99);
    expect(peak.value / -35.0e3).toBeLessThan(1.01);
    expect(peak.atS! - d.eventS).toBeGreaterThan(120e-6);
    expect(peak.atS! - d.eventS).toBeLessThan(150e-6);
  });

  it('gives the same secondary peak when the largest timestep is quartered (the numerics have converged)', () => {
    const c = bareCoil(14, 3.2, 8e-3, 4e-3, { condenserF: 0.22e-6 });
    const coarse = runNgspice(buildDeck(c, 'break').text, ['vpeak_v']);
    const fine = runNgspice(buildDeck(c, 'break', { timestepRefinement: 4 }).text, ['vpeak_v']);
    expect(Math.abs(coarse.measures.vpeak_v!.value / fine.measures.vpeak_v!.value - 1)).toBeLessThan(1e-3);
  });

  it('moves the inductive peak by well under 1 % between k = 0.995 and k = 0.999 (why k = 0.995 stands in for ideal coupling)', () => {
    const c = bareCoil(14, 3.2, 8e-3, 6e-3, { condenserF: 0.22e-6 });
    const a = runNgspice(buildDeck(c, 'break', { couplingK: 0.995 }).text, ['vpeak_v']);
    const b = runNgspice(buildDeck(c, 'break', { couplingK: 0.999 }).text, ['vpeak_v']);
    expect(Math.abs(a.measures.vpeak_v!.value / b.measures.vpeak_v!.value - 1)).toBeLessThan(0.01);
  });

  it('transfers a lossless CD charge at 2 C V / (C + n^2 Cs) times n (1 uF at 400 V, n = 100, 80 pF)', () => {
    // Resonant charge sharing between two capacitors through an inductance (any circuits text):
    // the receiving capacitor peaks at 2 C V / (C + C'); here 44.4 kV. With almost no loop
    // resistance ngspice must land within 1 % of it; the leakage inductance is only the path.
    const c = { ...bareCoil(12, 2e-3, 8e-3, 1e-3), cd: { capacitorF: 1e-6, chargeVoltageV: 400 } };
    const d = buildDeck(c, 'cd', { couplingK: 0.999 });
    const r = runNgspice(d.text, d.measures);
    const ideal = (100 * 2 * 1e-6 * 400) / (1e-6 + 1e4 * 80e-12);
    expect(r.measures.ecap_j!.value).toBeCloseTo(0.08, 4);
    expect(Math.abs(r.measures.vpeak_v!.value) / ideal).toBeGreaterThan(0.99);
    expect(Math.abs(r.measures.vpeak_v!.value) / ideal).toBeLessThan(1.01);
  });
});
