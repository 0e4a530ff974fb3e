/**
 * Runs a deck through the real ngspice (`ngspice -b deck.cir`) in a fresh temporary folder and
 * reads its `.meas` results from stdout (`name = value`, MIN/MAX add `at= t`). A missing ngspice
 * is an error, never a skip: the reference tests mean nothing without it.
 */
import { execFileSync, spawnSync } from 'node:child_process';
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';

export const missingNgspiceMessage = 'ngspice is not installed: apt-get install -y ngspice';

export interface Measurement {
  value: number;
  /** The time of a MIN or MAX, s. */
  atS?: number;
}

export interface NgspiceRun {
  measures: Record<string, Measurement>;
  stdout: string;
  stderr: string;
  elapsedMs: number;
}

let checked = false;

/** Throws with the install hint when ngspice is not on the PATH (or on `pathOverride`). */
export function requireNgspice(pathOverride?: string): void {
  if (checked && pathOverride === undefined) return;
  const env = pathOverride === undefined ? process.env : { ...process.env, PATH: pathOverride };
  const probe = spawnSync('ngspice', ['-v'], { encoding: 'utf8', env });
  if (probe.error || probe.status !== 0) throw new Error(missingNgspiceMessage);
  if (pathOverride === undefined) checked = true;
}

const measureLine = /^(\w+)\s+=\s+(\S+)(?:\s+at=\s+(\S+))?/;

/** Parse `name = value` lines (names lower-cased, as ngspice prints them). */
export function parseMeasures(stdout: string): Record<string, Measurement> {
  const out: Record<string, Measurement> = {};
  for (const line of stdout.split('\n')) {
    const m = measureLine.exec(line.trim());
    if (!m) continue;
    const value = Number(m[2]);
    if (!Number.isFinite(value)) continue;
    const entry: Measurement = { value };
    if (m[3] !== undefined && Number.isFinite(Number(m[3]))) entry.atS = Number(m[3]);
    out[m[1]!.toLowerCase()] = entry;
  }
  return out;
}

/** Run one deck; throws if ngspice fails or any of `expect` is missing from its output. */
export function runNgspice(deck: string, expect: readonly string[] = []): NgspiceRun {
  requireNgspice();
  const dir = mkdtempSync(join(tmpdir(), 'ngspice-'));
  try {
    const file = join(dir, 'deck.cir');
    writeFileSync(file, deck);
    const started = performance.now();
    let stdout: string;
    let stderr = '';
    try {
      stdout = execFileSync('ngspice', ['-b', file], { cwd: dir, encoding: 'utf8', stdio: ['ignore', 'pipe', 'pipe'], timeout: 30_000 });
    } catch (e) {
      const err = e as { status?: number; stdout?: string; stderr?: string };
      throw new Error(`ngspice exited with ${String(err.status)}:\n${err.stderr ?? ''}\n${err.stdout ?? ''}`);
    }
    const elapsedMs = performance.now() - started;
    const measures = parseMeasures(stdout);
    const missing = expect.filter((name) => !(name.toLowerCase() in measures));
    if (missing.length > 0) throw new Error(`ngspice printed no result for ${missing.join(', ')}:\n${stdout}`);
    return { measures, stdout, stderr, elapsedMs };
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}

/** Just the ngspice version line, for reports. */
export function ngspiceVersion(): string {
  requireNgspice();
  const out = execFileSync('ngspice', ['-v'], { encoding: 'utf8' });
  return /ngspice-\S+/.exec(out)?.[0] ?? 'ngspice';
}
