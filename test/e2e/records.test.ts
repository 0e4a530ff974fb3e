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
  it('back up, delete an engine, undo it, delete it again, restore the backup and see it back', async () => {
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

    // Delete an engine on its screen, then undo it from the note that follows.
    const victim = before[0]!;
    const plansBefore = await api<unknown[]>(host, 'plans.list', { engineId: victim.id });
    await openScreen(page, 'Engines');
    const deleteIt = async () => {
      await page.getByRole('button', { name: `Delete ${victim.name}` }).click();
      await page.getByRole('dialog', { name: `Delete ${victim.name}?` }).getByRole('button', { name: /^Delete the engine/ }).click();
      await page.getByTestId('removal-notice').getByText(`${victim.name} was deleted`).waitFor();
      expect((await api<Summary[]>(host, 'engines.list', {})).map((e) => e.name)).not.toContain(victim.name);
    };
    await deleteIt();
    await page.getByTestId('removal-notice').getByRole('button', { name: 'Undo' }).click();
    await page.getByTestId('removal-notice').getByText(`${victim.name} is back`).waitFor();
    expect((await api<Summary[]>(host, 'engines.list', {})).find((e) => e.id === victim.id)?.name).toBe(victim.name);
    expect(await api<unknown[]>(host, 'plans.list', { engineId: victim.id })).toEqual(plansBefore);

    // Delete it again; the recently removed list has it until the app closes.
    await deleteIt();
    await openScreen(page, 'Records and backups');
    const removed = page.getByRole('table', { name: 'Recently removed' });
    await removed.getByRole('button', { name: `Put back ${victim.name}` }).waitFor();
    await screenshot(page, 'records-recently-removed');

    // Restoring the backup brings it back too (and starts a fresh recently removed list).
    await list.locator('tbody tr').first().getByRole('button', { name: /^Restore the backup made/ }).click();
    const question = page.getByTestId('restore-question');
    await question.waitFor();
    await screenshot(page, 'records-restore-question');
    await question.getByRole('button', { name: /Restore it/ }).click();
    await page.getByTestId('backup-message').getByText('The workshop is back').waitFor();
    expect((await api<Summary[]>(host, 'engines.list', {})).map((e) => e.name)).toContain(victim.name);
    // The list now holds the backup made before the restore as well.
    await page.getByRole('table', { name: 'Backups' }).getByText('before a restore').waitFor();
    await page.getByTestId('removed-section').getByText('Nothing has been deleted since the app was opened.').waitFor();

    await openScreen(page, 'Engines');
    await page.getByRole('table', { name: 'Engines in this workshop' }).getByText(victim.name, { exact: true }).waitFor();
    expect(browser.pageErrors).toEqual([]);
  }, 120_000);

  it('a plan deleted on the weighing screen comes back from the recently removed list, readings and all', async () => {
    const { host, browser, page } = await startWorkshop();
    const engines = await api<Array<Summary & { planCount: number }>>(host, 'engines.list', {});
    const engine = engines.find((e) => e.planCount > 0)!;
    const plan = (await api<Array<{ id: number; name: string; updatedAt: string }>>(host, 'plans.list', { engineId: engine.id }))[0]!;
    // A reading on it, so the question has something to count.
    await api(host, 'readings.add', { reading: { planId: plan.id, quantity: 'coil-primary-resistance', value: 1.5, unit: 'ohm', takenOn: '2026-12-01', note: '' } });
    const readingsBefore = await api<unknown[]>(host, 'readings.list', { planId: plan.id });

    await openScreen(page, 'Weigh a combination');
    const picker = page.getByLabel('Engine', { exact: true });
    if ((await picker.inputValue()) !== String(engine.id)) await picker.selectOption(String(engine.id));
    await page.getByTestId(`plan-row-${plan.id}`).getByRole('button', { name: `Delete the plan ${plan.name}` }).click();
    const dialog = page.getByRole('dialog', { name: `Delete the plan ${plan.name}?` });
    await dialog.getByTestId('delete-plan-counts').waitFor();
    const n = readingsBefore.length;
    await dialog.getByRole('button', { name: n === 1 ? 'Delete the plan and its reading' : `Delete the plan and its ${n} readings` }).click();
    await page.getByTestId('removal-notice').getByText(`The plan ${plan.name} was deleted`).waitFor();
    expect((await api<Array<{ id: number }>>(host, 'plans.list', {})).some((p) => p.id === plan.id)).toBe(false);
    await page.getByTestId(`plan-row-${plan.id}`).waitFor({ state: 'detached' });

    await openScreen(page, 'Records and backups');
    await page.getByRole('table', { name: 'Recently removed' }).getByRole('button', { name: `Put back ${plan.name}` }).click();
    await page.getByTestId('removed-message').getByText(`${plan.name} is back`).waitFor();
    expect((await api<Array<{ id: number; updatedAt: string }>>(host, 'plans.list', {})).find((p) => p.id === plan.id)?.updatedAt).toBe(plan.updatedAt);
    expect(await api<unknown[]>(host, 'readings.list', { planId: plan.id })).toEqual(readingsBefore);
    expect(browser.pageErrors).toEqual([]);
  }, 120_000);

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
