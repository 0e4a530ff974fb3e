/**
 * Working conditions in the app: a cold morning is one setting away on the weighing screen, and
 * every condition the report lists can be set per engine in the engine editor, kept in the store,
 * and refused beside its field when out of range.
 */
import { describe, expect, it } from 'vitest';
import type { ComparisonAnswer } from '../../electron/ipc/channels.js';
import { api, e2eSuite, freshDir, messageBeside, openScreen, screenshot } from './harness.js';

type Summary = { id: number; name: string };
type StoredEngine = { id: number; conditions: Record<string, number | undefined> };
const SALOON = 'Green four-door saloon';
const { startWorkshop } = e2eSuite();

describe('working conditions', () => {
  it('weighs a cold morning from the weighing screen: the engine keeps -18 degC and the check uses it', async () => {
    const { host, page } = await startWorkshop(freshDir('cold-morning'));
    const saloon = (await api<Summary[]>(host, 'engines.list', {})).find((e) => e.name === SALOON)!;
    await openScreen(page, 'Weigh a combination');
    await page.getByLabel('Engine', { exact: true }).selectOption({ label: SALOON });
    await page.getByTestId('setup-card-1').waitFor();

    // The order the page asks in: the comparison first, then the shelf (searched again once the
    // comparison has answered, so the charts come back first).
    const asked: string[] = [];
    page.on('request', (r) => {
      if (!r.url().endsWith('/api/invoke')) return;
      const channel = (JSON.parse(r.postData() ?? '{}') as { channel?: string }).channel;
      if (channel === 'check.plans' || channel === 'check.search') asked.push(channel);
    });
    await page.getByLabel('Ambient air (°C)').fill('-18');
    await page.getByRole('button', { name: 'Weigh at this temperature' }).click();
    await expect.poll(() => page.getByTestId('ambient-message').innerText()).toContain('weighing again');
    await expect.poll(() => asked).toEqual(['check.plans', 'check.search']);
    const stored = await api<StoredEngine>(host, 'engines.get', { id: saloon.id });
    expect(stored.conditions.ambientC).toBe(-18);
    const plans = await api<Array<{ id: number }>>(host, 'plans.list', { engineId: saloon.id });
    const answer = await api<ComparisonAnswer>(host, 'check.plans', { engineId: saloon.id, planIds: plans.map((p) => p.id) });
    const ambient = answer.conditions.find((c) => c.name === 'Air temperature')!;
    expect(ambient.value).toBe(-18);
    expect(ambient.source).toBe('engine override');
    await screenshot(page, 'weigh-cold-morning');

    // A value outside the plausible range is refused beside the box, and nothing is stored.
    await page.getByLabel('Ambient air (°C)').fill('-60');
    await page.getByRole('button', { name: 'Weigh at this temperature' }).click();
    await expect.poll(() => page.getByTestId('ambient-message').innerText()).toMatch(/-40/);
    expect((await api<StoredEngine>(host, 'engines.get', { id: saloon.id })).conditions.ambientC).toBe(-18);

    // The comparison is weighed at a typed temperature while it is saved; when the save is refused
    // (here the engine was saved elsewhere meanwhile), it is weighed again with what is stored.
    const elsewhere = await api<StoredEngine & { updatedAt: string }>(host, 'engines.get', { id: saloon.id });
    const { id: _id, updatedAt, ...rest } = elsewhere;
    await api(host, 'engines.update', { id: saloon.id, expectedUpdatedAt: updatedAt, engine: { ...rest, notes: 'Saved from another window.' } });
    const bodies: Array<{ conditions?: { ambientC?: number } }> = [];
    page.on('request', (r) => {
      if (!r.url().endsWith('/api/invoke')) return;
      const body = JSON.parse(r.postData() ?? '{}') as { channel?: string; request?: { conditions?: { ambientC?: number } } };
      if (body.channel === 'check.plans') bodies.push(body.request ?? {});
    });
    await page.getByLabel('Ambient air (°C)').fill('5');
    await page.getByRole('button', { name: 'Weigh at this temperature' }).click();
    await expect.poll(() => page.getByTestId('ambient-message').innerText()).toMatch(/figures shown are for what is stored/);
    await expect.poll(() => bodies.length).toBe(2);
    expect(bodies[0]!.conditions?.ambientC).toBe(5);
    expect(bodies[1]!.conditions).toBeUndefined();
    expect((await api<StoredEngine>(host, 'engines.get', { id: saloon.id })).conditions.ambientC).toBe(-18);
  });

  it('sets a condition for one engine in its editor, keeps it, and refuses one out of range beside its field', async () => {
    const { host, page } = await startWorkshop(freshDir('conditions-editor'));
    const saloon = (await api<Summary[]>(host, 'engines.list', {})).find((e) => e.name === SALOON)!;
    await page.getByRole('button', { name: `Edit ${saloon.name}` }).click();
    await page.getByRole('heading', { level: 1, name: `Engine: ${saloon.name}` }).waitFor();
    await page.getByTestId('conditions-editor').locator('summary').click();

    const coupling = 'Coil coupling between windings (0.9 to 0.9999)';
    await page.getByLabel(coupling, { exact: true }).fill('1.2');
    await page.getByRole('button', { name: 'Save the engine' }).click();
    expect(await messageBeside(page, coupling, 'conditions.couplingK')).toMatch(/0\.9999|coupling/i);
    expect((await api<StoredEngine>(host, 'engines.get', { id: saloon.id })).conditions.couplingK).toBeUndefined();

    await page.getByLabel(coupling, { exact: true }).fill('0.98');
    await page.getByRole('button', { name: 'Save the engine' }).click();
    await expect.poll(async () => (await api<StoredEngine>(host, 'engines.get', { id: saloon.id })).conditions.couplingK).toBe(0.98);
    await screenshot(page, 'engine-conditions');
  });
});
