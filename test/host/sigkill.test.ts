/**
 * Durability across a hard kill. Each round saves engines through the real host, SIGKILLs it the
 * moment the last acknowledgement arrives, restarts it on the same data folder and checks every
 * acknowledged engine is there exactly as acknowledged. SIGKILL cannot be caught, so nothing of
 * ours runs at exit; what makes this hold is SQLite's guarantee that a committed transaction in
 * WAL mode survives the process dying, since it is already in the WAL file in the OS page cache
 * (sqlite.org/wal.html, and sqlite.org/pragma.html#pragma_synchronous: with synchronous=NORMAL in
 * WAL mode "a transaction committed ... might roll back following a power loss or system crash",
 * not following an application crash).
 */
import { mkdtempSync, rmSync, statSync } from 'node:fs';
import { request } from 'node:http';
import os from 'node:os';
import path from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { engineInput } from '../fixtures/engine-input.js';
import { invoke, startHost, type RunningHost } from './host-process.js';

const dataDir = mkdtempSync(path.join(os.tmpdir(), 'ignition-sigkill-'));
let current: RunningHost | null = null;

afterAll(async () => {
  current?.signal('SIGKILL');
  await current?.exited;
  rmSync(dataDir, { recursive: true, force: true });
});

/** POST a save and SIGKILL the host inside the callback that receives the acknowledgement. */
function saveThenKill(host: RunningHost, channel: string, body: unknown): Promise<any> {
  return new Promise((resolve, reject) => {
    const payload = JSON.stringify({ channel, request: body });
    const req = request(
      {
        host: '127.0.0.1',
        port: host.port,
        method: 'POST',
        path: '/api/invoke',
        agent: false,
        headers: { Host: `127.0.0.1:${host.port}`, Authorization: `Bearer ${host.token}`, 'Content-Type': 'application/json' },
      },
      (res) => {
        const chunks: Buffer[] = [];
        res.on('data', (c: Buffer) => chunks.push(c));
        res.on('end', () => {
          host.signal('SIGKILL'); // no await, no tick in between
          resolve(JSON.parse(Buffer.concat(chunks).toString('utf8')));
        });
      },
    );
    req.on('error', reject);
    req.end(payload);
  });
}

describe('saves survive SIGKILL of the host', () => {
  it('keeps every acknowledged engine and update across four kills and restarts', async () => {
    const acknowledged = new Map<number, { updatedAt: string }>(); // id -> engine exactly as the host answered
    let updatedId: number | null = null;

    for (let round = 1; round <= 4; round++) {
      current = await startHost(dataDir, 'node');
      const host = current;

      // Everything acknowledged before this start must be there, unchanged.
      for (const [id, value] of acknowledged) {
        const got = await invoke(host, 'engines.get', { id });
        expect(got.json, `round ${round}: engine ${id} after restart`).toEqual({ ok: true, value });
      }

      // Several ordinary saves, one update of an earlier engine, then a last save killed on its ack.
      for (let i = 1; i <= 3; i++) {
        const { json } = await invoke(host, 'engines.create', { engine: engineInput({ name: `Round ${round} save ${i}` }) });
        expect(json.ok).toBe(true);
        acknowledged.set(json.value.id, json.value);
      }
      if (updatedId !== null) {
        const { json } = await invoke(host, 'engines.update', { id: updatedId, expectedUpdatedAt: acknowledged.get(updatedId)!.updatedAt, engine: engineInput({ name: `Updated in round ${round}`, idleRpm: 700 + round }) });
        expect(json.ok).toBe(true);
        acknowledged.set(updatedId, json.value);
      }
      // Concurrent saves in flight when the kill lands: only the acknowledged one is promised.
      const last = saveThenKill(host, 'engines.create', { engine: engineInput({ name: `Round ${round} last save` }) });
      const inFlight = [1, 2].map((k) =>
        invoke(host, 'engines.create', { engine: engineInput({ name: `Round ${round} in flight ${k}` }) }).catch(() => null),
      );
      const lastJson = await last;
      expect(lastJson.ok).toBe(true);
      acknowledged.set(lastJson.value.id, lastJson.value);
      for (const r of await Promise.all(inFlight)) if (r?.json?.ok) acknowledged.set(r.json.value.id, r.json.value);
      updatedId ??= lastJson.value.id;

      const { signal } = await host.exited;
      expect(signal).toBe('SIGKILL');
      // Proof the kill was a crash and not a clean close: the WAL was left behind with the
      // round's commits in it (a clean close checkpoints and deletes it).
      expect(statSync(path.join(dataDir, 'workshop.sqlite3-wal')).size).toBeGreaterThan(0);
      current = null;
    }

    // A final start: the whole history is there and the store still answers normally.
    current = await startHost(dataDir, 'node');
    const list = await invoke(current, 'engines.list', {});
    expect(list.json.ok).toBe(true);
    const listedIds = new Set((list.json.value as Array<{ id: number }>).map((e) => e.id));
    for (const [id, value] of acknowledged) {
      expect(listedIds.has(id)).toBe(true);
      expect((await invoke(current, 'engines.get', { id })).json).toEqual({ ok: true, value });
    }
    expect(acknowledged.size).toBeGreaterThanOrEqual(4 * 4);
  }, 180_000);
});
