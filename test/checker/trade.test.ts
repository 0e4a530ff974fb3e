/**
 * Trade facts (common practice) and behaviour a restorer knows from the workshop.
 */
import { describe, expect, it } from 'vitest';
import { checkSetup, ironBallastResistanceOhm, sparkRateHz } from '../../electron/checker/index.js';
import { ballastCoil, coil, fourCylinder, ironBallast, module, moduleSetup, pointsSetup } from './fixtures.js';

describe('trade facts (common practice)', () => {
  it('fires rpm x cylinders / 120 sparks a second on a four-stroke', () => {
    expect(sparkRateHz(6000, 4, 'four-stroke')).toBe(200);
    expect(sparkRateHz(6000, 8, 'four-stroke')).toBe(400);
    expect(sparkRateHz(6000, 2, 'two-stroke')).toBe(200);
  });

  it('gives 20 to 30 kV from points with a coil of about 100:1', () => {
    const r = checkSetup(fourCylinder, pointsSetup());
    const kv = r.keyPoints.idle.availableV / 1000;
    expect(kv).toBeGreaterThan(20);
    expect(kv).toBeLessThan(30);
  });

  it('loses points energy at high rpm while a current-limited module holds it further', () => {
    // A low-resistance, low-inductance coil that a current-limited module can drive hard.
    const fast = coil({ name: 'Fast coil', primaryResistanceOhm20C: { value: 0.8, provenance: 'catalogue' }, primaryInductanceH: 0.004 });
    const pts = checkSetup(fourCylinder, pointsSetup({ coil: coil() }));
    const cl = checkSetup(fourCylinder, moduleSetup(module({ currentLimitA: 6, maxCurrentA: 10, minCoilResistanceOhm: 0.5 }), { coil: fast }));
    const ratio = (r: typeof pts, rpm: 'idle' | 'redline') => r.keyPoints[rpm].storedEnergyJ;
    expect(ratio(pts, 'redline')).toBeLessThan(0.75 * ratio(pts, 'idle'));
    expect(ratio(cl, 'redline') / ratio(cl, 'idle')).toBeGreaterThan(ratio(pts, 'redline') / ratio(pts, 'idle'));
    // The module holds its limit well past mid-range.
    expect(cl.keyPoints.mid.currentAtBreakA).toBeCloseTo(6, 6);
  });

  it('fails key-on heat for a 1.5 ohm ballast coil on 14 V without its ballast (about 9 A, over 100 W)', () => {
    const r = checkSetup(fourCylinder, pointsSetup({ coil: ballastCoil(), ballast: null }));
    // 14 V over 1.5 ohm coil (cold, 20 degC: the key-on case starts from cold) + 0.1 ohm harness
    // + 0.1 ohm points contact (both from memory) = 8.235 A by Ohm's law; I^2 R in the coil 101.7 W.
    expect(r.keyOn.currentA).toBeCloseTo(14 / (1.5 + 0.1 + 0.1), 6);
    expect(r.keyOn.currentA).toBeCloseTo(8.235, 3);
    expect(r.keyOn.coilDissipationW).toBeCloseTo((14 / 1.7) ** 2 * 1.5, 4);
    expect(r.keyOn.coilDissipationW).toBeGreaterThan(100);
    expect(r.rules.find((x) => x.id === 'key-on-heat')?.verdict).toBe('fail');
  });

  it('raises an iron ballast\'s resistance as it heats, and more than a linear 0.005 /K says when hot', () => {
    const cold = ironBallastResistanceOhm(1.5, 293.15);
    const warm = ironBallastResistanceOhm(1.5, 400);
    const hot = ironBallastResistanceOhm(1.5, 600);
    expect(cold).toBeCloseTo(1.5, 6);
    expect(warm).toBeGreaterThan(cold);
    expect(hot).toBeGreaterThan(warm);
    expect(hot).toBeGreaterThan(1.5 * (1 + 0.005 * (600 - 293.15)));
    const r = checkSetup(fourCylinder, pointsSetup({ coil: ballastCoil(), ballast: ironBallast(), crankingBypass: true }));
    expect(r.circuit.ballastResistanceHotOhm).toBeGreaterThan(r.circuit.ballastResistanceColdOhm);
    expect(r.circuit.ballastTemperatureHotK).toBeGreaterThan(273.15 + 80);
  });

  it('restores the cranking current when the cranking bypass removes the ballast', () => {
    const without = checkSetup(fourCylinder, pointsSetup({ coil: ballastCoil(), ballast: ironBallast(), crankingBypass: false }));
    const withBypass = checkSetup(fourCylinder, pointsSetup({ coil: ballastCoil(), ballast: ironBallast(), crankingBypass: true }));
    expect(withBypass.keyPoints.cranking.currentAtBreakA).toBeGreaterThan(without.keyPoints.cranking.currentAtBreakA * 1.3);
  });

  it('gives a magneto a weak spark when cranked and its rated current at full output', () => {
    const r = checkSetup(fourCylinder, pointsSetup({ switching: 'magneto', magneto: { ratedCurrentA: 3, fullOutputRpm: 2000 } }));
    expect(r.keyPoints.cranking.currentAtBreakA).toBeLessThan(1.5);
    const at2000 = r.points.reduce((a, b) => (Math.abs(b.rpm - 2000) < Math.abs(a.rpm - 2000) ? b : a));
    expect(at2000.currentAtBreakA).toBeGreaterThan(2.7);
    expect(r.keyOn.currentFlows).toBe(false);
  });
});
