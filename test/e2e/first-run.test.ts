/**
 * Issue 9, item 4: the first-run path on the engines screen, in Chromium through the browser host.
 * Four steps (catalogue your car, parts on the shelf, weigh a combination, the sheet at the car),
 * each a link to its screen, each ticked off only when the store holds the person's own record
 * (the demo workshop's records do not count), and gone for good once put away (the
 * `firstRunHidden` setting, read back from the store's own API and after a reload).
 */
import { describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { api, e2eSuite, openApp, openScreen, screenshot } from './harness.js';
import { coilIn, engineIn, planIn } from '../db/samples.js';
import { shotBoth } from './look-shots.js';

const { startWorkshop } = e2eSuite();

const path = (page: Page) => page.getByTestId('first-steps');
const done = (page: Page, id: string) => page.getByTestId(`first-step-${id}`).getAttribute('data-done');

async function backToEngines(page: Page): Promise<void> {
  await openScreen(page, 'Engines');
  await path(page).waitFor();
}

describe('the first-run path', () => {
  it('links each step to its screen and ticks it off only when the store shows it done', async () => {
    const { host, browser, page } = await startWorkshop();
    await path(page).waitFor();
    // A fresh workshop holds only the demo: none of it is the person's own car.
    expect((await api<unknown[]>(host, 'engines.list', {})).length).toBeGreaterThan(0);
    for (const id of ['engine', 'shelf', 'weigh', 'sheet']) expect(await done(page, id)).toBe('no');
    expect(await page.getByTestId('first-steps-count').innerText()).toBe('0 of 4 ticked off');
    await shotBoth(page, 'first-run-start', path(page));

    // Each step's link opens its screen.
    const links: Array<[string, string]> = [
      ['Add your engine', 'New engine'],
      ['Open the shelf', 'Parts on the shelf'],
      ['Weigh a combination', 'Weigh a combination'],
      ['Open the wiring sheet', 'Wiring sheet'],
    ];
    for (const [link, heading] of links) {
      await path(page).getByRole('button', { name: link }).click();
      await page.getByRole('heading', { level: 1, name: heading }).waitFor();
      await backToEngines(page);
    }

    // The person's own engine, part, plan and a ticked sheet step, each through the store's API.
    const coil = await api<{ id: number }>(host, 'parts.create', { part: coilIn });
    await page.reload();
    await path(page).waitFor();
    await expect.poll(() => done(page, 'shelf')).toBe('yes');
    expect(await done(page, 'engine')).toBe('no');
    expect(await page.getByTestId('first-step-shelf').innerText()).toContain('1 part of yours on the shelf.');

    const engine = await api<{ id: number }>(host, 'engines.create', { engine: engineIn({ coilId: coil.id }) });
    await page.reload();
    await path(page).waitFor();
    await expect.poll(() => done(page, 'engine')).toBe('yes');
    expect(await done(page, 'weigh')).toBe('no');
    expect(await page.getByTestId('first-step-engine').innerText()).toContain('1 engine of yours in the workshop.');

    const plan = await api<{ id: number }>(host, 'plans.create', { plan: planIn(engine.id, { coilId: coil.id }) });
    await page.reload();
    await path(page).waitFor();
    await expect.poll(() => done(page, 'weigh')).toBe('yes');
    expect(await done(page, 'sheet')).toBe('no');

    const sheet = await api<{ sheet: { stages: Array<{ steps: Array<{ key: string }> }> } }>(host, 'sheet.get', { planId: plan.id });
    const firstKey = sheet.sheet.stages[0]!.steps[0]!.key;
    await api(host, 'sheet.tick', { planId: plan.id, stepKey: firstKey, ticked: true });
    await page.reload();
    await path(page).waitFor();
    await expect.poll(() => done(page, 'sheet')).toBe('yes');
    expect(await page.getByTestId('first-steps-count').innerText()).toBe('4 of 4 ticked off');
    await shotBoth(page, 'first-run-all-done', path(page));
    expect(browser.pageErrors).toEqual([]);
  });

  it('is gone once put away, in the store and after a reload', async () => {
    const { host, page } = await startWorkshop();
    await path(page).waitFor();
    await page.getByTestId('first-steps-away').click();
    await path(page).waitFor({ state: 'detached' });
    await expect.poll(async () => (await api<{ firstRunHidden: boolean }>(host, 'settings.get', {})).firstRunHidden).toBe(true);
    await openApp(page, host);
    await page.getByRole('table', { name: 'Engines in this workshop' }).waitFor();
    expect(await path(page).count()).toBe(0);
    await screenshot(page, 'look/first-run-put-away');
  });
});
