/**
 * How many of each part the shelf holds (issue 9, item 9): typed in the part editor, shown in the
 * shelf's lists, and respected by "Best from the shelf": a part whose every one is fitted by plans
 * marked wired or done on other engines is left out, and the screen says why. Real browser host,
 * real Chromium; the page is checked against the host's own API.
 */
import { describe, expect, it } from 'vitest';
import { api, e2eSuite, messageBeside, openScreen, screenshot } from './harness.js';

type StoredPart = { id: number; kind: string; name: string; quantity: number };
type Plan = { id: number; name: string; engineId: number; status: string; moduleId: number | null; coilId: number | null };
type EngineSummary = { id: number; name: string };
type LeftOut = { partId: number; partName: string; quantity: number; reason: string };
type SearchAnswer = { leftOut: LeftOut[]; suggestions: Array<{ moduleId: number }> };

const suite = e2eSuite();

describe('quantities on the shelf', () => {
  it('are typed in the editor, checked beside the field, and shown in the list', async () => {
    const { host, page } = await suite.startWorkshop();
    const module = (await api<StoredPart[]>(host, 'parts.list', { kind: 'module' }))[0]!;
    // The demo workshop has one of each.
    expect(module.quantity).toBe(1);
    await openScreen(page, 'Parts on the shelf');
    const cell = page.getByTestId(`part-quantity-${module.id}`);
    expect(await cell.innerText()).toBe('1');

    await page.getByRole('button', { name: `Edit ${module.name}` }).click();
    await page.getByRole('heading', { level: 1, name: `Ignition module: ${module.name}` }).waitFor();
    const field = page.getByLabel('How many you have', { exact: true });
    expect(await field.inputValue()).toBe('1');
    for (const [typed, message] of [
      ['0', /at least 1/],
      ['2.5', /whole number/],
    ] as const) {
      await field.fill(typed);
      await page.getByRole('button', { name: 'Save the part' }).click();
      expect(await messageBeside(page, 'How many you have', 'quantity')).toMatch(message);
      expect((await api<StoredPart>(host, 'parts.get', { id: module.id })).quantity).toBe(1);
    }
    await field.fill('3');
    await page.getByRole('button', { name: 'Save the part' }).click();
    await page.getByTestId('editor-status').getByText(`Saved “${module.name}”.`).waitFor();
    expect((await api<StoredPart>(host, 'parts.get', { id: module.id })).quantity).toBe(3);

    await page.getByRole('button', { name: 'Back to the parts' }).click();
    await page.getByRole('heading', { level: 1, name: 'Parts on the shelf' }).waitFor();
    expect(await page.getByTestId(`part-quantity-${module.id}`).innerText()).toBe('3');
    const table = page.getByTestId('parts-table-module');
    expect((await table.locator('thead th').allTextContents()).map((t) => t.trim())).toContain('How many');
    // Every row shows its count as the store has it.
    for (const p of await api<StoredPart[]>(host, 'parts.list', {})) {
      expect(await page.getByTestId(`part-quantity-${p.id}`).innerText(), p.name).toBe(String(p.quantity));
    }
    await table.scrollIntoViewIfNeeded();
    await screenshot(page, 'shelf-quantity-list');
  });

  it('leaves a part out of the best from the shelf while every one is fitted to another engine, and says so', async () => {
    const { host, page } = await suite.startWorkshop();
    const engines = await api<EngineSummary[]>(host, 'engines.list', {});
    const plans = await api<Plan[]>(host, 'plans.list', {});
    // The demo saloon's plan is marked wired: its parts are on the saloon.
    const wired = plans.find((p) => p.status === 'wired')!;
    const saloon = engines.find((e) => e.id === wired.engineId)!;
    const other = engines.find((e) => e.id !== saloon.id && e.name === 'Blue six-cylinder tourer')!;
    const module = await api<StoredPart>(host, 'parts.get', { id: wired.moduleId });
    expect(module.quantity).toBe(1);

    const truth = await api<SearchAnswer>(host, 'check.search', { engineId: other.id, top: 5 });
    const mine = truth.leftOut.find((p) => p.partId === module.id)!;
    expect(mine.reason).toBe(`Your only one is fitted to “${wired.name}” on ${saloon.name} (marked wired).`);
    expect(truth.suggestions.some((s) => s.moduleId === module.id)).toBe(false);

    await openScreen(page, 'Weigh a combination');
    await page.getByLabel('Engine', { exact: true }).selectOption({ label: other.name });
    const leftOut = page.getByTestId(`left-out-${module.id}`);
    await leftOut.waitFor({ timeout: 120_000 });
    expect(await leftOut.innerText()).toBe(`${module.name} (Ignition module): ${mine.reason}`);
    expect(await page.getByTestId('shelf-left-out').locator('li').count()).toBe(truth.leftOut.length);
    await leftOut.scrollIntoViewIfNeeded();
    await screenshot(page, 'shelf-quantity-left-out');

    // A second one on the shelf: the module is tried again for the tourer.
    await api(host, 'parts.update', { id: module.id, expectedUpdatedAt: (await api<{ updatedAt: string }>(host, 'parts.get', { id: module.id })).updatedAt, part: { ...stripStored(await api<Record<string, unknown>>(host, 'parts.get', { id: module.id })), quantity: 2 } });
    const again = await api<SearchAnswer>(host, 'check.search', { engineId: other.id, top: 5 });
    expect(again.leftOut.some((p) => p.partId === module.id)).toBe(false);
    await page.reload();
    await page.getByRole('heading', { level: 1, name: 'Weigh a combination' }).waitFor();
    await page.getByTestId('shelf-list').waitFor({ timeout: 120_000 });
    expect(await page.getByTestId(`left-out-${module.id}`).count()).toBe(0);
  });
});

function stripStored(p: Record<string, unknown>): Record<string, unknown> {
  const { id: _id, updatedAt: _u, ...rest } = p;
  return rest;
}
