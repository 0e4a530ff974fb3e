/**
 * 'settings.get' / 'settings.set' over the bridge, on a real store file (backendPerTest): the
 * answer is every setting; an unknown key or a bad value comes back INVALID_INPUT with the key as
 * the field and nothing written; what is set is there after the store is closed and opened again.
 */
import { describe, expect, it } from 'vitest';
import { backendPerTest } from './backend-per-test.js';

const store = backendPerTest('settings');
const { call, ok } = store;

describe('settings over the bridge', () => {
  it('answers the defaults, then what was set, also after the store is opened again', async () => {
    expect(await ok('settings.get', {})).toEqual({ lengthUnit: 'mm', workingEngineId: null, weighTicks: {}, firstRunHidden: false, lastScreen: 'engines', benchPlanId: null, pageSize: 'A4' });
    const engines = await ok<Array<{ id: number }>>('engines.list', {});
    const plans = await ok<Array<{ id: number }>>('plans.list', {});
    const set = await ok('settings.set', { lengthUnit: 'inch', workingEngineId: engines[0]!.id, lastScreen: 'sheet', benchPlanId: plans[0]!.id, pageSize: 'Letter' });
    expect(set).toMatchObject({ lengthUnit: 'inch', workingEngineId: engines[0]!.id, lastScreen: 'sheet', benchPlanId: plans[0]!.id, pageSize: 'Letter' });
    store.reopen('browser');
    expect(await ok('settings.get', {})).toEqual({ lengthUnit: 'inch', workingEngineId: engines[0]!.id, weighTicks: {}, firstRunHidden: false, lastScreen: 'sheet', benchPlanId: plans[0]!.id, pageSize: 'Letter' });
  });

  it('refuses unknown keys and bad values naming each, and writes none of that request', async () => {
    const r = await call('settings.set', { lengthUnit: 'furlong', firstRunHidden: true, theme: 'dark' });
    expect(r.ok).toBe(false);
    if (r.ok) return;
    expect(r.error.code).toBe('INVALID_INPUT');
    expect(r.error.fields).toEqual({
      lengthUnit: 'The length unit is "mm" or "inch".',
      theme: 'There is no setting called “theme”; the settings are lengthUnit, workingEngineId, weighTicks, firstRunHidden, lastScreen, benchPlanId, pageSize.',
    });
    expect((await ok<{ firstRunHidden: boolean }>('settings.get', {})).firstRunHidden).toBe(false);
    // The get takes nothing: an unknown key there is refused too.
    expect(await call('settings.get', { lengthUnit: 'mm' })).toMatchObject({ ok: false, error: { code: 'INVALID_INPUT' } });
  });
});
