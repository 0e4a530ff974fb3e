/**
 * Runs the real command line as a child process from the repo root: the bundle that ships
 * (`dist-electron/cli.mjs`, package.json "bin"), built from today's sources once per test worker by
 * the project's own build script (`build/bundle-electron.mjs --cli-only`) and run with plain Node.
 * Starting it that way takes about a second; through tsx, which compiles the sources on each
 * start, about four.
 */
import { execFileSync, spawnSync } from 'node:child_process';
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';

export const repoRoot = resolve(import.meta.dirname, '../..');

export interface CliRun {
  code: number | null;
  stdout: string;
  stderr: string;
}

let bundle: string | null = null;

/** The command line bundled from the current sources (inside the repo, so better-sqlite3 resolves). */
function cliBundle(): string {
  if (bundle) return bundle;
  const out = join(repoRoot, 'test-output', 'cli-bundle', String(process.pid));
  execFileSync(process.execPath, ['build/bundle-electron.mjs', '--cli-only', '--out', out], { cwd: repoRoot, encoding: 'utf8' });
  bundle = join(out, 'cli.mjs');
  return bundle;
}

export function runCli(args: readonly string[]): CliRun {
  const r = spawnSync(process.execPath, [cliBundle(), ...args], { cwd: repoRoot, encoding: 'utf8', timeout: 120_000 });
  return { code: r.status, stdout: r.stdout, stderr: r.stderr };
}

const dir = mkdtempSync(join(tmpdir(), 'cli-test-'));
let counter = 0;

/** Write `content` (an object as JSON, or raw text) to a fresh temporary file and return its path. */
export function tempFile(content: unknown): string {
  const path = join(dir, `input-${++counter}.json`);
  writeFileSync(path, typeof content === 'string' ? content : JSON.stringify(content, null, 2));
  return path;
}
