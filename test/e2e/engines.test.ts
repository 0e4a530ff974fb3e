/**
 * The engines screens end to end: the real browser host on a fresh data folder, the built
 * renderer, and Debian's Chromium. What the page shows is checked against what the store answers
 * on its own API, and against the physical record on disk after the host is restarted.
 */
import { readFileSync } from 'node:fs';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { api, e2eSuite, freshDir, messageBeside, openApp, projectRoot, screenshot } from './harness.js';

type Summary = { id: number; name: string; planCount: number };
type StoredEngine = { id: number; name: string; boreMm: number; redlineRpm: number; idleRpm: number; existing: { plugGapMm: number }; pointsGapMm: number };

const { startHost, startWorkshop } = e2eSuite();

const engineTable = (page: Page) => page.getByRole('table', { name: 'Engines in this workshop' });

describe('the built page', () => {
  // The CSP (script-src 'self'; style-src 'self') refuses inline code, so none may be emitted.
  it('has no inline script or style, and carries the CSP', () => {
    const html = readFileSync(path.join(projectRoot, 'dist', 'renderer', 'index.html'), 'utf8');
    const scripts = [...html.matchAll(/<script\b([^>]*)>([\s\S]*?)<\/script>/g)];
    expect(scripts.length).toBeGreaterThan(0);
    for (const [, attrs, body] of scripts) {
      expect(attrs).toMatch(/\bsrc="\.\/assets\//);
      expect(body!.trim()).toBe('');
    }
    expect(html).not.toMatch(/<style\b/);
    expect(html).not.toMatch(/\sstyle="/);
    expect(html).toMatch(/<meta http-equiv="Content-Security-Policy" content="default-src 'none'; script-src 'self'/);
  });
});

describe('the engines screen', () => {
  it('lists every engine the store holds in a fresh workshop, with its plan count', async () => {
    const { host, browser, page } = await startWorkshop();
    await engineTable(page).waitFor();
    const stored = await api<Summary[]>(host, 'engines.list', {});
    // A fresh data folder gets the demo workshop on first run (contract of openBackend).
    expect(stored.length).toBeGreaterThan(0);
    const rows = engineTable(page).locator('tbody tr');
    expect(await rows.count()).toBe(stored.length);
    for (const e of stored) {
      const row = page.getByTestId(`engine-row-${e.id}`);
      expect(await row.getByRole('rowheader').innerText()).toBe(e.name);
      expect((await row.locator('td').nth(4).innerText()).trim()).toBe(String(e.planCount));
    }
    // The access key is taken out of the address bar, and a reload still reaches the store.
    expect(page.url()).not.toContain('token=');
    await page.reload();
    await engineTable(page).waitFor();
    expect(await engineTable(page).locator('tbody tr').count()).toBe(stored.length);
    await screenshot(page, 'engines-list');
    expect(browser.pageErrors).toEqual([]);
  });

  it('loads the demo workshop again only after asking, and reports what it added', async () => {
    const { host, browser, page } = await startWorkshop();
    const before = await api<Summary[]>(host, 'engines.list', {});
    await page.getByRole('button', { name: 'Load the demo workshop' }).click();
    const dialog = page.getByRole('dialog', { name: 'Load the demo workshop?' });
    await dialog.waitFor();
    await screenshot(page, 'demo-dialog');
    await dialog.getByRole('button', { name: 'Not now' }).click();
    await dialog.waitFor({ state: 'detached' });
    expect((await api<Summary[]>(host, 'engines.list', {})).length).toBe(before.length);

    await page.getByRole('button', { name: 'Load the demo workshop' }).click();
    await page.getByRole('dialog', { name: 'Load the demo workshop?' }).getByRole('button', { name: 'Load the demo' }).click();
    const flash = page.getByTestId('flash');
    await flash.waitFor();
    const after = await api<Summary[]>(host, 'engines.list', {});
    const added = after.length - before.length;
    const text = await flash.innerText();
    // A fresh data folder got the demo workshop on its first run (openBackend), so loading it again
    // adds nothing, and the sentence says so.
    expect(added).toBe(0);
    expect(text).toContain('The demo workshop is already here; nothing was added.');
    await expect.poll(() => engineTable(page).locator('tbody tr').count()).toBe(after.length);
    expect(browser.pageErrors).toEqual([]);
  });

  it('keeps the advance curve in rising rpm order and asks a magneto for its figures', async () => {
    const { page } = await startWorkshop();
    await page.getByRole('button', { name: 'Add an engine' }).click();
    await page.getByRole('heading', { level: 1, name: 'New engine' }).waitFor();
    await page.getByLabel('Name', { exact: true }).fill('Magneto twin');
    await page.getByLabel('Cylinders', { exact: true }).fill('2');
    await page.getByLabel('Firing order', { exact: true }).fill('1-2');
    await page.getByLabel('Dwell angle (distributor degrees)').fill('90');
    await page.getByLabel('Bore (mm)').fill('68');
    await page.getByLabel('Stroke (mm)').fill('70');
    await page.getByLabel('Connecting rod, centre to centre (mm)').fill('120');
    await page.getByLabel('Compression ratio (to 1)').fill('7');

    for (let i = 0; i < 3; i++) await page.getByRole('button', { name: 'Add a row' }).click();
    await page.getByLabel('Row 1 engine speed (rpm)').fill('1000');
    await page.getByLabel('Row 1 advance (crankshaft degrees)').fill('0');
    await page.getByLabel('Row 2 engine speed (rpm)').fill('2500');
    await page.getByLabel('Row 2 advance (crankshaft degrees)').fill('10');
    await page.getByLabel('Row 3 engine speed (rpm)').fill('2000');
    await page.getByLabel('Row 3 advance (crankshaft degrees)').fill('14');

    expect(await page.getByLabel('Magneto break current at full output (A)').count()).toBe(0);
    await page.getByLabel('Fitted ignition').selectOption('magneto');
    await page.getByLabel('Magneto break current at full output (A)').waitFor();

    await page.getByRole('button', { name: 'Save the engine' }).click();
    expect(await messageBeside(page, 'Row 3 engine speed (rpm)', 'advanceCurve.2.rpm')).toBe('Each row needs a higher rpm than the row above.');
    expect(await messageBeside(page, 'Magneto break current at full output (A)', 'existing.magnetoRatedCurrentA')).toBe(
      'A magneto needs its rated break current and the rpm of full output.',
    );
    await screenshot(page, 'engine-editor-curve-errors');

    // Removing the out-of-order row clears its message.
    await page.getByRole('button', { name: 'Remove row 3' }).click();
    expect(await page.getByTestId('error-advanceCurve.2.rpm').count()).toBe(0);
    await page.getByLabel('Magneto break current at full output (A)').fill('3.5');
    await page.getByLabel('Magneto reaches full output at (rpm)').fill('1500');
    await page.getByRole('button', { name: 'Save the engine' }).click();
    await page.getByTestId('editor-status').getByText('Saved “Magneto twin”.').waitFor();
    expect(await page.getByLabel('Row 2 engine speed (rpm)').inputValue()).toBe('2500');
    expect(await page.getByLabel('Row 3 engine speed (rpm)').count()).toBe(0);
  });

  it('creates an engine, refuses bad values beside their fields, saves the fix, and keeps it across a restart', async () => {
    const dataDir = freshDir('data');
    const first = await startWorkshop(dataDir);
    const page = first.page;
    const name = 'Grey test-bench single';

    await page.getByRole('button', { name: 'Add an engine' }).click();
    await page.getByRole('heading', { level: 1, name: 'New engine' }).waitFor();
    await page.getByLabel('Name', { exact: true }).fill(name);
    await page.getByLabel('Year', { exact: true }).fill('about 1960');
    await page.getByLabel('Cylinders', { exact: true }).fill('1');
    await page.getByLabel('Firing order', { exact: true }).fill('1');
    await page.getByLabel('Bore (mm)').fill('abc');
    await page.getByLabel('Stroke (mm)').fill('80');
    await page.getByLabel('Connecting rod, centre to centre (mm)').fill('150');
    await page.getByLabel('Compression ratio (to 1)').fill('7,5');
    await page.getByRole('button', { name: 'Save the engine' }).click();

    expect(await messageBeside(page, 'Bore (mm)', 'boreMm')).toBe('Bore must be a number, for example 12 or 0.4.');
    expect(await messageBeside(page, 'Compression ratio (to 1)', 'compressionRatio')).toBe('Write decimals with a point, not a comma: 7.5 rather than 7,5.');
    await screenshot(page, 'engine-editor-errors');
    // Nothing reached the store.
    expect((await api<Summary[]>(first.host, 'engines.list', {})).some((e) => e.name === name)).toBe(false);

    await page.getByLabel('Bore (mm)').fill('84');
    await page.getByLabel('Compression ratio (to 1)').fill('7.5');
    // Redline below idle is refused by the schema's cross-field rule, on the redline field.
    await page.getByLabel('Redline (rpm)').fill('700');
    await page.getByRole('button', { name: 'Save the engine' }).click();
    expect(await messageBeside(page, 'Redline (rpm)', 'redlineRpm')).toBe('Redline must be above idle speed.');
    await expect(page.getByTestId('error-boreMm').count()).resolves.toBe(0);

    // Enter in a field saves the form.
    await page.getByLabel('Redline (rpm)').fill('5200');
    await page.getByLabel('Redline (rpm)').press('Enter');
    await page.getByTestId('editor-status').getByText(`Saved “${name}”.`).waitFor();
    await page.getByRole('heading', { level: 1, name: `Engine: ${name}` }).waitFor();
    expect(await page.getByTestId('current-engine').innerText()).toContain(name);

    const saved = (await api<Summary[]>(first.host, 'engines.list', {})).find((e) => e.name === name);
    expect(saved).toBeDefined();

    // Edit again: a new redline, saved with the button.
    await page.getByLabel('Redline (rpm)').fill('5400');
    await page.getByRole('button', { name: 'Save the engine' }).click();
    await page.getByTestId('editor-status').getByText(`Saved “${name}”.`).waitFor();
    await screenshot(page, 'engine-editor-saved');

    // Restart the host on the same folder: a new token, a new browser, the same engine.
    await first.host.stop();
    const second = await startHost(dataDir);
    await openApp(page, second);
    const row = page.getByTestId(`engine-row-${saved!.id}`);
    expect(await row.getByRole('rowheader').innerText()).toBe(name);
    await row.getByRole('button', { name: `Edit ${name}` }).click();
    await page.getByRole('heading', { level: 1, name: `Engine: ${name}` }).waitFor();
    expect(await page.getByLabel('Bore (mm)').inputValue()).toBe('84');
    expect(await page.getByLabel('Compression ratio (to 1)').inputValue()).toBe('7.5');
    expect(await page.getByLabel('Redline (rpm)').inputValue()).toBe('5400');
    const stored = await api<StoredEngine>(second, 'engines.get', { id: saved!.id });
    expect(stored.redlineRpm).toBe(5400);
    expect(stored.boreMm).toBe(84);

    // Delete, confirming in the dialog (which is labelled by its question).
    await page.getByRole('button', { name: 'Back to the engines' }).click();
    await page.getByRole('button', { name: `Delete ${name}` }).click();
    const dialog = page.getByRole('dialog', { name: `Delete ${name}?` });
    await dialog.waitFor();
    await screenshot(page, 'engine-delete-dialog');
    await dialog.getByRole('button', { name: 'Delete the engine' }).click();
    await page.getByTestId('removal-notice').getByText(`${name} was deleted.`).waitFor();
    expect(await page.getByTestId(`engine-row-${saved!.id}`).count()).toBe(0);
    expect((await api<Summary[]>(second, 'engines.list', {})).some((e) => e.id === saved!.id)).toBe(false);
  });

  it('shows the store\'s own refusal beside the field and keeps everything typed', async () => {
    const { host, page } = await startWorkshop();
    await page.getByRole('button', { name: 'Add an engine' }).click();
    await page.getByRole('heading', { level: 1, name: 'New engine' }).waitFor();
    await page.getByLabel('Name', { exact: true }).fill('Engine with a vanished coil');
    await page.getByLabel('Bore (mm)').fill('70');
    await page.getByLabel('Stroke (mm)').fill('75');
    await page.getByLabel('Connecting rod, centre to centre (mm)').fill('130');
    await page.getByLabel('Compression ratio (to 1)').fill('8');

    // Pick a coil, then take it off the shelf behind the form's back (as another window could).
    const coils = await api<Array<{ id: number; kind: string; name: string; updatedAt: string }>>(host, 'parts.list', { kind: 'coil' });
    let gone: { id: number; name: string } | undefined;
    for (const c of coils) {
      const res = await fetch(`${host.origin}/api/invoke`, {
        method: 'POST',
        headers: { 'Content-Type': 'application/json', Authorization: `Bearer ${host.token}` },
        body: JSON.stringify({ channel: 'parts.delete', request: { id: c.id, expectedUpdatedAt: c.updatedAt } }),
      });
      if (((await res.json()) as { ok: boolean }).ok) {
        gone = c;
        break;
      }
    }
    expect(gone, 'the demo workshop should hold a coil that nothing uses').toBeDefined();
    await page.getByLabel('Coil', { exact: true }).selectOption(String(gone!.id));
    await page.getByRole('button', { name: 'Save the engine' }).click();

    const message = await messageBeside(page, 'Coil', 'existing.coilPartId');
    expect(message).toContain(String(gone!.id));
    expect(await page.getByTestId('editor-status').innerText()).toContain('Everything you typed is still here.');
    expect(await page.getByLabel('Name', { exact: true }).inputValue()).toBe('Engine with a vanished coil');
    expect(await page.getByLabel('Bore (mm)').inputValue()).toBe('70');
    expect((await api<Summary[]>(host, 'engines.list', {})).some((e) => e.name === 'Engine with a vanished coil')).toBe(false);
    await screenshot(page, 'engine-editor-store-refusal');

    await page.getByLabel('Coil', { exact: true }).selectOption('');
    await page.getByRole('button', { name: 'Save the engine' }).click();
    await page.getByTestId('editor-status').getByText('Saved “Engine with a vanished coil”.').waitFor();
  });

  it('asks once, naming how many plans and readings go, and Undo brings them all back', async () => {
    const { host, page } = await startWorkshop();
    const withPlans = (await api<Summary[]>(host, 'engines.list', {})).find((e) => e.planCount > 0);
    expect(withPlans, 'the demo workshop should hold an engine with a plan').toBeDefined();
    const target = withPlans!;
    const plansBefore = await api<Array<{ id: number; updatedAt: string }>>(host, 'plans.list', { engineId: target.id });
    let readings = 0;
    for (const p of plansBefore) readings += (await api<unknown[]>(host, 'readings.list', { planId: p.id })).length;
    const words = (n: number, one: string, many: string) => (n === 1 ? `1 ${one}` : `${n} ${many}`);

    await page.getByRole('button', { name: `Delete ${target.name}` }).click();
    const dialog = page.getByRole('dialog', { name: `Delete ${target.name}?` });
    await dialog.waitFor();
    const confirm = dialog.getByRole('button', { name: `Delete the engine, ${words(plansBefore.length, 'plan', 'plans')} and ${words(readings, 'reading', 'readings')}` });
    await confirm.waitFor();
    expect(await dialog.getByTestId('delete-engine-counts').innerText()).toContain(words(plansBefore.length, 'conversion plan', 'conversion plans'));
    await screenshot(page, 'engine-delete-dialog-with-plans');

    // Escape closes the dialog and keeps the engine.
    await page.keyboard.press('Escape');
    await dialog.waitFor({ state: 'detached' });
    expect((await api<Summary[]>(host, 'engines.list', {})).some((e) => e.id === target.id)).toBe(true);

    // One question, one answer: the engine and its plans go.
    await page.getByRole('button', { name: `Delete ${target.name}` }).click();
    await dialog.getByRole('button', { name: /^Delete the engine, / }).click();
    const note = page.getByTestId('removal-notice');
    await note.getByText(`${target.name} was deleted`).waitFor();
    expect((await api<Summary[]>(host, 'engines.list', {})).some((e) => e.id === target.id)).toBe(false);
    expect((await api<Array<{ engineId: number }>>(host, 'plans.list', {})).some((p) => p.engineId === target.id)).toBe(false);
    await screenshot(page, 'engine-deleted-undo-note');

    // Undo: the engine, its plans and their readings are back with their ids.
    await note.getByRole('button', { name: 'Undo' }).click();
    await note.getByText(`${target.name} is back`).waitFor();
    await page.getByTestId(`engine-row-${target.id}`).waitFor();
    const plansAfter = await api<Array<{ id: number; updatedAt: string }>>(host, 'plans.list', { engineId: target.id });
    expect(plansAfter).toEqual(plansBefore);
    let readingsAfter = 0;
    for (const p of plansAfter) readingsAfter += (await api<unknown[]>(host, 'readings.list', { planId: p.id })).length;
    expect(readingsAfter).toBe(readings);
  });

  it('warns before leaving unsaved edits, and Escape keeps them', async () => {
    const { page } = await startWorkshop();
    const firstName = await engineTable(page).locator('tbody tr').first().getByRole('rowheader').innerText();
    await page.getByRole('button', { name: `Edit ${firstName}` }).click();
    await page.getByRole('heading', { level: 1, name: `Engine: ${firstName}` }).waitFor();
    await page.getByLabel('Notes', { exact: true }).fill('Changed at the bench');
    await page.getByTestId('unsaved').waitFor();

    // Closing the page asks first (beforeunload); dismissing the question keeps the page and the edit.
    const asked = new Promise<string>((resolve) => page.once('dialog', (d) => void d.dismiss().then(() => resolve(d.type()))));
    await page.close({ runBeforeUnload: true });
    expect(await asked).toBe('beforeunload');
    expect(page.isClosed()).toBe(false);
    expect(await page.getByLabel('Notes', { exact: true }).inputValue()).toBe('Changed at the bench');

    await page.getByRole('navigation', { name: 'Screens' }).getByRole('button', { name: 'Engines' }).click();
    const leave = page.getByRole('dialog', { name: 'Leave without saving?' });
    await leave.waitFor();
    // Focus starts on the safe choice and Tab stays inside the dialog.
    expect(await page.locator(':focus').innerText()).toBe('Stay and keep editing');
    for (let i = 0; i < 3; i++) {
      await page.keyboard.press('Tab');
      expect(await leave.locator(':focus').count()).toBe(1);
    }
    await screenshot(page, 'engine-leave-dialog');
    await page.keyboard.press('Escape');
    await leave.waitFor({ state: 'detached' });
    expect(await page.getByLabel('Notes', { exact: true }).inputValue()).toBe('Changed at the bench');

    await page.getByRole('navigation', { name: 'Screens' }).getByRole('button', { name: 'Wiring sheet' }).click();
    await page.getByRole('dialog', { name: 'Leave without saving?' }).getByRole('button', { name: 'Leave and lose the changes' }).click();
    await page.getByRole('heading', { level: 1, name: 'Wiring sheet' }).waitFor();
    // The sheet screen offers the engine to pick (the sheet itself is tested in sheet.test.ts).
    await page.getByLabel('Engine', { exact: true }).waitFor();
  });

  it('shows gaps in inches on request while storing millimetres', async () => {
    const { host, page } = await startWorkshop();
    const first = (await api<Summary[]>(host, 'engines.list', {}))[0]!;
    const before = await api<StoredEngine>(host, 'engines.get', { id: first.id });
    await page.getByRole('button', { name: `Edit ${first.name}` }).click();
    await page.getByRole('heading', { level: 1, name: `Engine: ${first.name}` }).waitFor();

    await screenshot(page, 'engine-editor-top');
    await page.getByRole('group', { name: 'Advance curve (from the workshop manual)' }).scrollIntoViewIfNeeded();
    await screenshot(page, 'engine-editor-curve');
    await page.getByRole('radio', { name: 'inch' }).check();
    const plugGap = page.getByLabel('Plug gap (in)');
    await plugGap.scrollIntoViewIfNeeded();
    await screenshot(page, 'engine-editor-existing-inch');
    await page.getByRole('group', { name: 'The ignition fitted now' }).scrollIntoViewIfNeeded();
    const conditions = page.locator('details.conditions');
    if ((await conditions.getAttribute('open')) === null) await conditions.locator('summary').click();
    await page.getByLabel('Volumetric efficiency (0.3 to 1.3)').scrollIntoViewIfNeeded();
    await screenshot(page, 'engine-editor-bottom');
    // 1 in = 25.4 mm exactly (international yard and pound agreement, 1959); shown to 3 decimals (thou).
    expect(await plugGap.inputValue()).toBe((before.existing.plugGapMm / 25.4).toFixed(3));
    // Switching the unit alone is not an edit.
    expect(await page.getByTestId('unsaved').count()).toBe(0);

    await plugGap.fill('0.025');
    await page.getByRole('button', { name: 'Save the engine' }).click();
    await page.getByTestId('editor-status').getByText('Saved').waitFor();
    const after = await api<StoredEngine>(host, 'engines.get', { id: first.id });
    expect(after.existing.plugGapMm).toBeCloseTo(0.025 * 25.4, 9); // 0.635 mm
    expect(after.pointsGapMm).toBe(before.pointsGapMm);

    // The choice is kept in the store's settings: a reload (back on the same editor) still shows inches.
    await page.reload();
    await page.getByRole('heading', { level: 1, name: `Engine: ${first.name}` }).waitFor();
    expect(await page.getByRole('radio', { name: 'inch' }).isChecked()).toBe(true);
  });

  it('never lets an outside web link navigate the app page', async () => {
    const { browser, page } = await startWorkshop();
    const appUrl = page.url();
    // The page-wide link guard is what is under test, so give it a link to guard.
    await page.locator('main').evaluate((main) => main.insertAdjacentHTML('beforeend', '<a href="https://example.org/help">Outside help</a>'));
    const popup = browser.context.waitForEvent('page', { timeout: 5000 }).catch(() => null);
    await page.getByRole('link', { name: 'Outside help' }).click();
    const opened = await popup;
    await page.waitForTimeout(300);
    expect(page.url()).toBe(appUrl);
    await page.getByRole('heading', { level: 1, name: 'Engines' }).waitFor();
    // It went to a separate window instead (the desktop shell sends that to the system browser).
    expect(opened).not.toBeNull();
    await expect.poll(() => browser.blocked).toContain('https://example.org/help');

    // A link to another path on the host itself is not followed either.
    await page.locator('main').evaluate((main) => main.insertAdjacentHTML('beforeend', '<a href="/elsewhere.html">Same host</a>'));
    await page.getByRole('link', { name: 'Same host' }).click();
    await page.waitForTimeout(300);
    expect(page.url()).toBe(appUrl);
    await page.getByRole('heading', { level: 1, name: 'Engines' }).waitFor();
  });
});
