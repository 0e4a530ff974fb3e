/**
 * Issue 9, items 1, 5 and 6, in Chromium through the browser host: the form's list of things to
 * fix (every problem listed, named by its field with the unit, each line taking you to its field),
 * the message tab beside a field, the note after a save (beside the save button, focused), the
 * optional action on a note, and every check in one pass. Screenshots in colour and grey go to
 * test-output/look/.
 *
 * Trade facts behind the values typed (common practice): an engine idles below its redline; a
 * points condenser is a fraction of a microfarad (0.2 to 0.3 µF), so 5 µF is a typing slip.
 */
import { describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { api, e2eSuite, messageBeside } from './harness.js';
import { shotBoth } from './look-shots.js';

const { startWorkshop } = e2eSuite();

async function newEngine(page: Page): Promise<void> {
  await page.getByRole('button', { name: 'Add an engine' }).click();
  await page.getByRole('heading', { level: 1, name: 'New engine' }).waitFor();
}

const fixLines = (page: Page) => page.getByTestId('fix-list').locator('.fix-line');

describe('the list of things to fix and the messages beside fields', () => {
  it('lists every problem in one pass, names each field with its unit, and takes you to the field', async () => {
    const { host, browser, page } = await startWorkshop();
    await newEngine(page);
    await page.getByLabel('Name', { exact: true }).fill('Bench twin');
    await page.getByLabel('Bore (mm)').fill('8o'); // a letter o for a zero
    await page.getByLabel('Stroke (mm)').fill('80');
    await page.getByLabel('Connecting rod, centre to centre (mm)').fill('140');
    await page.getByLabel('Compression ratio (to 1)').fill('8');
    await page.getByLabel('Redline (rpm)').fill('600'); // below the 800 rpm idle
    await page.getByLabel('Condenser (µF)').fill('5');
    await page.getByRole('button', { name: 'Save the engine' }).click();

    const status = page.getByTestId('editor-status');
    await status.waitFor();
    // Our own words and marks, not a "Problem:" banner with "Dismiss".
    const text = await status.innerText();
    expect(text).toContain('Needs fixing before saving');
    expect(text).toContain('3 things');
    expect(text).not.toMatch(/Problem:|Dismiss/);
    expect(await status.locator('.tag-stub .tag-word').innerText()).toMatch(/snag/i);
    expect(await status.locator('svg.tag-mark-problem').count()).toBe(1);

    // All three in one pass: the letter, the redline below idle and the condenser, each named with its unit.
    const lines = (await fixLines(page).allInnerTexts()).map((t) => t.replace(/\s+/g, ' ').replace(/ go to it$/, '').replace(/^\d+ /, '').trim());
    expect(lines).toContain('Bore (mm): must be a number, for example 12 or 0.4.');
    expect(lines).toContain('Redline (rpm): must be above idle speed.');
    expect(lines).toContain('Condenser (µF): above 2 µF is not plausible.');
    // Beside each field, the same message, tied to it for a screen reader.
    expect(await messageBeside(page, 'Redline (rpm)', 'redlineRpm')).toBe('Redline must be above idle speed.');
    expect(await messageBeside(page, 'Bore (mm)', 'boreMm')).toBe('Bore must be a number, for example 12 or 0.4.');
    // Nothing reached the store.
    expect((await api<Array<{ name: string }>>(host, 'engines.list', {})).some((e) => e.name === 'Bench twin')).toBe(false);

    await page.getByRole('heading', { level: 1, name: 'New engine' }).evaluate((el) => el.scrollIntoView({ block: 'start' }));
    await shotBoth(page, 'fix-list', status);
    await page.getByLabel('Redline (rpm)').scrollIntoViewIfNeeded();
    await shotBoth(page, 'field-message', page.locator('.field.has-error').filter({ has: page.getByLabel('Redline (rpm)') }).locator('..'));

    // Each line takes you to its field.
    await fixLines(page).filter({ hasText: 'Condenser (µF)' }).click();
    expect(await page.evaluate(() => document.activeElement?.id)).toBe('f-existing-condenserUf');
    await fixLines(page).filter({ hasText: 'Redline (rpm)' }).click();
    expect(await page.evaluate(() => document.activeElement?.id)).toBe('f-redlineRpm');
    expect(browser.pageErrors).toEqual([]);
  });

  it('shows the note after a save beside the save button and moves focus to it', async () => {
    const { browser, page } = await startWorkshop();
    await newEngine(page);
    await page.getByLabel('Name', { exact: true }).fill('Long-form saloon');
    await page.getByLabel('Bore (mm)').fill('76');
    await page.getByLabel('Stroke (mm)').fill('82');
    await page.getByLabel('Connecting rod, centre to centre (mm)').fill('140');
    await page.getByLabel('Compression ratio (to 1)').fill('8.3');
    const save = page.getByRole('button', { name: 'Save the engine' });
    await save.scrollIntoViewIfNeeded();
    await save.click();

    const status = page.getByTestId('editor-status');
    await status.getByText('Saved “Long-form saloon”.').waitFor();
    // Focus is on the note, not dropped on the page body.
    await expect.poll(() => page.evaluate(() => document.activeElement?.getAttribute('data-testid') ?? document.activeElement?.tagName)).toBe('editor-status');
    // The note sits in the action bar with the save button: in view, and right beside it.
    const [note, button] = await Promise.all([status.boundingBox(), save.boundingBox()]);
    expect(note).not.toBeNull();
    expect(button).not.toBeNull();
    expect(note!.y).toBeGreaterThanOrEqual(0);
    expect(note!.y + note!.height).toBeLessThanOrEqual(800);
    expect(Math.abs(button!.y - (note!.y + note!.height))).toBeLessThan(60);
    expect(await status.locator('.tag-word').innerText()).toMatch(/sorted/i);
    expect(await status.innerText()).not.toMatch(/Done:|Dismiss/);
    await shotBoth(page, 'saved-note', page.locator('.form-actions'));

    // Put away.
    await status.getByRole('button', { name: /^Put away/ }).click();
    await status.waitFor({ state: 'detached' });
    expect(browser.pageErrors).toEqual([]);
  });

  it('shows no message on a new blank curve row, even after a refused save', async () => {
    const { page } = await startWorkshop();
    await newEngine(page);
    await page.getByLabel('Name', { exact: true }).fill('Curve check');
    await page.getByRole('button', { name: 'Save the engine' }).click(); // bore etc. blank: refused
    await page.getByTestId('fix-list').waitFor();
    await page.getByRole('button', { name: 'Add a row' }).click();
    await page.getByLabel('Row 1 engine speed (rpm)').waitFor();
    expect(await page.getByTestId('error-advanceCurve.0.rpm').count()).toBe(0);
    expect(await page.getByTestId('error-advanceCurve.0.advanceDeg').count()).toBe(0);
    expect(await fixLines(page).filter({ hasText: 'Row 1' }).count()).toBe(0);
    // Typing half a row asks for the other half.
    await page.getByLabel('Row 1 engine speed (rpm)').fill('1200');
    await page.getByRole('button', { name: 'Save the engine' }).click();
    await page.getByTestId('error-advanceCurve.0.advanceDeg').waitFor();
    expect(await fixLines(page).filter({ hasText: 'Row 1 advance (crankshaft degrees)' }).count()).toBe(1);
  });
});

describe('the part form in one pass', () => {
  it('lists a highest supply below the lowest together with a letter in the current', async () => {
    const { page } = await startWorkshop();
    await page.getByRole('navigation', { name: 'Screens' }).getByRole('button', { name: 'Parts on the shelf' }).click();
    await page.getByRole('heading', { level: 1, name: 'Parts on the shelf' }).waitFor();
    await page.getByRole('button', { name: 'Add a part' }).click();
    await page.getByLabel('Kind of part').selectOption('module');
    await page.getByLabel('Name', { exact: true }).fill('Bench module');
    await page.getByLabel('Works from (V)').fill('14');
    await page.getByLabel('Works up to (V)').fill('8');
    await page.getByLabel('Maximum switched current (A)').fill('8 A');
    await page.getByRole('button', { name: 'Save the part' }).click();
    await page.getByTestId('fix-list').waitFor();
    const lines = (await fixLines(page).allInnerTexts()).join('\n');
    expect(lines).toMatch(/Works up to \(V\): The maximum supply must be above the minimum\./);
    expect(lines).toMatch(/Maximum switched current \(A\): .*must be a number/);
  });
});
