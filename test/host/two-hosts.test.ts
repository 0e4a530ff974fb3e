/**
 * Issue 8, defect 4: two browser hosts on one data folder. The second says plainly that the folder
 * is in use, by whom, and exits with status 1 without opening the store; the first keeps answering.
 * After the first stops (SIGTERM, which releases the lock), a new host starts on the folder. Real
 * host processes (`node --import tsx electron/web-host.ts`).
 */
import { mkdtempSync, rmSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { invoke, startHost, type RunningHost } from './host-process.js';

const started: RunningHost[] = [];
const dirs: string[] = [];
afterAll(async () => {
  for (const h of started) {
    h.signal('SIGTERM');
    await h.exited;
  }
  for (const d of dirs) rmSync(d, { recursive: true, force: true });
});

describe('two browser hosts on one data folder', () => {
  it('refuses the second with a sentence naming the folder and the first process, and keeps the first answering', async () => {
    const dir = mkdtempSync(path.join(os.tmpdir(), 'ignition-two-hosts-'));
    dirs.push(dir);
    const first = await startHost(dir, 'node');
    started.push(first);

    let refusal = '';
    try {
      started.push(await startHost(dir, 'node'));
    } catch (err) {
      refusal = err instanceof Error ? err.message : String(err);
    }
    expect(refusal).toMatch(/^host exited \(1\) before it was ready/);
    expect(refusal).toContain(`The workshop in ${dir} is already open in a browser host (process ${first.child.pid}`);
    expect(refusal).toContain('Close that one first, or choose another data folder');

    const list = await invoke(first, 'engines.list', {});
    expect(list.json.ok).toBe(true);

    first.signal('SIGTERM');
    expect((await first.exited).code).toBe(0);
    started.splice(started.indexOf(first), 1);
    const next = await startHost(dir, 'node');
    started.push(next);
    expect((await invoke(next, 'engines.list', {})).json).toEqual(list.json);
  }, 120_000);
});
