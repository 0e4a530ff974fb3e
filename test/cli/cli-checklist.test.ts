/**
 * The `checklist` command on every demo plan: JSON and HTML, the cautions first, numbers pinned by
 * hand against the laws, the HTML self-contained and printable in Chromium, and bad input refused
 * as the other commands refuse it.
 */
import { execFileSync } from 'node:child_process';
import { mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { chromium } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { demoPlans } from '../../db/demo/plans.js';
import { demoEngines, demoPart, planFileOf } from './demo-plan.js';
import { runCli, tempFile } from './run-cli.js';
import { parseArgs } from '../../electron/cli/args.js';
import { checklistCommand } from '../../electron/cli/checklist.js';
import { CliError } from '../../electron/cli/errors.js';

const units = ['V', 'A', 'ohm', 'kohm', 'deg', 'rpm', 'mm'];

/** The first cautions' words, as workshop practice puts them first (our own sentence, checked for presence). */
const FIRST_CAUTION = 'Disconnect the battery earth lead';

describe('checklist --format json, every demo plan', () => {
  for (const plan of demoPlans) {
    it(`${plan.engine}: ${plan.name}`, () => {
      const engine = demoEngines.find((e) => e.name === plan.engine)!;
      const r = runCli(['checklist', tempFile(planFileOf(plan))]);
      expect(r.stderr).toBe('');
      expect(r.code).toBe(0);
      expect(r.stdout).not.toMatch(/NaN|Infinity/);
      const out = JSON.parse(r.stdout);
      expect(out.plan.name).toBe(plan.name);
      expect(out.cautions[0]).toContain(FIRST_CAUTION);
      expect(out.cautions.length).toBeGreaterThanOrEqual(6);
      expect(out.steps.length).toBeGreaterThan(10);
      expect(out.diagram.svg).toMatch(/^<svg[\s\S]*<\/svg>$/);
      for (const s of out.steps) {
        expect(typeof s.stage).toBe('string');
        expect(Array.isArray(s.terminals)).toBe(true);
        if (s.reading === null) continue;
        expect(units, `${s.key} unit`).toContain(s.reading.unit);
        expect(s.reading.min, s.key).toBeLessThanOrEqual(s.reading.max);
        const inBand = s.reading.min <= s.reading.expected && s.reading.expected <= s.reading.max;
        // Only where the checker predicts trouble may its figure sit outside the acceptable band,
        // and then the sheet must say so (the 6 V twin's module supply while cranking does).
        if (!inBand) expect(s.reading.how, s.key).toMatch(/below its minimum|above its maximum/);
        expect(s.reading.ifOutOfRange.length, s.key).toBeGreaterThan(0);
      }
      const byQuantity = new Map(out.steps.filter((s: any) => s.reading).map((s: any) => [s.reading.quantity, s.reading]));

      // Copper law (IACS annealed copper, alpha = 0.00393 /K): the coil primary read at the bench
      // (the engine's ambient, 20 degC unless set) from the catalogue value at 20 degC; +/- 10 % (from memory).
      const coilName = plan.coil ?? engine.existing.coilPart!;
      const coil = demoPart('coil', coilName) as { primaryResistanceOhm20C: number };
      const bench = engine.conditions.ambientC ?? 20;
      const rc = coil.primaryResistanceOhm20C * (1 + 0.00393 * (bench - 20));
      const primary = byQuantity.get('coil-primary-resistance') as any;
      expect(primary.unit).toBe('ohm');
      expect(primary.expected).toBeCloseTo(rc, 6);
      expect(primary.min).toBeCloseTo(0.9 * rc, 6);
      expect(primary.max).toBeCloseTo(1.1 * rc, 6);

      // A rested battery: 12.4 to 12.7 V on 12 V, 6.2 to 6.35 V on 6 V (common practice, state-of-charge table).
      const battery = byQuantity.get('battery-voltage-resting') as any;
      const [lo, hi] = engine.systemVoltageV === 6 ? [6.2, 6.35] : [12.4, 12.7];
      expect(battery.min).toBeCloseTo(lo, 6);
      expect(battery.max).toBeCloseTo(hi, 6);

      // A capacitive-discharge unit has no dwell to set; every inductive plan has (common practice).
      expect(byQuantity.has('dwell-angle')).toBe(plan.module === null || !plan.module.startsWith('Capacitive'));
    });
  }

  it('takes --candidate and refuses one that is not in the file', () => {
    const file = tempFile(planFileOf(demoPlans[0]!));
    expect(runCli(['checklist', file, '--candidate', '1']).code).toBe(0);
    const r = runCli(['checklist', file, '--candidate', '2']);
    expect(r.code).toBe(2);
    expect(r.stderr).toMatch(/^--candidate: 2 names no candidate; the file has 1\./);
  });

  it('refuses a plan file with a bad field as check does: exit 2, field: why', () => {
    const bad = planFileOf(demoPlans[0]!);
    (bad.engine as Record<string, unknown>).redlineRpm = 500;
    const r = runCli(['checklist', tempFile(bad)]);
    expect(r.code).toBe(2);
    expect(r.stderr).toContain('engine.redlineRpm: Redline must be above idle speed.');
  });

  it('refuses an unknown format and an unknown option', () => {
    const file = tempFile(planFileOf(demoPlans[0]!));
    expect(runCli(['checklist', file, '--format', 'pdf']).stderr).toMatch(/^--format: use one of json, html, not "pdf"\./);
    expect(runCli(['checklist', file, '--colour', 'red']).code).toBe(2);
  });

  it('refuses a paper it does not know, and a paper for the JSON (which has no pages): exit 2, --paper: why', () => {
    const file = tempFile(planFileOf(demoPlans[0]!));
    const bad = runCli(['checklist', file, '--format', 'html', '--paper', 'legal']);
    expect(bad.code).toBe(2);
    expect(bad.stdout).toBe('');
    expect(bad.stderr).toMatch(/^--paper: use one of a4, letter, not "legal"\./);
    // The same command in this process (a child process costs seconds): the same refusal, exit code 2.
    const refusal = (args: string[]): CliError => {
      try {
        checklistCommand(parseArgs(args));
      } catch (e) {
        if (e instanceof CliError) return e;
        throw e;
      }
      throw new Error(`not refused: ${args.join(' ')}`);
    };
    const bare = refusal(['checklist', file, '--format', 'html', '--paper']);
    expect(bare.exitCode).toBe(2);
    expect(bare.message).toMatch(/^--paper: use one of a4, letter\./);
    const json = refusal(['checklist', file, '--paper', 'letter']);
    expect(json.exitCode).toBe(2);
    expect(json.message).toMatch(/^--paper: only the HTML sheet has pages/);
  });
});

describe('checklist --format html', () => {
  const dir = mkdtempSync(join(tmpdir(), 'cli-sheet-'));
  let browser: Awaited<ReturnType<typeof chromium.launch>>;
  beforeAll(async () => {
    browser = await chromium.launch({
      executablePath: '/usr/bin/chromium',
      args: ['--no-sandbox', '--disable-gpu', '--disable-background-networking', '--disable-component-update', '--disable-sync', '--no-first-run'],
    });
  });
  afterAll(async () => browser?.close());

  /**
   * --paper: the page asks for its paper through CSS (a named @page with `size`), so a browser
   * printing with the CSS page size gets Letter, 8.5 x 11 in = 612 x 792 pt (ANSI/ASME Y14.1), or
   * A4, 210 x 297 mm = 595.28 x 841.89 pt (ISO 216; 1 in = 25.4 mm = 72 pt).
   */
  it('lays the page out for --paper letter, and for A4 by default', async () => {
    const file = tempFile(planFileOf(demoPlans[0]!));
    for (const [paper, klass, w, h] of [
      ['letter', 'page-letter', (8.5 * 72).toFixed(0), (11 * 72).toFixed(0)],
      [null, 'page-a4', ((210 / 25.4) * 72).toFixed(0), ((297 / 25.4) * 72).toFixed(0)],
    ] as const) {
      const html = join(dir, `sheet-paper-${paper ?? 'default'}.html`);
      // Letter through the real command line; the default in this process (the same command, seconds faster).
      const args = ['checklist', file, '--format', 'html', ...(paper ? ['--paper', paper] : []), '--out', html];
      if (paper) {
        const r = runCli(args);
        expect(r.code, r.stderr).toBe(0);
      } else checklistCommand(parseArgs(args));
      const text = readFileSync(html, 'utf8');
      expect(text).toContain(`class="sheet-doc ${klass}"`);
      const page = await browser.newPage();
      await page.goto(`file://${html}`);
      const pdf = join(dir, `sheet-paper-${paper ?? 'default'}.pdf`);
      // The CSS page size decides, as a browser's own print dialog does with "default" paper.
      await page.pdf({ path: pdf, preferCSSPageSize: true, pageRanges: '1' });
      await page.close();
      const info = execFileSync('pdfinfo', [pdf], { encoding: 'utf8' });
      const m = /Page size:\s+([\d.]+) x ([\d.]+) pts/.exec(info)!;
      expect([Math.round(Number(m[1])).toFixed(0), Math.round(Number(m[2])).toFixed(0)], `${paper}: ${m[0]}`).toEqual([w, h]);
    }
  });

  for (const [i, plan] of demoPlans.entries()) {
    it(`is one self-contained page that prints with the cautions first: ${plan.name}`, async () => {
      const html = join(dir, `sheet-${i}.html`);
      const r = runCli(['checklist', tempFile(planFileOf(plan)), '--format', 'html', '--out', html]);
      expect(r.code, r.stderr).toBe(0);
      const text = readFileSync(html, 'utf8');
      expect(text).toMatch(/^<!doctype html>/);
      expect(text).not.toMatch(/<script/i);
      expect(text).not.toMatch(/<link[^>]+stylesheet/i);
      expect(text).toContain('<style>');
      expect(text).toContain('<svg');

      const page = await browser.newPage();
      await page.goto(`file://${html}`);
      const pdf = join(dir, `sheet-${i}.pdf`);
      await page.pdf({ path: pdf, format: i % 2 === 0 ? 'A4' : 'Letter' });
      await page.close();
      const printed = execFileSync('pdftotext', ['-layout', pdf, '-'], { encoding: 'utf8' });
      const json = JSON.parse(runCli(['checklist', tempFile(planFileOf(plan))]).stdout);
      const flat = printed.replace(/\s+/g, ' ');
      const cautionAt = flat.indexOf(FIRST_CAUTION);
      const firstStepAt = flat.indexOf(json.steps[0].title);
      expect(cautionAt).toBeGreaterThan(-1);
      expect(firstStepAt).toBeGreaterThan(cautionAt);
      for (const s of json.steps) expect(flat, s.key).toContain(s.title);
      expect(flat).toMatch(/Page 1 of \d+/);
      if (i === 0) writeFileSync(join('test-output', 'cli-sheet.pdf'), readFileSync(pdf));
    });
  }
});
