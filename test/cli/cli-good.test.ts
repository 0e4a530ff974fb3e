/**
 * Good runs of the command line: check, search and netlist on the example files, with output that
 * holds no NaN, no Infinity and no null where a figure belongs; and every demo engine checked
 * against every demo module with every rule explained.
 */
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { runNgspice } from '../reference/ngspice.js';
import { demoEngines, demoParts, planWithModules } from './demo-plan.js';
import { repoRoot, runCli, tempFile } from './run-cli.js';

const planExample = join(repoRoot, 'test/fixtures/plan-example.json');
const binExample = join(repoRoot, 'test/fixtures/bin-example.json');

/** Fields the report may leave null on purpose (types.ts says when). */
const nullable = new Set([
  'belowMarginFromRpm',
  'primaryClampV',
  'moduleSupplyCrankingV',
  'moduleSupplyRunningV',
  'cd',
  'cdChargeVoltageV',
  'suggestedGapM',
  'gap',
  'ballast',
  'noSparkReason',
  'ballastTemperatureK',
]);

function scan(value: unknown, path: string, problems: string[]): void {
  if (value === null) {
    const key = path.split('.').pop()!.replace(/\[\d+\]$/, '');
    if (!nullable.has(key)) problems.push(`${path} is null`);
  } else if (typeof value === 'number' && !Number.isFinite(value)) problems.push(`${path} is ${value}`);
  else if (Array.isArray(value)) value.forEach((v, i) => scan(v, `${path}[${i}]`, problems));
  else if (typeof value === 'object') for (const [k, v] of Object.entries(value as object)) scan(v, `${path}.${k}`, problems);
}

function expectCleanJson(stdout: string): any {
  expect(stdout).not.toMatch(/NaN|Infinity/);
  const parsed = JSON.parse(stdout);
  const problems: string[] = [];
  scan(parsed, '$', problems);
  expect(problems).toEqual([]);
  return parsed;
}

function expectExplained(rules: any[], where: string): void {
  expect(rules.length, where).toBeGreaterThan(5);
  for (const r of rules) {
    expect(['pass', 'caution', 'fail'], `${where} ${r.id}`).toContain(r.verdict);
    // A sentence each: at least two words, starting with a capital, ending with a full stop.
    expect(r.why, `${where} ${r.id} why`).toMatch(/^[A-Z0-9][^]*\s[^]*[.)!"]$/);
    expect(r.action, `${where} ${r.id} action`).toMatch(/^[A-Z0-9][^]*\s[^]*[.)!"]$/);
  }
}

describe('the command line on good input', () => {
  it('prints --help and exits 0', () => {
    const r = runCli(['--help']);
    expect(r.code).toBe(0);
    expect(r.stdout).toContain('npm run cli -- check <plan.json>');
    expect(r.stdout).toContain('netlist');
  });

  it('checks the example plan: the existing setup and three candidates, every rule explained', () => {
    const r = runCli(['check', planExample]);
    expect(r.code, r.stderr).toBe(0);
    const out = expectCleanJson(r.stdout);
    expect(out.rows).toHaveLength(4);
    expect(out.candidates).toHaveLength(3);
    for (const s of [out.existing, ...out.candidates]) expectExplained(s.rules, s.label);
    expect(out.existing.points).toBeUndefined();
  });

  it('prints the workshop cautions with every report that says what to change on the ignition', () => {
    for (const args of [['check', planExample], ['search', binExample, '--top', '1']]) {
      const r = runCli(args);
      expect(r.code, r.stderr).toBe(0);
      const out = expectCleanJson(r.stdout);
      const text = (out.cautions as string[]).join(' ');
      // common practice: disconnect the battery, respect the high voltage and stored charge, fuel and fire, defer to service data
      expect(text).toMatch(/battery earth lead/);
      expect(text).toMatch(/kilovolts/);
      expect(text).toMatch(/capacitor/);
      expect(text).toMatch(/fuel/);
      expect(text).toMatch(/service data/);
    }
  });

  it('includes the sweep when asked, and it is clean too', () => {
    const r = runCli(['check', planExample, '--sweep', '--rpm-points', '40']);
    expect(r.code, r.stderr).toBe(0);
    const out = expectCleanJson(r.stdout);
    expect(out.existing.points).toHaveLength(40);
  });

  it('searches the example parts bin and ranks the best three', () => {
    const r = runCli(['search', binExample, '--top', '3']);
    expect(r.code, r.stderr).toBe(0);
    const out = expectCleanJson(r.stdout);
    expect(out.top.length).toBeGreaterThan(0);
    expect(out.top.length).toBeLessThanOrEqual(3);
    expect(out.evaluated).toBeGreaterThan(out.top.length);
    out.top.forEach((t: any, i: number) => {
      expect(t.rank).toBe(i + 1);
      expect(t.verdict).not.toBe('fail');
      expectExplained(t.rules, `${t.module} + ${t.coil}`);
    });
  });

  it('prints a deck that ngspice runs, for an inductive candidate and for the CD candidate', () => {
    const inductive = runCli(['netlist', planExample, '--candidate', '1', '--rpm', '3000', '--scenario', 'break']);
    expect(inductive.code, inductive.stderr).toBe(0);
    expect(inductive.stdout).toMatch(/^Green four-door saloon: .+ at 3000 rpm/);
    expect(inductive.stdout).toMatch(/\.control\nrun\nquit 0\n\.endc\n\.end\n$/);
    const a = runNgspice(inductive.stdout, ['ibreak_a', 'vpeak_v']);
    expect(a.measures.vpeak_v!.value).toBeLessThan(-5000);
    const cd = runCli(['netlist', planExample, '--candidate', '3', '--rpm', '3000', '--scenario', 'cd']);
    expect(cd.code, cd.stderr).toBe(0);
    const b = runNgspice(cd.stdout, ['vcap_v', 'vpeak_v']);
    expect(b.measures.vcap_v!.value).toBeGreaterThan(100);
  });
});

describe('every demo engine against every demo module', () => {
  const modules = demoParts.filter((p) => p.kind === 'module').map((p) => p.name);
  for (const e of demoEngines) {
    it(`${e.name}: every module gets a verdict with why and what to do for every rule`, () => {
      for (let i = 0; i < modules.length; i += 3) {
        const batch = modules.slice(i, i + 3);
        const r = runCli(['check', tempFile(planWithModules(e, batch))]);
        expect(r.code, r.stderr).toBe(0);
        const out = expectCleanJson(r.stdout);
        expect(out.candidates).toHaveLength(batch.length);
        for (const c of out.candidates) {
          expectExplained(c.rules, `${e.name} / ${c.label}`);
          expect(['pass', 'caution', 'fail']).toContain(c.verdict);
        }
      }
    });
  }
});
