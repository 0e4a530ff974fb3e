/**
 * "Records and backups" end to end in Chromium through the real browser host: back up, delete an
 * engine, restore the backup (after the question) and see the engine back; bring in a parts CSV
 * with one bad row and see the row named and nothing added. What the page shows is checked
 * against the host's own API.
 */
import { readFileSync } from 'node:fs';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { api, e2eSuite, openScreen, projectRoot, screenshot } from './harness.js';

type Summary = { id: number; name: string; updatedAt: string };

const { startWorkshop } = e2eSuite();

describe('records and backups', () => {
  it('back up, delete an engine, restore the backup and see it back', async () => {
    const { host, browser, page } = await startWorkshop();
    const before = await api<Summary[]>(host, 'engines.list', {});
    expect(before.length).toBeGreaterThan(0);
    await openScreen(page, 'Records and backups');
    await page.getByRole('button', { name: 'Back up now' }).click();
    await page.getByTestId('backup-message').getByText('Backed up').waitFor();
    const list = page.getByRole('table', { name: 'Backups' });
    await list.locator('tbody tr').first().waitFor();
    const made = (await api<{ backups: Array<{ name: string; counts: { engines: number } }> }>(host, 'backup.list', {})).backups;
    expect(made).toHaveLength(1);
    // The list shows the engines counted in the backup.
    expect((await list.locator('tbody tr').first().locator('td').nth(2).innerText()).trim()).toBe(String(before.length));

    const victim = before[0]!;
    const del = await api<unknown>(host, 'engines.delete', { id: victim.id, deletePlansToo: true, expectedUpdatedAt: victim.updatedAt });
    expect(del).toBeTruthy();
    expect((await api<Summary[]>(host, 'engines.list', {})).map((e) => e.name)).not.toContain(victim.name);

    await list.locator('tbody tr').first().getByRole('button', { name: /^Restore the backup made/ }).click();
    const question = page.getByTestId('restore-question');
    await question.waitFor();
    await screenshot(page, 'records-restore-question');
    await question.getByRole('button', { name: /Restore it/ }).click();
    await page.getByTestId('backup-message').getByText('The workshop is back').waitFor();
    expect((await api<Summary[]>(host, 'engines.list', {})).map((e) => e.name)).toContain(victim.name);
    // The list now holds the backup made before the restore as well.
    await page.getByRole('table', { name: 'Backups' }).getByText('before a restore').waitFor();

    await openScreen(page, 'Engines');
    await page.getByRole('table', { name: 'Engines in this workshop' }).getByText(victim.name, { exact: true }).waitFor();
    expect(browser.pageErrors).toEqual([]);
  }, 90_000);

  it('a parts CSV with one bad row is refused: the row is named and nothing is added', async () => {
    const { host, browser, page } = await startWorkshop();
    const coilsBefore = (await api<unknown[]>(host, 'parts.list', { kind: 'coil' })).length;
    await openScreen(page, 'Records and backups');
    const example = readFileSync(path.join(projectRoot, 'test/fixtures/csv/coils-example.csv'), 'utf8').trimEnd().split('\n');
    // Row 3 (the header is row 1) gets a primary resistance of zero.
    const cells = example[2]!.split(',');
    const bad = [example[0], example[1], example[2]!.replace(/,1\.5,5\.5,/, ',0,5.5,'), example[3]].join('\n');
    expect(bad).not.toBe(example.join('\n'));
    expect(cells.length).toBeGreaterThan(3);
    await page.getByTestId('csv-kind').selectOption('coil');
    await page.getByTestId('csv-in').setInputFiles({ name: 'coils.csv', mimeType: 'text/csv', buffer: Buffer.from(bad) });
    const problems = page.getByTestId('csv-import-problems');
    await problems.waitFor();
    expect(await problems.innerText()).toContain('row 3, primary resistance: must be more than zero.');
    await screenshot(page, 'records-csv-refused');
    expect((await api<unknown[]>(host, 'parts.list', { kind: 'coil' })).length).toBe(coilsBefore);

    // The good file: a preview first, nothing written until "Import".
    await page.getByTestId('csv-in').setInputFiles({ name: 'coils.csv', mimeType: 'text/csv', buffer: Buffer.from(example.join('\n')) });
    await page.getByTestId('csv-import-preview').waitFor();
    expect(await page.getByTestId('csv-import-preview').innerText()).toContain('To add: 3 parts');
    expect((await api<unknown[]>(host, 'parts.list', { kind: 'coil' })).length).toBe(coilsBefore);
    await page.getByRole('button', { name: 'Import', exact: true }).click();
    await page.getByTestId('csv-import-done').waitFor();
    expect((await api<unknown[]>(host, 'parts.list', { kind: 'coil' })).length).toBe(coilsBefore + 3);
    expect(browser.pageErrors).toEqual([]);
  }, 90_000);
});
