/**
 * What the bridge tests stand on: for each test, `openBackend` on a real store file in a fresh
 * temp folder (which loads the demo workshop on first open), with a second, read-only SQLite
 * connection to the same file, so "nothing changed" is checked on disk. Nothing is mocked.
 * Call once at the top of a test file; it registers its own beforeEach/afterEach.
 */
import Database from 'better-sqlite3';
import { afterEach, beforeEach } from 'vitest';
import { openBackend, type Backend } from '../../electron/ipc/backend.js';
import type { ChannelName, Result } from '../../electron/ipc/channels.js';
import { tempDir } from '../db/samples.js';

const tables = ['engines', 'advance_points', 'parts', 'plans', 'readings', 'sheet_ticks', 'meta'];

export type StoreUnderTest = {
  readonly dir: string;
  readonly backend: Backend;
  /** Closes the store and opens the same folder again, as the next start of the app would. */
  reopen(host: 'browser' | 'desktop'): void;
  /** Rows in every table, read through the read-only connection. */
  counts(): Record<string, number>;
  call(channel: unknown, payload: unknown): Promise<Result<any>>;
  /** The value of a request that must succeed; a failure throws with the whole error. */
  ok<T = any>(channel: ChannelName, payload: unknown): Promise<T>;
};

export function backendPerTest(label: string): StoreUnderTest {
  let dir = '';
  let cleanup: () => void = () => {};
  let backend: Backend;
  let reader: Database.Database;

  const open = (host: 'browser' | 'desktop'): void => {
    backend = openBackend({ dataDir: dir, host, version: '0.1.0-test' });
    reader = new Database(backend.storeFile, { readonly: true });
  };
  const shut = (): void => {
    reader.close();
    backend.close();
  };
  beforeEach(() => {
    ({ dir, cleanup } = tempDir(label));
    open('browser');
  });
  afterEach(() => {
    shut();
    cleanup();
  });

  const call = (channel: unknown, payload: unknown): Promise<Result<any>> => backend.dispatch(channel, payload);
  return {
    get dir() {
      return dir;
    },
    get backend() {
      return backend;
    },
    reopen(host) {
      shut();
      open(host);
    },
    counts() {
      const out: Record<string, number> = {};
      for (const t of tables) out[t] = (reader.prepare(`SELECT COUNT(*) AS n FROM ${t}`).get() as { n: number }).n;
      return out;
    },
    call,
    async ok<T = any>(channel: ChannelName, payload: unknown): Promise<T> {
      const r = await call(channel, payload);
      if (!r.ok) throw new Error(`${channel} failed: ${JSON.stringify(r.error)}`);
      return r.value as T;
    },
  };
}
