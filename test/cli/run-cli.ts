/** Runs the real command line as a child process (`npx tsx electron/cli.ts ...`) from the repo root. */
import { spawnSync } from 'node:child_process';
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';

export const repoRoot = resolve(import.meta.dirname, '../..');

export interface CliRun {
  code: number | null;
  stdout: string;
  stderr: string;
}

export function runCli(args: readonly string[]): CliRun {
  const r = spawnSync('npx', ['tsx', 'electron/cli.ts', ...args], { cwd: repoRoot, encoding: 'utf8', timeout: 120_000 });
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
