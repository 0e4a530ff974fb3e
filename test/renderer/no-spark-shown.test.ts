/**
 * A dead module shows no spark, on screen: the demo's 6 V flat twin cranks its battery below the
 * six-volt module's rated minimum supply, and the weighing screen's four-speed table and charts must
 * say so (zero energy at cranking, and why) rather than draw a spark. The comparison comes from the
 * real store, adapter and checker (`openBackend` on a temp folder); the drawing from the screen's own
 * components through react-dom/server.
 * Source of the rule: a module below the minimum supply its maker rates it for does not switch
 * (common practice; the module maker's data sheet gives the figure, 4.5 V for the demo unit).
 */
import { createElement } from 'react';
import { renderToStaticMarkup } from 'react-dom/server';
import { describe, expect, it } from 'vitest';
import { demoParts } from '../../db/demo/index.js';
import type { ComparisonAnswer } from '../../electron/ipc/channels.js';
import { KeyPointsTable } from '../../renderer/screens/weigh/KeyPointsTable.js';
import { WeighCharts } from '../../renderer/screens/weigh/WeighCharts.js';
import { backendPerTest } from '../ipc/backend-per-test.js';

const store = backendPerTest('no-spark');

describe('the weighing screen below a module’s minimum supply', () => {
  it('shows no spark while cranking, with the reason, in the four-speed table and under the charts, and a spark at idle', async () => {
    const engines: Array<{ id: number; name: string }> = await store.ok('engines.list', {});
    const twin = engines.find((e) => e.name === 'Red flat-twin light car')!;
    const plans: Array<{ id: number; moduleId: number | null }> = await store.ok('plans.list', { engineId: twin.id });
    const plan = plans.find((p) => p.moduleId !== null)!;
    const module = await store.ok('parts.get', { id: plan.moduleId });
    const answer: ComparisonAnswer = await store.ok('check.plans', { engineId: twin.id, planIds: [plan.id] });
    const setup = answer.candidates[0]!;

    // The precondition, from the catalogue: the demo's six-volt unit is rated from 4.5 V.
    const catalogued = demoParts.find((p) => p.name === module.name)!;
    expect(catalogued.kind === 'module' && catalogued.supplyMinV).toBe(4.5);
    expect(setup.keyPoints.cranking.noSparkReason).toMatch(/4\.5/);
    expect(setup.keyPoints.cranking.sparkEnergyMj).toBe(0);
    expect(setup.keyPoints.cranking.availableKv).toBe(0);
    expect(setup.keyPoints.cranking.reserveRatio).toBe(0);
    expect(setup.keyPoints.idle.noSparkReason).toBeNull();

    const table = renderToStaticMarkup(createElement(KeyPointsTable, { setups: [answer.existing, setup], margin: answer.marginRatio }));
    expect(table).toContain('data-testid="no-spark-cranking-1"');
    expect(table).toContain(setup.keyPoints.cranking.noSparkReason!.replace(/&/g, '&amp;').replace(/</g, '&lt;').replace(/>/g, '&gt;'));
    expect(table).not.toContain('data-testid="no-spark-idle-1"');

    const charts = renderToStaticMarkup(createElement(WeighCharts, { setups: [answer.existing, setup], margin: answer.marginRatio }));
    expect(charts).toContain('data-testid="no-spark-notes"');
    expect(charts).toMatch(/No spark:/);
    // The energy line drops to zero over the cranking points.
    expect(setup.series.energyMj.slice(0, setup.series.crankingCount).every((v) => v === 0)).toBe(true);
    expect(setup.series.energyMj.slice(setup.series.crankingCount).every((v) => v > 0)).toBe(true);
  });
});
