/**
 * The mm/inch choice, the engine being worked on, the last screen, the plan on the bench and the
 * paper are kept in the store's
 * settings (issue 9, item 8), so they survive the browser host starting again on a new port: a new
 * address is a new origin, whose browser storage starts empty. Real browser host (stopped and
 * started again on the same data folder), real Chromium.
 */
import { describe, expect, it } from 'vitest';
import { api, e2eSuite, freshDir, openScreen, screenshot } from './harness.js';

type EngineSummary = { id: number; name: string };
type Engine = { id: number; name: string; existing: { plugGapMm: number } };
type Settings = { lengthUnit: string; workingEngineId: number | null; lastScreen: string; benchPlanId: number | null; pageSize: string };

const suite = e2eSuite();

describe('a new start of the browser host', () => {
  it('keeps inches, the engine worked on and the screen, although the address and its port are new', async () => {
    const dataDir = freshDir('restart');
    const first = await suite.startWorkshop(dataDir);
    const { page } = first;
    const engines = await api<EngineSummary[]>(first.host, 'engines.list', {});
    const tourer = engines.find((e) => e.name === 'Blue six-cylinder tourer')!;

    await page.getByRole('radio', { name: 'inch' }).check();
    await openScreen(page, 'Weigh a combination');
    await page.getByLabel('Engine', { exact: true }).selectOption({ label: tourer.name });
    await page.getByTestId('current-engine').getByText(tourer.name).waitFor();
    // Letter paper for the print, chosen on the weighing screen.
    await page.getByTestId('comparison').getByRole('radio', { name: 'Letter' }).check();
    // The plan on the bench: the plan whose wiring sheet was last opened.
    const [tourerPlan] = await api<Array<{ id: number; name: string }>>(first.host, 'plans.list', { engineId: tourer.id });
    await openScreen(page, 'Wiring sheet');
    await page.getByTestId('bench-plan').getByText(tourerPlan!.name).waitFor();
    await openScreen(page, 'Weigh a combination');
    await expect.poll(() => api<Settings>(first.host, 'settings.get', {})).toMatchObject({ lengthUnit: 'inch', workingEngineId: tourer.id, lastScreen: 'combination', benchPlanId: tourerPlan!.id, pageSize: 'Letter' });
    // Something left in this origin's storage would not reach the next one; nothing needs to be there.
    const firstOrigin = new URL(page.url()).origin;

    await first.host.stop();
    const second = await suite.startHost(dataDir);
    expect(second.origin).not.toBe(firstOrigin);
    await page.goto(second.url);
    // Back on the weighing screen, on the tourer, in inches.
    await page.getByRole('heading', { level: 1, name: 'Weigh a combination' }).waitFor();
    await page.getByTestId('current-engine').getByText(tourer.name).waitFor();
    expect(await page.getByLabel('Engine', { exact: true }).inputValue()).toBe(String(tourer.id));
    expect(await page.getByRole('radio', { name: 'inch' }).isChecked()).toBe(true);
    await page.getByTestId('bench-plan').getByText(tourerPlan!.name).waitFor();
    expect(await page.getByTestId('comparison').getByRole('radio', { name: 'Letter' }).isChecked()).toBe(true);
    // Nothing of it lives in the browser's own storage.
    expect(await page.evaluate(() => window.localStorage.length)).toBe(0);
    await screenshot(page, 'settings-restart-weigh');

    // Gaps show in inches to three decimals (a feeler gauge reads thou): 1 in = 25.4 mm exactly
    // (international yard and pound agreement, 1959).
    const engine = await api<Engine>(second, 'engines.get', { id: tourer.id });
    await page.getByTestId('current-engine').click();
    await page.getByRole('heading', { level: 1, name: `Engine: ${tourer.name}` }).waitFor();
    expect(await page.getByLabel('Plug gap (in)').inputValue()).toBe((engine.existing.plugGapMm / 25.4).toFixed(3));

    // Back to millimetres: kept too.
    await page.getByRole('radio', { name: 'mm' }).check();
    await expect.poll(async () => (await api<Settings>(second, 'settings.get', {})).lengthUnit).toBe('mm');
    await page.reload();
    await page.getByRole('heading', { level: 1, name: `Engine: ${tourer.name}` }).waitFor();
    expect(await page.getByRole('radio', { name: 'mm' }).isChecked()).toBe(true);
    expect(Number(await page.getByLabel('Plug gap (mm)').inputValue())).toBe(engine.existing.plugGapMm);
  });
});
