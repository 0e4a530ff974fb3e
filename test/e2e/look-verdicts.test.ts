/**
 * Issue 9, item 2: the verdict marks of our own (a spark that jumps the gap, one that barely does,
 * none), each with a word, a shape and a colour, on the weighing screen and on the printed
 * wiring sheet. Checked in Chromium through the browser host, with screenshots in colour and in
 * grey under test-output/look/.
 *
 * The colours must stay apart without hue: their CIE 1976 lightness L* must differ by at least 10
 * for normal vision and under simulated protanopia and deuteranopia. Formulas, worked here by hand:
 * sRGB to linear light (IEC 61966-2-1), relative luminance Y = 0.2126 R + 0.7152 G + 0.0722 B
 * (ITU-R BT.709 primaries), L* = 116 f(Y) - 16 with f(t) = t^(1/3) above (6/29)^3 (CIE 15:2004),
 * and the severity-1.0 dichromat matrices of Machado, Oliveira and Fernandes (IEEE TVCG 2009),
 * applied to linear RGB (matrix values from memory).
 */
import { execFileSync } from 'node:child_process';
import { writeFileSync } from 'node:fs';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { api, e2eSuite, freshDir, openScreen } from './harness.js';
import { lookDir, shotBoth } from './look-shots.js';

const SALOON = 'Green four-door saloon';
const WORDS = { pass: 'Fine', caution: 'Take care', fail: 'Not like this' } as const;
type V = keyof typeof WORDS;

const { startWorkshop } = e2eSuite();

const toLinear = (c: number): number => (c <= 0.04045 ? c / 12.92 : ((c + 0.055) / 1.055) ** 2.4);
function linearRgb(hex: string): [number, number, number] {
  const m = /^#([0-9a-f]{2})([0-9a-f]{2})([0-9a-f]{2})$/i.exec(hex);
  if (!m) throw new Error(`not a #rrggbb colour: ${hex}`);
  return [toLinear(parseInt(m[1]!, 16) / 255), toLinear(parseInt(m[2]!, 16) / 255), toLinear(parseInt(m[3]!, 16) / 255)];
}
const clamp = (x: number): number => Math.min(1, Math.max(0, x));
function lightness([r, g, b]: [number, number, number]): number {
  const y = 0.2126 * clamp(r) + 0.7152 * clamp(g) + 0.0722 * clamp(b);
  const f = y > (6 / 29) ** 3 ? Math.cbrt(y) : y / (3 * (6 / 29) ** 2) + 4 / 29;
  return 116 * f - 16;
}
type M = [[number, number, number], [number, number, number], [number, number, number]];
const PROTAN: M = [
  [0.152286, 1.052583, -0.204868],
  [0.114503, 0.786281, 0.099216],
  [-0.003882, -0.048116, 1.051998],
];
const DEUTAN: M = [
  [0.367322, 0.860646, -0.227968],
  [0.280085, 0.672501, 0.047413],
  [-0.01182, 0.04294, 0.968881],
];
const apply = (m: M, [r, g, b]: [number, number, number]): [number, number, number] => [
  m[0][0] * r + m[0][1] * g + m[0][2] * b,
  m[1][0] * r + m[1][1] * g + m[1][2] * b,
  m[2][0] * r + m[2][1] * g + m[2][2] * b,
];

/** The colour of the spark part of each mark (the shape drawn between the electrodes). */
async function sparkColours(page: Page): Promise<Record<V, string>> {
  const key = page.getByTestId('verdict-key');
  const pass = await key.locator('svg.mark-pass polygon').nth(1).getAttribute('fill');
  const caution = await key.locator('svg.mark-caution polyline').getAttribute('stroke');
  const fail = await key.locator('svg.mark-fail path').nth(1).getAttribute('stroke');
  return { pass: pass!, caution: caution!, fail: fail! };
}

describe('the verdict marks', () => {
  it('draw a word, a shape of their own and a colour on the weighing screen, apart in grey and for red-green colour blindness', async () => {
    const { browser, page } = await startWorkshop(freshDir('look-verdicts'));
    await openScreen(page, 'Weigh a combination');
    await page.getByLabel('Engine', { exact: true }).selectOption({ label: SALOON });
    await page.getByTestId('setup-card-1').waitFor();

    // The key shows all three, each with its word and its own mark.
    const key = page.getByTestId('verdict-key');
    for (const v of ['pass', 'caution', 'fail'] as const) {
      const badge = key.locator(`.verdict[data-verdict="${v}"]`);
      expect(await badge.locator('.verdict-word').innerText()).toBe(WORDS[v]);
      expect(await badge.locator(`svg.verdict-mark[data-mark="${v}"]`).count()).toBe(1);
    }
    // The three shapes differ: a filled bolt, a dashed thin spark, a crossed-out gap.
    expect(await key.locator('svg.mark-pass polygon').count()).toBe(2); // insulator + bolt
    expect(await key.locator('svg.mark-caution polyline').getAttribute('stroke-dasharray')).toBeTruthy();
    expect(await key.locator('svg.mark-fail polygon').count()).toBe(1); // insulator only: no spark

    // Every verdict on the screen carries the mark that matches its word, never a bare colour.
    const badges = page.locator('.verdict');
    const n = await badges.count();
    expect(n).toBeGreaterThan(3);
    for (let i = 0; i < n; i++) {
      const b = badges.nth(i);
      const v = (await b.getAttribute('data-verdict')) as V;
      expect(await b.locator(`svg.verdict-mark[data-mark="${v}"]`).count()).toBe(1);
      // Some sit in folded or print-only parts, so the text is read whether shown or not.
      expect((await b.locator('.verdict-word').textContent())?.trim()).toBe(WORDS[v]);
    }

    // Lightness apart by 10 L* or more, for normal vision and simulated protanopia and deuteranopia.
    const colours = await sparkColours(page);
    for (const [label, sim] of [['normal', (c: [number, number, number]) => c], ['protanopia', (c: [number, number, number]) => apply(PROTAN, c)], ['deuteranopia', (c: [number, number, number]) => apply(DEUTAN, c)]] as const) {
      const l = { pass: lightness(sim(linearRgb(colours.pass))), caution: lightness(sim(linearRgb(colours.caution))), fail: lightness(sim(linearRgb(colours.fail))) };
      for (const [a, b] of [['pass', 'caution'], ['pass', 'fail'], ['caution', 'fail']] as const) {
        expect(Math.abs(l[a] - l[b]), `${label}: ${a} against ${b}`).toBeGreaterThanOrEqual(10);
      }
    }

    await key.scrollIntoViewIfNeeded();
    await shotBoth(page, 'verdict-key', key);
    // The same key drawn three times larger, to look at the marks' shapes.
    await key.evaluate((el) => {
      (el as HTMLElement).style.zoom = '3';
    });
    await key.scrollIntoViewIfNeeded();
    await shotBoth(page, 'verdict-key-large', key.locator('li').first().locator('svg'));
    await shotBoth(page, 'verdict-key-large-caution', key.locator('li').nth(1).locator('svg'));
    await shotBoth(page, 'verdict-key-large-fail', key.locator('li').nth(2).locator('svg'));
    await key.evaluate((el) => {
      (el as HTMLElement).style.zoom = '';
    });
    await page.getByTestId('setup-cards').scrollIntoViewIfNeeded();
    await shotBoth(page, 'verdict-cards', page.getByTestId('setup-cards'));
    const overview = page.locator('table.rule-overview').first();
    if ((await overview.count()) > 0) {
      await overview.scrollIntoViewIfNeeded();
      await shotBoth(page, 'verdict-rules', overview);
    }
    expect(browser.pageErrors).toEqual([]);
  });

  it('print on the wiring sheet with the mark and the word, on paper', async () => {
    const { host, page } = await startWorkshop(freshDir('look-sheet'));
    const saloon = (await api<Array<{ id: number; name: string }>>(host, 'engines.list', {})).find((e) => e.name === SALOON)!;
    const plan = (await api<Array<{ id: number; name: string }>>(host, 'plans.list', { engineId: saloon.id }))[0]!;
    const sheet = await api<{ sheet: { header: { verdict: { verdict: V } } } }>(host, 'sheet.get', { planId: plan.id });
    const v = sheet.sheet.header.verdict.verdict;

    await openScreen(page, 'Weigh a combination');
    await page.getByLabel('Engine', { exact: true }).selectOption({ label: SALOON });
    await page.getByRole('button', { name: `Open its wiring sheet: ${plan.name}` }).click();
    await page.getByTestId('sheet-document').waitFor();

    await page.emulateMedia({ media: 'print' });
    const line = page.getByTestId('sheet-verdict');
    expect(await line.getAttribute('data-verdict')).toBe(v);
    const mark = line.locator(`svg.verdict-mark[data-mark="${v}"]`);
    expect(await mark.isVisible()).toBe(true);
    expect((await line.innerText()).startsWith(`${WORDS[v]}:`)).toBe(true);
    await shotBoth(page, 'verdict-sheet-print', page.getByTestId('sheet-head'));

    // On paper: the PDF's first page holds the word, and its picture is written beside the shots.
    const pdf = await page.pdf({ format: 'A4', printBackground: false });
    const file = path.join(lookDir, 'verdict-sheet.pdf');
    writeFileSync(file, pdf);
    const text = execFileSync('pdftotext', ['-f', '1', '-l', '1', file, '-'], { encoding: 'utf8' });
    expect(text).toContain(`${WORDS[v]}:`);
    execFileSync('pdftoppm', ['-f', '1', '-l', '1', '-r', '70', '-png', file, path.join(lookDir, 'verdict-sheet-page')]);
    execFileSync('pdftoppm', ['-f', '1', '-l', '1', '-r', '70', '-png', '-gray', file, path.join(lookDir, 'verdict-sheet-page-grey')]);
  });
});
