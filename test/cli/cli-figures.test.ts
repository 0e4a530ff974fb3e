/**
 * One figure or more per command line command, pinned against a value worked out here by hand
 * from the example files' catalogue figures and the laws (the other command-line tests check the
 * shape, the exit codes and the signs):
 *   copper law R = R20 (1 + 0.00393 (T - 20)) (annealed copper, IACS), 80 degC under the bonnet
 *   (common practice); spark rate rpm x cylinders / 120 on a four-stroke and points dwell
 *   deg x cylinders / 360 of the period (common practice); Ohm's law; the RL charge
 *   i = I_final (1 - e^(-t / tau)), t_limit = -tau ln(1 - I_lim / I_final); 0.5 L i^2, 0.5 C V^2.
 * Defaults as the checker labels them: running 14.0 V and the cranking load-test floor at 20 degC,
 * 9.4 + 0.2 x 10 / 11 V (workshop documentation); harness 0.1 ohm, points contact 0.1 ohm, hold
 * at the current limit 0.5 ms (from memory).
 */
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { beforeAll, describe, expect, it } from 'vitest';
import { runNgspice } from '../reference/ngspice.js';
import { repoRoot, runCli } from './run-cli.js';

const planExample = join(repoRoot, 'test/fixtures/plan-example.json');
const binExample = join(repoRoot, 'test/fixtures/bin-example.json');
const plan = JSON.parse(readFileSync(planExample, 'utf8'));
const bin = JSON.parse(readFileSync(binExample, 'utf8'));

const copper = (r20: number, c: number): number => r20 * (1 + 0.00393 * (c - 20));
const CRANKING_20C = 9.4 + (0.2 * 10) / 11;
const HARNESS = 0.1;
const CONTACT = 0.1;
const rel = (got: number, want: number): number => Math.abs(got / want - 1);

function okJson(args: string[]): any {
  const r = runCli(args);
  expect(r.code, r.stderr).toBe(0);
  return JSON.parse(r.stdout);
}

describe('check: figures by hand from the example plan', () => {
  let out: any;
  beforeAll(() => {
    out = okJson(['check', planExample]);
  }, 120_000);
  const e = plan.engine;

  it('existing points while cranking: the load-test floor over coil + harness + contacts (the bypass shorts the ballast)', () => {
    const coil = plan.existing.coil;
    const r = coil.primaryResistanceOhm20C + HARNESS + CONTACT; // cold coil at 20 degC: 1.5 + 0.1 + 0.1 = 1.7 ohm
    const period = 120 / (e.crankingRpm * e.cylinders);
    const dwell = ((e.pointsDwellDeg * e.cylinders) / 360) * period; // 0.1111 s, some 34 time constants
    const i = (CRANKING_20C / r) * (1 - Math.exp(-dwell / (coil.primaryInductanceH / r)));
    const p = out.existing.keyPoints.cranking;
    expect(rel(p.supplyV, CRANKING_20C)).toBeLessThan(1e-9);
    expect(rel(p.dwellTimeS, dwell)).toBeLessThan(1e-9);
    expect(rel(p.currentAtBreakA, i)).toBeLessThan(1e-6); // 5.636 A
    expect(rel(p.storedEnergyJ, 0.5 * coil.primaryInductanceH * i * i)).toBeLessThan(1e-6); // 87.4 mJ
    expect(rel(out.existing.circuit.coilResistanceHotOhm, copper(coil.primaryResistanceOhm20C, 80))).toBeLessThan(1e-9); // 1.8537 ohm
  });

  it('candidate 1 (current-limited module that never reaches its limit) at idle: max duty, RL charge', () => {
    const c = plan.candidates[0];
    const r = copper(c.coil.primaryResistanceOhm20C, 80) + HARNESS; // 3.7074 + 0.1 ohm
    const iF = (14 - c.module.switchSaturationV) / r; // 3.204 A, under the 6.5 A limit
    expect(iF).toBeLessThan(c.module.currentLimitA);
    const period = 120 / (e.idleRpm * e.cylinders);
    const dwell = c.module.maxDutyFraction * period; // the limit is never reached: the maximum duty
    const i = iF * (1 - Math.exp(-dwell / (c.coil.primaryInductanceH / r)));
    const p = out.candidates[0].keyPoints.idle;
    expect(rel(p.dwellTimeS, dwell)).toBeLessThan(1e-9);
    expect(rel(p.currentAtBreakA, i)).toBeLessThan(1e-6);
    expect(rel(p.storedEnergyJ, 0.5 * c.coil.primaryInductanceH * i * i)).toBeLessThan(1e-6); // 41.1 mJ
  });

  it('candidate 3 (capacitive discharge) at idle: full charge voltage, 0.5 C V^2', () => {
    const cd = plan.candidates[2].module.cd;
    const c = cd.capacitorUf * 1e-6;
    // The charger refills 0.5 C V^2 / P = 0.049 J / 25 W = 1.96 ms, well inside the 40 ms period at idle.
    expect((0.5 * c * cd.chargeVoltageV ** 2) / cd.chargerPowerW).toBeLessThan(120 / (e.idleRpm * e.cylinders));
    const p = out.candidates[2].keyPoints.idle;
    expect(p.cdChargeVoltageV).toBe(cd.chargeVoltageV);
    expect(rel(p.storedEnergyJ, 0.5 * c * cd.chargeVoltageV ** 2)).toBeLessThan(1e-9); // 49 mJ
  });
});

describe('search: the top combination worked out by hand from the bin', () => {
  it('the best combination at idle: dwell to the limit plus the hold, the limit current, 0.5 L I_lim^2', () => {
    const out = okJson(['search', binExample, '--top', '5']);
    const moduleOf = (row: any): any => bin.parts.find((p: any) => p.kind === 'module' && p.name === row.module);
    // The hand arithmetic below is for a current-limited module without a ballast: the best such row.
    const top = out.top.find((row: any) => moduleOf(row).moduleType === 'breakerless-current-limited' && row.ballast === null);
    expect(top).toBeDefined();
    const mod = moduleOf(top);
    const coil = bin.parts.find((p: any) => p.kind === 'coil' && p.name === top.coil);
    expect(mod.moduleType).toBe('breakerless-current-limited');
    expect(top.ballast).toBeNull();
    const e = bin.engine;
    const r = copper(coil.primaryResistanceOhm20C, 80) + HARNESS;
    const iF = (14 - mod.switchSaturationV) / r;
    const tau = coil.primaryInductanceH / r;
    const period = 120 / (e.idleRpm * e.cylinders);
    const reaches = iF > mod.currentLimitA;
    const dwell = reaches ? Math.min(-tau * Math.log(1 - mod.currentLimitA / iF) + 0.5e-3, mod.maxDutyFraction * period) : mod.maxDutyFraction * period;
    const i = reaches && dwell > -tau * Math.log(1 - mod.currentLimitA / iF) ? mod.currentLimitA : iF * (1 - Math.exp(-dwell / tau));
    const p = top.keyPoints.idle;
    expect(rel(p.primaryResistanceOhm, r)).toBeLessThan(1e-9);
    expect(rel(p.dwellTimeS, dwell)).toBeLessThan(1e-9);
    expect(rel(p.currentAtBreakA, i)).toBeLessThan(1e-9);
    expect(rel(p.storedEnergyJ, 0.5 * coil.primaryInductanceH * i * i)).toBeLessThan(1e-9);
  });
});

/** A SPICE number with its scale suffix (Meg, k, m, u, n, p, f). */
function spiceValue(text: string): number {
  const m = /^(-?[\d.]+(?:e-?\d+)?)(Meg|[kmunpf])?$/i.exec(text);
  if (!m) throw new Error(`not a SPICE number: ${text}`);
  const scale: Record<string, number> = { meg: 1e6, k: 1e3, m: 1e-3, u: 1e-6, n: 1e-9, p: 1e-12, f: 1e-15 };
  return Number(m[1]) * (m[2] ? scale[m[2].toLowerCase()]! : 1);
}

describe('netlist: the deck carries the hand-worked circuit, and ngspice charges it to the hand-worked current', () => {
  it('candidate 1 at 3000 rpm: 14 V, hot winding 3.7074 ohm, 8 mH, a 7.5 ms dwell, 3.114 A at the break', () => {
    const r = runCli(['netlist', planExample, '--candidate', '1', '--rpm', '3000', '--scenario', 'charge']);
    expect(r.code, r.stderr).toBe(0);
    const deck = r.stdout;
    const value = (el: string): number => spiceValue(new RegExp(`^${el} \\S+ \\S+ (?:DC )?(\\S+)$`, 'm').exec(deck)![1]!);
    const c = plan.candidates[0];
    expect(value('Vbat')).toBe(14);
    expect(rel(value('Rcoil'), copper(c.coil.primaryResistanceOhm20C, 80))).toBeLessThan(1e-6);
    expect(value('L1')).toBeCloseTo(c.coil.primaryInductanceH, 12);
    expect(value('Vsat')).toBe(c.module.switchSaturationV);
    // Dwell: 0.75 of 120 / (3000 x 4) s = 7.5 ms (the deck's rpm point is interpolated on the sweep, so within 0.1 %).
    const dwell = c.module.maxDutyFraction * (120 / (3000 * 4));
    const closeAt = /PWL\(0 0 (\S+) 0 /.exec(deck)![1]!;
    const breakAt = /\.meas tran ibreak_a FIND i\(L1\) AT=(\S+)/.exec(deck)![1]!;
    expect(rel(spiceValue(breakAt) - spiceValue(closeAt), dwell)).toBeLessThan(1e-3);
    const rTotal = copper(c.coil.primaryResistanceOhm20C, 80) + HARNESS;
    const want = ((14 - c.module.switchSaturationV) / rTotal) * (1 - Math.exp(-dwell / (c.coil.primaryInductanceH / rTotal)));
    const m = runNgspice(deck, ['ibreak_a']).measures;
    expect(rel(m.ibreak_a!.value, want), `ngspice ${m.ibreak_a!.value} A against ${want} A by hand`).toBeLessThan(0.01);
  });
});

/** Every expected reading in a sheet (any object carrying expected, min, max and probes). */
function readings(v: unknown, out: any[] = []): any[] {
  if (Array.isArray(v)) v.forEach((x) => readings(x, out));
  else if (v && typeof v === 'object') {
    const o = v as Record<string, unknown>;
    if (typeof o.expected === 'number' && typeof o.probes === 'string') out.push(o);
    for (const x of Object.values(o)) readings(x, out);
  }
  return out;
}

describe('checklist: expected readings by hand for candidate 1', () => {
  let all: any[] = [];
  beforeAll(() => {
    all = readings(okJson(['checklist', planExample, '--candidate', '1']));
  }, 120_000);
  const c = plan.candidates[0];
  const e = plan.engine;

  it('a dwell meter reading of max duty x 360 / cylinders distributor degrees (0.75 x 90 = 67.5)', () => {
    const dwell = all.find((x) => /Dwell meter/.test(x.probes));
    expect(dwell, 'a dwell-meter reading').toBeDefined();
    expect(dwell.expected).toBeCloseTo(c.module.maxDutyFraction * (360 / e.cylinders), 9);
  });

  it('the coil supply while cranking: the floor less the harness drop of (V - V_sat) / (coil + harness) (9.33 V)', () => {
    const i = (CRANKING_20C - c.module.switchSaturationV) / (c.coil.primaryResistanceOhm20C + HARNESS);
    const want = CRANKING_20C - HARNESS * i;
    const onCoil = all.find((x) => /^Red probe on 15 \(coil supply side\)/.test(x.probes) && /Starter turning/.test(x.state));
    expect(onCoil, 'a cranking reading on terminal 15').toBeDefined();
    expect(rel(onCoil.expected, want)).toBeLessThan(1e-9);
  });

  it('the coil primary at the bench: its catalogue 20 degC value, +/- 10 %', () => {
    const prim = all.find((x) => /on 15 \(coil supply side\), the other on 1/.test(x.probes));
    expect(prim.expected).toBe(c.coil.primaryResistanceOhm20C);
    expect(prim.min).toBeCloseTo(0.9 * c.coil.primaryResistanceOhm20C, 9);
    expect(prim.max).toBeCloseTo(1.1 * c.coil.primaryResistanceOhm20C, 9);
  });
});

describe('parts-csv: the units in the headers converted by hand', () => {
  it('stores 5.5 mH as 0.0055 H (the store keeps SI henries, the rating in kV as printed), and exports them back in mH and kV', async () => {
    const { mkdtempSync } = await import('node:fs');
    const { tmpdir } = await import('node:os');
    const Database = (await import('better-sqlite3')).default;
    const dir = mkdtempSync(join(tmpdir(), 'cli-figures-csv-'));
    const csv = join(repoRoot, 'test/fixtures/csv/coils-example.csv');
    expect(okJson(['parts-csv', 'import', csv, '--kind', 'coil', '--data-dir', dir]).added.parts).toBe(3);
    const db = new Database(join(dir, 'workshop.sqlite3'), { readonly: true });
    let data: any;
    try {
      data = JSON.parse((db.prepare("SELECT data FROM parts WHERE name = 'Ballasted coil 1.5 ohm'").get() as { data: string }).data);
    } finally {
      db.close();
    }
    // The CSV row reads 1.5 ohm, 5.5 mH, 90:1, 35 kV: 5.5 / 1000 H; the rating is stored in kV (db/schema.ts).
    expect(data.primaryResistanceOhm20C.value ?? data.primaryResistanceOhm20C).toBe(1.5);
    expect(data.primaryInductanceH).toBeCloseTo(5.5 / 1000, 12);
    expect(data.ratedSecondaryKv).toBe(35);
    const r = runCli(['parts-csv', 'export', '--kind', 'coil', '--data-dir', dir]);
    expect(r.code, r.stderr).toBe(0);
    const lines = r.stdout.trim().split(/\r?\n/);
    const header = lines[0]!.split(',');
    const row = lines.find((l) => l.startsWith('Ballasted coil 1.5 ohm'))!;
    // The notes cell is quoted and holds a comma: take the figures from the end of the row.
    const cells = row.split(',');
    const fromEnd = (name: string): string => cells[cells.length - (header.length - header.indexOf(name))]!;
    expect(Number(fromEnd('primary inductance (mH)'))).toBeCloseTo(5.5, 9);
    expect(Number(fromEnd('rated secondary voltage (kV)'))).toBeCloseTo(35, 9);
  }, 120_000);
});
