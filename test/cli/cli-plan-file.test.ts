/**
 * The plan file refuses what it does not know and takes every working condition; `check` reads
 * its switches in any order; the sweep quotes the entered speeds. Runs the real command line as a
 * child process on the example plan (test/fixtures/plan-example.json: cranking 180, idle 750,
 * redline 6000 rpm).
 */
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { repoRoot, runCli, tempFile } from './run-cli.js';

const examplePath = join(repoRoot, 'test/fixtures/plan-example.json');
const example = (): Record<string, any> => JSON.parse(readFileSync(examplePath, 'utf8'));

function refused(args: string[]): string {
  const r = runCli(args);
  expect(r.code, r.stderr).toBe(2);
  expect(r.stdout).toBe('');
  expect(r.stderr).not.toMatch(/\n\s+at .+:\d+:\d+/);
  expect(r.stderr).not.toMatch(/Error:|ZodError|TypeError/);
  return r.stderr;
}

describe('unknown settings in a plan file', () => {
  it('refuses a misspelt engine setting and says which one was meant', () => {
    const f = example();
    f.engine.pointsFloatRPM = f.engine.pointsFloatRpm;
    delete f.engine.pointsFloatRpm;
    expect(refused(['check', tempFile(f)])).toContain('engine: unknown setting "pointsFloatRPM" (did you mean pointsFloatRpm?)');
  });

  it('finds them anywhere (conditions, existing, its parts, candidates, options, the top) and says every problem at once', () => {
    const f = example();
    f.engine.conditions = { ambiantC: -18, ambientPressurePa: 101.3 };
    f.existing.coil.primaryResistanceOhm20c = 1.5;
    f.existing.plugGap = 0.6;
    f.candidates[0].module.maxCurent = 8;
    f.candidates[1].crankingByPass = true;
    f.options.rpmpoints = 40;
    f.candidate = [];
    const err = refused(['check', tempFile(f)]);
    for (const line of [
      'engine.conditions: unknown setting "ambiantC" (did you mean ambientC?)',
      'existing.coil: unknown setting "primaryResistanceOhm20c" (did you mean primaryResistanceOhm20C?)',
      'existing: unknown setting "plugGap" (did you mean plugGapMm?)',
      'candidates.0.module: unknown setting "maxCurent" (did you mean maxCurrentA?)',
      'candidates.1: unknown setting "crankingByPass" (did you mean crankingBypass?)',
      'options: unknown setting "rpmpoints" (did you mean rpmPoints?)',
      '(the file): unknown setting "candidate" (did you mean candidates?)',
      // Not an unknown key but a bad value, reported in the same run: pascal, not kPa.
      'engine.conditions.ambientPressurePa: Air pressure must be from 50 to 110 kPa (in the file, ambientPressurePa from 50000 to 110000).',
    ]) {
      expect(err).toContain(line);
    }
  });

  it('lists what a small group takes when nothing is close, and says where the existing setup goes', () => {
    const f = example();
    f.options.colour = 'red';
    f.engine.existing = f.existing;
    const err = refused(['check', tempFile(f)]);
    expect(err).toContain('options: unknown setting "colour" (it takes rpmPoints, breakdownModel).');
    expect(err).toContain('engine: unknown setting "existing" (the existing setup goes at the top of the file, beside "engine").');
  });

  it('refuses an unknown setting in a parts bin too', () => {
    const f = example();
    const bin = { engine: f.engine, existing: f.existing, parts: [f.candidates[0].module, { ...f.existing.coil, forBalast: true }] };
    expect(refused(['search', tempFile(bin)])).toContain('parts.1: unknown setting "forBalast" (did you mean forBallast?)');
  });
});

describe('working conditions in a plan file', () => {
  it('takes a cold morning and reports it as the engine’s own, with the cranking supply it brings', () => {
    const f = example();
    f.engine.conditions = { ambientC: -18, ambientPressurePa: 84_000, polytropicIndex: 1.25 };
    const r = runCli(['check', tempFile(f), '--rpm-points', '20']);
    expect(r.code, r.stderr).toBe(0);
    const out = JSON.parse(r.stdout);
    expect(out.conditions.ambientC).toEqual({ value: -18, provenance: 'engine override' });
    expect(out.conditions.ambientPressurePa).toEqual({ value: 84_000, provenance: 'engine override' });
    expect(out.conditions.polytropicIndex).toEqual({ value: 1.25, provenance: 'engine override' });
    // Battery load-test pass floor at -18 degC as printed in workshop manuals: 8.5 V.
    expect(out.conditions.crankingSupplyV.value).toBeCloseTo(8.5, 9);
    expect(out.conditions.crankingSupplyV.provenance).toBe('default (workshop documentation)');
  });

  it('refuses a condition the model no longer has (the fixed CD rise rate) like any unknown key', () => {
    const f = example();
    f.engine.conditions = { cdRiseRateVPerS: 5e9 };
    expect(refused(['check', tempFile(f)])).toContain('engine.conditions: unknown setting "cdRiseRateVPerS"');
  });
});

describe('check and its sweep', () => {
  it('reads --sweep before or after the file, the same either way', () => {
    const before = runCli(['check', '--sweep', examplePath, '--rpm-points', '30']);
    const after = runCli(['check', examplePath, '--rpm-points', '30', '--sweep']);
    expect(before.code, before.stderr).toBe(0);
    expect(after.code, after.stderr).toBe(0);
    expect(before.stdout).toBe(after.stdout);
    expect(JSON.parse(before.stdout).existing.points).toHaveLength(30);
    expect(refused(['check', examplePath, '--sweep=yes'])).toContain('--sweep: a switch, it takes no value');
  });

  it('sweeps cranking, the entered idle and redline exactly, and round speeds up to 110 % of redline', () => {
    const r = runCli(['check', examplePath, '--sweep', '--rpm-points', '45']);
    expect(r.code, r.stderr).toBe(0);
    // No float noise anywhere in an rpm.
    expect(r.stdout).not.toMatch(/"rpm": \d+\.\d{6,}/);
    const out = JSON.parse(r.stdout);
    for (const s of [out.existing, ...out.candidates]) {
      const rpm: number[] = s.points.map((p: { rpm: number }) => p.rpm);
      expect(rpm).toHaveLength(45);
      expect(rpm[0]).toBe(180);
      expect(rpm).toContain(750);
      expect(rpm).toContain(6000);
      expect(rpm.at(-1)).toBe(6600); // 110 % of 6000 rpm
      for (const x of rpm) expect(Number.isInteger(x)).toBe(true);
    }
    // The summary rows quote the entered speeds.
    expect(out.rows[0].cranking.rpm).toBe(180);
    expect(out.rows[0].idle.rpm).toBe(750);
    expect(out.rows[0].redline.rpm).toBe(6000);
  });

  it('takes --rpm-points and options.rpmPoints over the grid’s own range, 3 to 2000, and no further', () => {
    // The fewest, 3, still holds cranking, the entered idle (750 rpm) and redline exactly.
    const three = runCli(['check', examplePath, '--sweep', '--rpm-points', '3']);
    expect(three.code, three.stderr).toBe(0);
    expect(JSON.parse(three.stdout).existing.points.map((p: { rpm: number }) => p.rpm)).toEqual([180, 750, 6000]);
    // 2000 points are taken (the sweep itself is left out: four setups x 2000 points is megabytes).
    const most = runCli(['check', examplePath, '--rpm-points', '2000']);
    expect(most.code, most.stderr).toBe(0);
    expect(refused(['check', examplePath, '--rpm-points', '2'])).toContain('--rpm-points: must be a whole number from 3 to 2000, not "2".');
    expect(refused(['search', join(repoRoot, 'test/fixtures/bin-example.json'), '--rpm-points', '2001'])).toContain('--rpm-points: must be a whole number from 3 to 2000');
    const f = example();
    f.options.rpmPoints = 2001;
    expect(refused(['check', tempFile(f)])).toContain('options.rpmPoints: At most 2000 rpm points.');
    f.options.rpmPoints = 2;
    expect(refused(['check', tempFile(f)])).toContain('options.rpmPoints: At least 3 rpm points.');
  });

  it('--help names the product', () => {
    const r = runCli(['check', '--help']);
    expect(r.code).toBe(0);
    expect(r.stdout).toMatch(/^Ignition Planner on the command line/);
  });
});
