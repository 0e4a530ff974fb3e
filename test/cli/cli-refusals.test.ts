/**
 * Bad input on the command line: exit code 2, a message that names the field and says why, no
 * stack trace, nothing on stdout. Runs the real CLI as a child process.
 */
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { repoRoot, runCli, tempFile } from './run-cli.js';

const example = (): Record<string, any> => JSON.parse(readFileSync(join(repoRoot, 'test/fixtures/plan-example.json'), 'utf8'));

function expectRefusal(args: string[], ...fragments: string[]): void {
  const r = runCli(args);
  expect(r.code, r.stderr).toBe(2);
  expect(r.stdout).toBe('');
  for (const f of fragments) expect(r.stderr).toContain(f);
  // A plain sentence, not a stack trace.
  expect(r.stderr).not.toMatch(/\n\s+at .+:\d+:\d+/);
  expect(r.stderr).not.toMatch(/Error:|ZodError|TypeError/);
}

describe('the command line refuses bad input', () => {
  it('names a missing field', () => {
    const f = example();
    delete f.engine.redlineRpm;
    expectRefusal(['check', tempFile(f)], 'engine.redlineRpm: this field is missing.', 'Redline must be a number.');
  });

  it('refuses a negative resistance and says which part', () => {
    const f = example();
    f.existing.coil.primaryResistanceOhm20C = -1.5;
    expectRefusal(['check', tempFile(f)], 'existing.coil.primaryResistanceOhm20C: Primary resistance must be more than zero.');
  });

  it('refuses a redline below idle', () => {
    const f = example();
    f.engine.redlineRpm = 600;
    expectRefusal(['check', tempFile(f)], 'engine.redlineRpm: Redline must be above idle speed.');
  });

  it('refuses an unknown part kind', () => {
    const f = example();
    f.candidates[0].module.kind = 'gadget';
    expectRefusal(['check', tempFile(f)], 'candidates.0.module', 'Unknown part kind: use coil, ballast, module, tach, leads or plug.');
  });

  it('refuses a part of the wrong kind in a slot', () => {
    const f = example();
    f.candidates[0].module = f.existing.coil;
    expectRefusal(['check', tempFile(f)], 'candidates.0.module: expected a module part here, got a coil.');
  });

  it('refuses invalid JSON', () => {
    expectRefusal(['check', tempFile('{ "engine": { "name": "half a file"')], 'not valid JSON');
  });

  it('refuses a missing file', () => {
    expectRefusal(['check', '/nonexistent/plan.json'], '/nonexistent/plan.json: cannot read the file: there is no such file.');
  });

  it('refuses more than three candidates', () => {
    const f = example();
    f.candidates.push(f.candidates[0], f.candidates[1]);
    expectRefusal(['check', tempFile(f)], 'candidates: Compare at most three candidates');
  });

  it('refuses an unknown command and an unknown option', () => {
    expectRefusal(['compare', 'x.json'], 'Unknown command "compare"');
    expectRefusal(['check', join(repoRoot, 'test/fixtures/plan-example.json'), '--colour'], '--colour: not an option of "check"');
  });

  it('refuses a netlist rpm that is not a positive number, or outside the sweep', () => {
    const plan = join(repoRoot, 'test/fixtures/plan-example.json');
    expectRefusal(['netlist', plan, '--rpm', '-300'], '--rpm: must be a number above zero');
    expectRefusal(['netlist', plan, '--rpm', '90000'], '--rpm: 90000 is outside the range the checker sweeps');
  });

  it('refuses a capacitive-discharge deck for an inductive candidate, and the reverse', () => {
    const plan = join(repoRoot, 'test/fixtures/plan-example.json');
    expectRefusal(['netlist', plan, '--candidate', '1', '--rpm', '3000', '--scenario', 'cd'], '--scenario cd:', 'is not a capacitive-discharge setup');
    expectRefusal(['netlist', plan, '--candidate', '3', '--rpm', '3000', '--scenario', 'break'], '--scenario break:', 'use --scenario cd');
  });

  it('refuses a search bin without a module', () => {
    const f = example();
    const bin = { engine: f.engine, existing: f.existing, parts: [f.existing.coil] };
    expectRefusal(['search', tempFile(bin)], 'parts: put at least one module in the parts bin.');
  });
});
