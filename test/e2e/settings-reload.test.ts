/**
 * A reload keeps the person where they were (issue 9, item 8): the screen (the address keeps it
 * once the access key is taken out), and the weighing screen's ticked plans, per engine (the
 * store's settings). The page's icon answers, so a load leaves no failed request behind (item 10).
 * Real browser host, real Chromium; what the page shows is checked against the host's own API.
 */
import { describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { api, e2eSuite, openScreen, screenshot } from './harness.js';

type EngineSummary = { id: number; name: string };
type StoredPart = { id: number; kind: string; name: string };
type Plan = { id: number; name: string; engineId: number; updatedAt: string; status: string; [k: string]: unknown };
type Settings = { lengthUnit: string; workingEngineId: number | null; weighTicks: Record<string, number[]>; firstRunHidden: boolean; lastScreen: string };

const suite = e2eSuite();

const tickBox = (page: Page, planId: number) => page.getByTestId(`plan-row-${planId}`).getByRole('checkbox');

describe('reloading the page', () => {
  it('returns to the screen and the record it was showing', async () => {
    const { host, page } = await suite.startWorkshop();
    const coil = (await api<StoredPart[]>(host, 'parts.list', { kind: 'coil' }))[0]!;
    await openScreen(page, 'Parts on the shelf');
    await page.getByRole('button', { name: `Edit ${coil.name}` }).click();
    await page.getByRole('heading', { level: 1, name: `Coil: ${coil.name}` }).waitFor();
    expect(new URL(page.url()).hash).toBe(`#/parts/${coil.id}`);

    await page.reload();
    await page.getByRole('heading', { level: 1, name: `Coil: ${coil.name}` }).waitFor();
    expect(page.url()).not.toContain('token=');
    expect(await page.getByLabel('Name', { exact: true }).inputValue()).toBe(coil.name);

    for (const name of ['Records and backups', 'Weigh a combination', 'Engines']) {
      await openScreen(page, name);
      await page.reload();
      await page.getByRole('heading', { level: 1, name }).waitFor();
    }
    // The store keeps the last screen for the next start.
    // (Saved as the screen opens, so a loaded machine may answer the read first: wait for it.)
    await expect.poll(async () => (await api<Settings>(host, 'settings.get', {})).lastScreen).toBe('engines');
  });

  it('weighs the plans that were ticked, remembered per engine', async () => {
    const { host, page } = await suite.startWorkshop();
    const engines = await api<EngineSummary[]>(host, 'engines.list', {});
    const saloon = engines.find((e) => e.name === 'Green four-door saloon')!;
    const other = engines.find((e) => e.id !== saloon.id)!;
    // Two more plans on the saloon, copies of its demo plan, so there are three to choose from.
    const [demo] = await api<Plan[]>(host, 'plans.list', { engineId: saloon.id });
    const { id: _id, updatedAt: _u, status: _s, ...fields } = demo!;
    const second = await api<Plan>(host, 'plans.create', { plan: { ...fields, status: 'draft', name: 'Second copy' } });
    const third = await api<Plan>(host, 'plans.create', { plan: { ...fields, status: 'draft', name: 'Third copy' } });

    await openScreen(page, 'Weigh a combination');
    await page.getByLabel('Engine', { exact: true }).selectOption({ label: saloon.name });
    // On a first visit the first three are ticked.
    for (const id of [demo!.id, second.id, third.id]) await expect.poll(() => tickBox(page, id).isChecked()).toBe(true);
    await tickBox(page, demo!.id).uncheck();
    await expect.poll(async () => (await api<Settings>(host, 'settings.get', {})).weighTicks[String(saloon.id)]).toEqual([second.id, third.id]);
    await page.getByTestId('setup-card-2').waitFor();
    expect(await page.getByTestId('setup-card-3').count()).toBe(0);

    await page.reload();
    await page.getByRole('heading', { level: 1, name: 'Weigh a combination' }).waitFor();
    await expect.poll(() => tickBox(page, second.id).isChecked()).toBe(true);
    expect(await tickBox(page, third.id).isChecked()).toBe(true);
    expect(await tickBox(page, demo!.id).isChecked()).toBe(false);
    // The comparison weighs exactly those two beside the ignition fitted now.
    await page.getByTestId('setup-card-2').waitFor();
    expect(await page.getByTestId('setup-card-1').innerText()).toContain('Second copy');
    expect(await page.getByTestId('setup-card-2').innerText()).toContain('Third copy');
    await screenshot(page, 'settings-reload-weigh-ticks');

    // Another engine keeps its own ticks; coming back brings the saloon's again.
    await page.getByLabel('Engine', { exact: true }).selectOption({ label: other.name });
    const [otherPlan] = await api<Plan[]>(host, 'plans.list', { engineId: other.id });
    await expect.poll(() => tickBox(page, otherPlan!.id).isChecked()).toBe(true);
    await tickBox(page, otherPlan!.id).uncheck();
    await expect.poll(async () => (await api<Settings>(host, 'settings.get', {})).weighTicks[String(other.id)]).toEqual([]);
    await page.getByLabel('Engine', { exact: true }).selectOption({ label: saloon.name });
    await expect.poll(() => tickBox(page, second.id).isChecked()).toBe(true);
    expect(await tickBox(page, demo!.id).isChecked()).toBe(false);
    const stored = await api<Settings>(host, 'settings.get', {});
    expect(stored.weighTicks).toEqual({ [String(saloon.id)]: [second.id, third.id], [String(other.id)]: [] });
    expect(stored.workingEngineId).toBe(saloon.id);
  });
});

describe('the page icon', () => {
  it('is linked from the page and answers 200, so loading the app leaves no failed request', async () => {
    const { host, browser, page } = await suite.startWorkshop();
    const failed: string[] = [];
    page.on('response', (r) => {
      if (r.status() >= 400) failed.push(`${r.status()} ${r.url()}`);
    });
    await page.reload();
    await page.getByRole('heading', { level: 1, name: 'Engines' }).waitFor();
    expect(await page.locator('link[rel="icon"]').getAttribute('href')).toBe('./favicon.svg');
    for (const name of ['favicon.svg', 'favicon.ico']) {
      const res = await fetch(`${host.origin}/${name}`);
      expect(res.status, name).toBe(200);
      expect(res.headers.get('content-type'), name).toBe(name.endsWith('.svg') ? 'image/svg+xml' : 'image/x-icon');
      const body = Buffer.from(await res.arrayBuffer());
      // An SVG document, and an ICO (header 0, 1, one image; Microsoft's ICO layout) holding a PNG.
      if (name.endsWith('.svg')) expect(body.toString('utf8')).toMatch(/^<svg[\s\S]*<\/svg>\s*$/);
      else expect([body.readUInt16LE(0), body.readUInt16LE(2), body.readUInt16LE(4), body.subarray(22, 26).toString('latin1')]).toEqual([0, 1, 1, '\u0089PNG']);
    }
    // Whether Chromium asks for the icon again on a reload depends on its cache, so the test does not
    // wait for that request; it checks the link, that both files answer, and that nothing failed.
    expect(failed).toEqual([]);
    expect(browser.pageErrors).toEqual([]);
  });
});
