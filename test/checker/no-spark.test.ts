/**
 * Issue 6, item 5: a module whose own supply is below its minimum does not switch, so there is no
 * spark. Trade fact (common practice, and every module maker's data sheet): below the minimum
 * supply an electronic module stops switching the coil; a CD unit's charger stops below its
 * cut-out. With no coil current the stored energy 0.5 L i^2 is 0 and no secondary voltage is
 * induced, so the available voltage and the reserve are 0.
 */
import { describe, expect, it } from 'vitest';
import { checkSetup, compareSetups } from '../../electron/checker/index.js';
import { comparisonInput } from '../../electron/setup/index.js';
import { demoWorkshop } from '../reference/demo-workshop.js';
import { cdModule, coil, fourCylinder, module, moduleSetup } from './fixtures.js';

const sixVolt = { ...fourCylinder, systemVoltageV: 6 as const };
const sixVoltCoil = coil({ ratedVoltageV: 6, primaryResistanceOhm20C: { value: 1.4, provenance: 'catalogue' }, primaryInductanceH: 0.005 });

describe('a module below its minimum supply', () => {
  it('gives no spark while cranking on 6 V (cranking battery 4.79 V, from memory: half the 12 V load-test floor) when it needs 5 V', () => {
    const r = checkSetup(sixVolt, moduleSetup(module({ supplyMinV: 5, supplyMaxV: 9, currentLimitA: 4.5, maxCurrentA: 5 }), { coil: sixVoltCoil }));
    const k = r.keyPoints.cranking;
    // The module's supply while cranking is at most the battery's: 4.79 V < 5 V.
    expect(r.circuit.moduleSupplyCrankingV!).toBeLessThan(5);
    expect(k.storedEnergyJ).toBe(0);
    expect(k.currentAtBreakA).toBe(0);
    expect(k.availableV).toBe(0);
    expect(k.reserveRatio).toBe(0);
    expect(k.noSparkReason).toMatch(/^No spark while cranking: the module sees \d\.\d\d V, below the 5\.00 V it needs to switch the coil\.$/);
    expect(r.points[0]!.noSparkReason).toBe(k.noSparkReason);
    // Running (7.2 V) it sparks, and says nothing.
    expect(r.keyPoints.idle.noSparkReason).toBeNull();
    expect(r.keyPoints.idle.storedEnergyJ).toBeGreaterThan(0);
    expect(r.worstReserveRatio).toBe(0);
    expect(r.rules.find((x) => x.id === 'cranking-supply')!.verdict).toBe('fail');
    const reserve = r.rules.find((x) => x.id === 'voltage-reserve')!;
    expect(reserve.verdict).toBe('fail');
    expect(reserve.action).not.toMatch(/gap, or/i);
    expect(reserve.action).toMatch(/supply it needs/);
  });

  it('sparks when the same module needs only 4 V', () => {
    const r = checkSetup(sixVolt, moduleSetup(module({ supplyMinV: 4, supplyMaxV: 9, currentLimitA: 4.5, maxCurrentA: 5 }), { coil: sixVoltCoil }));
    expect(r.keyPoints.cranking.noSparkReason).toBeNull();
    expect(r.keyPoints.cranking.storedEnergyJ).toBeGreaterThan(0);
  });

  it('a CD unit at or below its charger cut-out gives no spark (cut-out 0.75 x minimum, from memory)', () => {
    // 6 V cranking 4.79 V; minimum 8 V gives a cut-out of 6 V: 4.79 <= 6, no charge.
    const r = checkSetup(sixVolt, moduleSetup(cdModule({ supplyMinV: 8, supplyMaxV: 16 })));
    expect(0.75 * 8).toBeGreaterThan(4.79);
    expect(r.keyPoints.cranking.storedEnergyJ).toBe(0);
    expect(r.keyPoints.cranking.availableV).toBe(0);
    expect(r.keyPoints.cranking.noSparkReason).toMatch(/cuts out/);
  });

  it('the demo flat twin: its six-volt unit sees 4.36 V against 4.5 V while cranking, so the cranking row has no spark', () => {
    const w = demoWorkshop();
    const engine = w.engines.find((e) => e.name === 'Red flat-twin light car')!;
    const plan = w.plans.find((p) => p.engineId === engine.id)!;
    const c = compareSetups(comparisonInput(engine, [plan], w.parts));
    const r = c.candidates[0]!;
    expect(r.circuit.moduleSupplyCrankingV!).toBeLessThan(4.5);
    expect(r.circuit.moduleSupplyCrankingV!).toBeGreaterThan(4.3);
    expect(r.keyPoints.cranking.storedEnergyJ).toBe(0);
    expect(r.keyPoints.cranking.reserveRatio).toBe(0);
    expect(r.keyPoints.cranking.noSparkReason).toMatch(/4\.3\d V, below the 4\.50 V/);
    expect(r.verdict).toBe('fail');
    // The existing points setup has no module and always sparks.
    expect(c.existing.keyPoints.cranking.noSparkReason).toBeNull();
  });
});
