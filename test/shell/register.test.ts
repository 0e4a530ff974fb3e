/**
 * The channel registration, with a minimal object that has a `handle(channel, fn)` method
 * standing in for Electron's ipcMain: Electron's runtime is absent on this machine (only its type
 * declarations are installed), and the object records exactly what ipcMain would receive. The
 * dispatcher is the real one from electron/ipc/dispatch.ts, with handlers that record their calls.
 * The rule under test is the Electron security checklist's "Validate the sender of all IPC
 * messages" (electronjs.org/docs/latest/tutorial/security).
 */
import { describe, expect, it } from 'vitest';
import { channels } from '../../electron/ipc/channels.js';
import { createDispatcher, type Handlers } from '../../electron/ipc/dispatch.js';
import { registerChannels, type InvokeEventLike } from '../../electron/shell/register.js';
import { isTrustedSender } from '../../electron/shell/sender.js';

const appUrl = 'file:///opt/Ignition%20Planner/resources/app.asar/dist/renderer/index.html';
type Listener = (event: InvokeEventLike, ...args: unknown[]) => unknown;

function setUp() {
  const listeners = new Map<string, Listener>();
  const ipc = {
    handle(channel: string, fn: Listener) {
      if (listeners.has(channel)) throw new Error(`second handler for ${channel}`); // as ipcMain does
      listeners.set(channel, fn);
    },
  };
  const calls: string[] = [];
  const handlers = {
    'app.info': () => {
      calls.push('app.info');
      return { version: '0.1.0', dataDir: '/tmp/x', schemaVersion: 1, host: 'desktop' as const };
    },
  } as unknown as Handlers;
  const logs: string[] = [];
  const names = registerChannels(ipc, createDispatcher(handlers), (u) => isTrustedSender(u, appUrl), (m) => logs.push(m));
  return { listeners, calls, logs, names };
}

const from = (url: string, parent: unknown = null): InvokeEventLike => ({ senderFrame: { url, parent } });

describe('registerChannels', () => {
  it('registers exactly one handler for every channel of the map', () => {
    const { listeners, names } = setUp();
    expect([...listeners.keys()].sort()).toEqual(Object.keys(channels).sort());
    expect(names.sort()).toEqual(Object.keys(channels).sort());
  });

  it('dispatches a request from the app page and answers with the Result', async () => {
    const { listeners, calls } = setUp();
    const answer = await listeners.get('app.info')!(from(`${appUrl}#/engines`), {});
    expect(answer).toEqual({ ok: true, value: { version: '0.1.0', dataDir: '/tmp/x', schemaVersion: 1, host: 'desktop' } });
    expect(calls).toEqual(['app.info']);
  });

  it('still validates a trusted request: a malformed one gets INVALID_INPUT, not a crash', async () => {
    const { listeners, calls } = setUp();
    const answer = (await listeners.get('engines.get')!(from(appUrl), { id: 'seven' })) as { ok: boolean; error: { code: string } };
    expect(answer.ok).toBe(false);
    expect(answer.error.code).toBe('INVALID_INPUT');
    expect(calls).toEqual([]);
  });

  it.each([
    ['a remote page', 'https://evil.example/index.html'],
    ['another local file', 'file:///home/user/Downloads/index.html'],
    ['the app page on another host', 'file://evil.example/opt/Ignition%20Planner/resources/app.asar/dist/renderer/index.html'],
    ['a data: page', 'data:text/html,<script>1</script>'],
    ['about:blank', 'about:blank'],
    ['an empty url', ''],
  ])('ignores a message from %s, logs it, and never dispatches', async (_what, url) => {
    const { listeners, calls, logs } = setUp();
    const answer = await listeners.get('app.info')!(from(url), {});
    expect(answer).toBeUndefined();
    expect(calls).toEqual([]);
    expect(logs).toHaveLength(1);
    expect(logs[0]).toMatch(/Ignored the app\.info request from an unknown sender/);
  });

  it('ignores a sub-frame even when it shows the app page', async () => {
    const { listeners, calls, logs } = setUp();
    const answer = await listeners.get('app.info')!(from(appUrl, { url: appUrl }), {});
    expect(answer).toBeUndefined();
    expect(calls).toEqual([]);
    expect(logs).toHaveLength(1);
  });

  it('ignores a message whose frame is gone (navigated or destroyed)', async () => {
    const { listeners, calls } = setUp();
    expect(await listeners.get('app.info')!({ senderFrame: null }, {})).toBeUndefined();
    expect(await listeners.get('app.info')!({}, {})).toBeUndefined();
    expect(calls).toEqual([]);
  });
});
