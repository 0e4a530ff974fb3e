/**
 * Issue 8, defect 2, in Chromium through the browser host: a part damaged on disk (raw SQL, as a
 * hand edit would) is left out of the parts list; the frame says one record could not be read,
 * shows it with the store's reason, and removes it after asking. Then the notice goes.
 */
import Database from 'better-sqlite3';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { api, e2eSuite, freshDir, openScreen, screenshot } from './harness.js';

const suite = e2eSuite();

describe('records that could not be read', () => {
  it('are counted above the screen, shown with their reason, and can be removed', async () => {
    const dataDir = freshDir('unreadable');
    const { host, page } = await suite.startWorkshop(dataDir);
    const parts = await api<Array<{ id: number; kind: string; name: string }>>(host, 'parts.list', {});
    const plans = await api<Array<Record<string, number | null>>>(host, 'plans.list', {});
    const used = new Set(plans.flatMap((p) => [p.moduleId, p.coilId, p.ballastId, p.tachId, p.leadsId, p.plugId]));
    const victim = parts.find((p) => !used.has(p.id))!;
    const raw = new Database(path.join(dataDir, 'workshop.sqlite3'));
    raw.prepare("UPDATE parts SET data = '{}' WHERE id = ?").run(victim.id);
    raw.close();

    await page.reload();
    await openScreen(page, 'Parts on the shelf');
    const notice = page.getByTestId('unreadable');
    await notice.getByText('1 record could not be read and is left out of the lists.').waitFor();
    await page.getByTestId('unreadable-toggle').click();
    const row = page.getByTestId(`unreadable-parts-${victim.id}`);
    expect(await row.innerText()).toContain(`“${victim.kind}: ${victim.name}”`);
    expect(await row.innerText()).toMatch(/could not be read/);
    await screenshot(page, 'unreadable-records');
    await row.getByRole('button', { name: 'Remove it' }).click();
    await page.getByTestId('unreadable-remove-dialog').getByRole('button', { name: 'Remove it' }).click();
    await notice.waitFor({ state: 'detached' });
    expect(await api(host, 'store.unreadable', {})).toEqual({ rows: [] });
    expect((await api<Array<{ id: number }>>(host, 'parts.list', {})).some((p) => p.id === victim.id)).toBe(false);
  }, 120_000);
});
