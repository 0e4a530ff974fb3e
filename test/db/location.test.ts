/** Where the workshop file lives: the `--data-dir` flag, then IGNITION_DATA_DIR, then the caller's default. */
import { existsSync, statSync } from 'node:fs';
import { join, resolve } from 'node:path';
import { afterEach, describe, expect, it } from 'vitest';
import { STORE_FILE_NAME, resolveDataDir, storeFileIn } from '../../db/location.js';
import { tempDir } from './samples.js';

describe('resolveDataDir', () => {
  it('reads --data-dir followed by a folder', () => {
    expect(resolveDataDir(['node', 'host.ts', '--data-dir', '/srv/workshop'], {})).toBe('/srv/workshop');
  });
  it('reads --data-dir=folder', () => {
    expect(resolveDataDir(['--port', '0', '--data-dir=/srv/bench'], {})).toBe('/srv/bench');
  });
  it('makes a relative folder absolute against the current directory', () => {
    expect(resolveDataDir(['--data-dir', 'here'], {})).toBe(resolve('here'));
  });
  it('prefers the flag over IGNITION_DATA_DIR', () => {
    expect(resolveDataDir(['--data-dir=/a'], { IGNITION_DATA_DIR: '/b' })).toBe('/a');
  });
  it('falls back to IGNITION_DATA_DIR, then to null', () => {
    expect(resolveDataDir([], { IGNITION_DATA_DIR: '/from/env' })).toBe('/from/env');
    expect(resolveDataDir([], {})).toBeNull();
    expect(resolveDataDir([], { IGNITION_DATA_DIR: '  ' })).toBeNull();
  });
  it('treats a flag with no folder after it as absent, not as a folder named after the next flag', () => {
    expect(resolveDataDir(['--data-dir'], {})).toBeNull();
    expect(resolveDataDir(['--data-dir', '--port', '0'], { IGNITION_DATA_DIR: '/env' })).toBe('/env');
    expect(resolveDataDir(['--data-dir='], {})).toBeNull();
  });
});

describe('storeFileIn', () => {
  const cleanups: Array<() => void> = [];
  afterEach(() => cleanups.splice(0).forEach((c) => c()));

  it('creates a missing folder and its parents, and names the file inside it', () => {
    const t = tempDir('location');
    cleanups.push(t.cleanup);
    const nested = join(t.dir, 'one', 'two');
    expect(storeFileIn(nested)).toBe(join(nested, STORE_FILE_NAME));
    expect(statSync(nested).isDirectory()).toBe(true);
    expect(existsSync(join(nested, STORE_FILE_NAME))).toBe(false);
    expect(STORE_FILE_NAME).toBe('workshop.sqlite3');
  });
});
