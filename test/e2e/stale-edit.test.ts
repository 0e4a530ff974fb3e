/**
 * Issue 8, defect 1, in Chromium through the browser host: an engine saved somewhere else while
 * the editor is open (a second window, here the API) is not overwritten. The save is refused with
 * the store's sentence, everything typed stays, and "Reload the saved version" shows the newer one.
 */
import { describe, expect, it } from 'vitest';
import { api, e2eSuite, screenshot } from './harness.js';

const { startWorkshop } = e2eSuite();

type Stored = { id: number; name: string; updatedAt: string } & Record<string, unknown>;

describe('a stale engine editor', () => {
  it('refuses the save, keeps what was typed, and reloads the newer version on request', async () => {
    const { host, page } = await startWorkshop();
    const [first] = await api<Array<{ id: number; name: string }>>(host, 'engines.list', {});
    await page.getByRole('button', { name: first!.name, exact: true }).click();
    const nameField = page.getByLabel('Name', { exact: true });
    await nameField.waitFor();
    expect(await nameField.inputValue()).toBe(first!.name);

    // Another window saves the engine under a new name.
    const stored = await api<Stored>(host, 'engines.get', { id: first!.id });
    const { id: _id, updatedAt, ...fields } = stored;
    await api(host, 'engines.update', { id: first!.id, expectedUpdatedAt: updatedAt, engine: { ...fields, name: 'Renamed in the other window' } });

    await nameField.fill('Renamed in this window');
    await page.getByRole('button', { name: /^Save/ }).first().click();
    const status = page.getByTestId('editor-status');
    await status.getByText(/changed somewhere else after you opened it, so your changes were not saved/).waitFor();
    expect(await nameField.inputValue()).toBe('Renamed in this window');
    expect((await api<Stored>(host, 'engines.get', { id: first!.id })).name).toBe('Renamed in the other window');
    await screenshot(page, 'engine-editor-stale');

    await page.getByTestId('reload-record').click();
    await page.waitForFunction(() => (document.querySelector('#f-name') as HTMLInputElement | null)?.value === 'Renamed in the other window');
    expect(await nameField.inputValue()).toBe('Renamed in the other window');
  }, 120_000);
});
