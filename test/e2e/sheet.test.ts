/**
 * The wiring sheet end to end: the real browser host on a fresh data folder (which loads the demo
 * workshop), the built renderer and Debian's Chromium. Ticks and readings go through the screen
 * and are checked in the store through the host's own API; the printed PDF (Chromium's page.pdf,
 * read back with poppler's pdftotext) is checked against the sheet the API gives for the plan.
 */
import { execFileSync } from 'node:child_process';
import { mkdtempSync, readdirSync, rmSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import type { Reading } from '../../db/schema.js';
import type { SheetAnswer } from '../../electron/ipc/channels.js';
import { api, e2eSuite, freshDir, openScreen, outputDir, screenshot, type Host } from './harness.js';

type Summary = { id: number; name: string };
type Plan = { id: number; engineId: number; name: string };
type Step = SheetAnswer['sheet']['stages'][number]['steps'][number];

const SALOON = 'Green four-door saloon';
const { startWorkshop } = e2eSuite();

/**
 * How the sheet writes a value: volts, amps and ohms to 2 decimals, kilohms to 1, rpm whole,
 * millimetres to 2, degrees whole or to one decimal (the product's stated formats), with the
 * SI symbols Ω and kΩ (SI brochure, 9th edition, table 4: the ohm's symbol is Ω).
 */
const DIGITS: Record<string, number> = { V: 2, A: 2, ohm: 2, kohm: 1, rpm: 0, mm: 2 };
const SYMBOL: Record<string, string> = { V: 'V', A: 'A', ohm: 'Ω', kohm: 'kΩ', rpm: 'rpm', mm: 'mm' };
function num(v: number, unit: string): string {
  if (unit === 'deg') return Math.abs(v - Math.round(v)) < 0.05 ? v.toFixed(0) : v.toFixed(1);
  return v.toFixed(DIGITS[unit] ?? 2);
}
const withUnit = (v: number, unit: string): string => (unit === 'deg' ? `${num(v, unit)}°` : `${num(v, unit)} ${SYMBOL[unit] ?? unit}`);
const band = (min: number, max: number, unit: string): string => (unit === 'deg' ? `${num(min, unit)}°–${num(max, unit)}°` : `${num(min, unit)}–${num(max, unit)} ${SYMBOL[unit] ?? unit}`);

const steps = (a: SheetAnswer): Step[] => a.sheet.stages.flatMap((s) => s.steps);
/** The local calendar day as ISO 8601 writes a date (YYYY-MM-DD), the form a date field holds. */
const localDay = (d: Date): string => `${d.getFullYear()}-${String(d.getMonth() + 1).padStart(2, '0')}-${String(d.getDate()).padStart(2, '0')}`;
const flat = (t: string): string => t.replace(/\s+/g, ' ');
/**
 * pdftotext joins a word broken at a line end and drops its hyphen ("multi-spark" may come back
 * as "multispark"), so text read back from the PDF is compared without spaces and hyphens.
 */
const squash = (t: string): string => t.replace(/[\s\-\u2010\u2011]+/g, '');

async function saloonPlan(host: Host): Promise<Plan> {
  const saloon = (await api<Summary[]>(host, 'engines.list', {})).find((e) => e.name === SALOON)!;
  return (await api<Plan[]>(host, 'plans.list', { engineId: saloon.id }))[0]!;
}

/** From the weighing screen's plan list, the way a restorer gets there. */
async function openSheetFromWeigh(page: Page, plan: Plan): Promise<void> {
  await openScreen(page, 'Weigh a combination');
  await page.getByLabel('Engine', { exact: true }).selectOption({ label: SALOON });
  await page.getByRole('button', { name: `Open its wiring sheet: ${plan.name}` }).click();
  await page.getByRole('heading', { level: 1, name: 'Wiring sheet' }).waitFor();
  await page.getByTestId('sheet-document').waitFor();
}

/** Prints the page to PDF at `format`, returns pdftotext's text (pages split by form feeds) and writes PNGs of the pages. */
function pdfText(pdf: string): string {
  return execFileSync('pdftotext', ['-enc', 'UTF-8', pdf, '-'], { encoding: 'utf8' });
}

describe('the wiring sheet', () => {
  it('opens a demo plan’s sheet, saves ticks and an out-of-range reading with its flag and causes, keeps them after a reload, survives a change made elsewhere, reaches “Finished”, and keeps what was typed when the host is gone', async () => {
    const { host, browser, page } = await startWorkshop(freshDir('sheet'));
    const plan = await saloonPlan(host);
    await openSheetFromWeigh(page, plan);
    // The plan is now on the bench, one click from anywhere.
    await expect.poll(() => page.getByTestId('bench-plan').innerText()).toContain(plan.name);

    const truth = await api<SheetAnswer>(host, 'sheet.get', { planId: plan.id });
    const doc = page.getByTestId('sheet-document');
    // The cautions come before the first step, every one of them, word for word, and open.
    const firstStep = steps(truth)[0]!;
    const order = await page.evaluate(
      ([cautions, step]) => {
        const c = document.querySelector(`[data-testid="${cautions}"]`)!;
        const s = document.querySelector(`[data-testid="${step}"]`)!;
        return c.compareDocumentPosition(s) & Node.DOCUMENT_POSITION_FOLLOWING;
      },
      ['sheet-cautions', `step-${firstStep.key}`],
    );
    expect(order).toBeTruthy();
    const cautionsText = await page.getByTestId('sheet-cautions').innerText();
    for (const c of truth.sheet.cautions) expect(flat(cautionsText)).toContain(flat(c.text));
    // Every measuring step shows its expected value and band as the API gives them.
    for (const s of steps(truth).filter((x) => x.reading)) {
      const r = s.reading!;
      expect(flat(await page.getByTestId(`expect-${s.key}`).innerText())).toBe(`${withUnit(r.expected, r.unit)} (from ${band(r.min, r.max, r.unit)})`);
    }
    await screenshot(page, 'sheet-screen-top');

    // Tick the first two fitting steps: saved at once, the progress follows.
    const fitting = steps(truth).filter((s) => s.fitting && !truth.ticked.includes(s.key)).slice(0, 2);
    expect(fitting.length).toBe(2);
    for (const s of fitting) {
      await page.getByTestId(`tick-${s.key}`).check();
      await expect.poll(async () => (await api<SheetAnswer>(host, 'sheet.get', { planId: plan.id })).ticked).toContain(s.key);
    }
    const ticked = truth.progress.fittingTicked + 2;
    await expect.poll(() => page.getByTestId('sheet-progress').innerText()).toContain(`${ticked} of ${truth.progress.fittingSteps} fitting steps ticked`);

    // A coil primary reading 30 % under its expected value: below the band, flagged in words,
    // with a shape of its own and the likely causes.
    const coil = steps(truth).find((s) => s.reading?.quantity === 'coil-primary-resistance')!;
    const r = coil.reading!;
    const low = Math.round(r.expected * 0.7 * 100) / 100;
    expect(low).toBeLessThan(r.min);
    const entry = page.getByTestId(`reading-entry-${coil.key}`);
    await entry.scrollIntoViewIfNeeded();
    // The date taken starts at today (the day before and after reading it, in case midnight passes).
    const dayBefore = localDay(new Date());
    const dateShown = await entry.getByLabel('Date taken').inputValue();
    expect([dayBefore, localDay(new Date())]).toContain(dateShown);
    // A comma decimal is refused beside the field, and what was typed stays.
    await entry.getByLabel('Your reading').fill(String(low).replace('.', ','));
    await entry.getByRole('button', { name: 'Save reading' }).click();
    expect(await page.getByTestId(`reading-error-${coil.key}-value`).innerText()).toContain('Write decimals with a point');
    expect(await entry.getByLabel('Your reading').inputValue()).toBe(String(low).replace('.', ','));
    expect(await entry.getByLabel('Your reading').getAttribute('aria-invalid')).toBe('true');
    // The unit list offers the step's own unit first, then the ones the store converts.
    await entry.getByLabel('Your reading').fill(String(low));
    expect(await entry.getByLabel('Unit').locator('option').allInnerTexts()).toEqual(['Ω (ohm)', 'mΩ (milliohm)', 'kΩ (kilohm)']);
    await entry.getByLabel('Note').fill('bench, meter leads zeroed');
    await entry.getByLabel('Your reading').press('Enter');
    const flag = page.getByTestId(`flag-${coil.key}`);
    const expectedFlag = `Low: ${withUnit(low, r.unit)} is below ${band(r.min, r.max, r.unit)}`;
    // The demo's own in-range reading was flagged before; the new one is the latest now.
    await expect.poll(async () => flat(await flag.innerText()).trim()).toBe(expectedFlag);
    expect(await flag.getAttribute('data-band')).toBe('low');
    expect(await flag.locator('svg.band-mark.mark-low polygon').count()).toBe(1);
    const causes = page.getByTestId(`causes-${coil.key}`);
    expect(await causes.getAttribute('class')).toContain('causes-now');
    const causesText = flat(await causes.innerText());
    expect(causesText).toContain('Most likely causes');
    for (const c of r.ifOutOfRange) expect(causesText).toContain(flat(c));
    // The colour differs from an in-range reading's (the third channel).
    const lowColour = await flag.evaluate((el) => getComputedStyle(el).color);
    expect(lowColour).not.toBe('rgb(0, 0, 0)');
    await flag.evaluate((el) => el.scrollIntoView({ block: 'center' }));
    await screenshot(page, 'sheet-screen-flag');

    const stored = (await api<SheetAnswer>(host, 'sheet.get', { planId: plan.id })).readings.filter((x) => x.quantity === 'coil-primary-resistance');
    const mine = stored.find((x) => x.value === low)!;
    expect(mine).toMatchObject({ unit: 'ohm', note: 'bench, meter leads zeroed' });

    // Reload: the address keeps the screen, so the sheet comes back; the bench chip opens it too, with its tick and reading.
    await page.reload();
    await page.getByRole('heading', { level: 1, name: 'Wiring sheet' }).waitFor();
    await page.getByTestId('bench-plan').click();
    await page.getByRole('heading', { level: 1, name: 'Wiring sheet' }).waitFor();
    for (const s of fitting) await expect.poll(() => page.getByTestId(`tick-${s.key}`).isChecked()).toBe(true);
    expect(flat(await page.getByTestId(`flag-${coil.key}`).innerText()).trim()).toBe(expectedFlag);

    // A correction in milliohms: converted by the store (x 0.001), now inside the band.
    const okMilli = Math.round(r.expected * 1000);
    const entry2 = page.getByTestId(`reading-entry-${coil.key}`);
    await entry2.getByRole('button', { name: new RegExp(`^Change the reading of ${num(low, 'ohm')} Ω`) }).click();
    await entry2.getByLabel('Your reading').fill(String(okMilli));
    await entry2.getByLabel('Unit').selectOption('mohm');
    // Meanwhile the same reading is changed somewhere else (another window, here the host's API).
    const coilCount = async (): Promise<number> => (await api<SheetAnswer>(host, 'sheet.get', { planId: plan.id })).readings.filter((x) => x.quantity === r.quantity).length;
    const before = await coilCount();
    const elsewhere = await api<Reading>(host, 'readings.update', {
      id: mine.id,
      expectedUpdatedAt: mine.updatedAt,
      reading: { planId: plan.id, quantity: r.quantity, value: low, unit: 'ohm', takenOn: mine.takenOn, note: 'changed in another window' },
    });
    expect(elsewhere.updatedAt).not.toBe(mine.updatedAt);
    await entry2.getByRole('button', { name: 'Save the change' }).click();
    // Not saved, told as a problem saying what happened; what was typed stays, still as a change.
    const stale = page.getByTestId(`reading-problem-${coil.key}`);
    await stale.waitFor();
    expect(flat(await stale.innerText())).toMatch(/Not saved: This reading was changed elsewhere .*it has been read again/);
    expect(await entry2.getByLabel('Your reading').inputValue()).toBe(String(okMilli));
    expect(await entry2.getByLabel('Unit').inputValue()).toBe('mohm');
    expect(await page.getByTestId('sheet-flash').count()).toBe(0);
    await screenshot(page, 'sheet-screen-stale');
    // Saving again changes that reading (against its new version): no second reading appears.
    await entry2.getByRole('button', { name: 'Save the change' }).click();
    await expect.poll(() => page.getByTestId(`flag-${coil.key}`).getAttribute('data-band')).toBe('in');
    expect(await coilCount()).toBe(before);
    const corrected = (await api<SheetAnswer>(host, 'sheet.get', { planId: plan.id })).readings.find((x) => x.id === mine.id)!;
    expect(corrected.value).toBeCloseTo(okMilli / 1000, 9);
    expect(corrected.unit).toBe('ohm');

    // Untick one: saved at once too.
    await page.getByTestId(`tick-${fitting[1]!.key}`).uncheck();
    await expect.poll(async () => (await api<SheetAnswer>(host, 'sheet.get', { planId: plan.id })).ticked).not.toContain(fitting[1]!.key);

    // Delete asks first; keeping it changes nothing, confirming removes it.
    await entry2.getByRole('button', { name: new RegExp(`^Delete the reading of ${num(okMilli / 1000, 'ohm')} Ω`) }).click();
    const dialog = page.getByTestId('reading-delete-dialog');
    await dialog.getByRole('button', { name: 'Keep it' }).click();
    expect((await api<SheetAnswer>(host, 'sheet.get', { planId: plan.id })).readings.some((x) => x.id === mine.id)).toBe(true);
    await entry2.getByRole('button', { name: new RegExp(`^Delete the reading of ${num(okMilli / 1000, 'ohm')} Ω`) }).click();
    await dialog.getByRole('button', { name: 'Delete the reading' }).click();
    await expect.poll(async () => (await api<SheetAnswer>(host, 'sheet.get', { planId: plan.id })).readings.some((x) => x.id === mine.id)).toBe(false);

    // The status by hand, in any direction.
    await page.getByLabel('Plan status').selectOption({ label: 'Idea' });
    await expect.poll(async () => (await api<SheetAnswer>(host, 'sheet.get', { planId: plan.id })).status).toBe('draft');

    // To "done" through the screen, as a restorer gets there: tick every fitting step left, and the
    // plan moves from "Idea" to "Wired in" by itself; write an in-band reading (the middle of its
    // band) beside every check, and it moves on to "Finished", the screen's word for done.
    const status = page.getByLabel('Plan status');
    const shownStatus = (): Promise<string> => status.evaluate((el) => (el as HTMLSelectElement).selectedOptions[0]!.text);
    const progress = page.getByTestId('sheet-progress');
    const start = await api<SheetAnswer>(host, 'sheet.get', { planId: plan.id });
    expect(start.progress.checksInBand).toBeLessThan(start.progress.checkSteps);
    let tickedNow = start.progress.fittingTicked;
    for (const s of steps(start).filter((x) => x.fitting && !start.ticked.includes(x.key))) {
      await page.getByTestId(`tick-${s.key}`).check();
      tickedNow++;
      await expect.poll(() => progress.innerText()).toContain(`${tickedNow} of ${start.progress.fittingSteps} fitting steps ticked`);
    }
    await expect.poll(shownStatus).toBe('Wired in');
    expect(flat(await progress.innerText())).toContain('(wired in: every fitting step is ticked)');
    const typeMiddle = async (s: Step): Promise<void> => {
      const rr = s.reading!;
      const mid = Number(((rr.min + rr.max) / 2).toFixed(4));
      expect(mid, s.key).toBeGreaterThanOrEqual(rr.min);
      expect(mid, s.key).toBeLessThanOrEqual(rr.max);
      const e = page.getByTestId(`reading-entry-${s.key}`);
      await e.getByLabel('Your reading').fill(String(mid));
      await e.getByLabel('Your reading').press('Enter');
      // Saved: the box empties for the next reading.
      await expect.poll(() => e.getByLabel('Your reading').inputValue()).toBe('');
    };
    for (const s of steps(start).filter((x) => x.reading)) await typeMiddle(s);
    // A measured value refines the checker's figures (a measured coil or lead wins over the
    // catalogue), so a band can move after a later reading: the plug gap follows the checker's
    // suggested gap. Read the sheet again and set again what no longer reads in range, as a
    // restorer following the sheet would.
    const outOfBand = (a: SheetAnswer): Step[] =>
      steps(a).filter((x) => {
        if (!x.reading) return false;
        const latest = a.readings.filter((y) => y.quantity === x.reading!.quantity).sort((p, q) => (p.takenOn === q.takenOn ? q.id - p.id : p.takenOn < q.takenOn ? 1 : -1))[0];
        return a.judged.find((j) => j.readingId === latest?.id && j.stepKey === x.key)?.band !== 'in';
      });
    for (let pass = 0; pass < 3; pass++) {
      const again = outOfBand(await api<SheetAnswer>(host, 'sheet.get', { planId: plan.id }));
      if (again.length === 0) break;
      for (const s of again) await typeMiddle(s);
    }
    for (const s of steps(start).filter((x) => x.reading)) await expect.poll(async () => `${s.key}: ${await page.getByTestId(`flag-${s.key}`).getAttribute('data-band')}`).toBe(`${s.key}: in`);
    await expect.poll(shownStatus).toBe('Finished');
    expect(flat(await progress.innerText())).toContain(`${start.progress.checkSteps} of ${start.progress.checkSteps} checks in range (finished: wired, and every check reads in range)`);
    expect((await api<SheetAnswer>(host, 'sheet.get', { planId: plan.id })).status).toBe('done');
    await page.getByTestId('sheet-controls').evaluate((el) => el.scrollIntoView({ block: 'start' }));
    await screenshot(page, 'sheet-screen-done');

    // With the host gone, a tick cannot be saved: the box keeps what was asked for, with the reason beside it.
    const third = steps(truth).filter((s) => s.fitting && !truth.ticked.includes(s.key))[2]!;
    await host.stop();
    await page.getByTestId(`tick-${third.key}`).uncheck();
    await page.getByTestId(`tick-error-${third.key}`).waitFor();
    expect(await page.getByTestId(`tick-${third.key}`).isChecked()).toBe(false);
    expect(await page.getByTestId(`tick-error-${third.key}`).innerText()).toContain('not saved');
    await page.getByTestId(`tick-error-${third.key}`).evaluate((el) => el.scrollIntoView({ block: 'center' }));
    await screenshot(page, 'sheet-screen-tick-failed');
    // Nor a reading: what was typed stays in its box, and the problem is told beside it.
    const entry3 = page.getByTestId(`reading-entry-${coil.key}`);
    await entry3.getByLabel('Your reading').fill('3.05');
    await entry3.getByLabel('Note').fill('typed with the host stopped');
    await entry3.getByRole('button', { name: 'Save reading' }).click();
    const failed = page.getByTestId(`reading-problem-${coil.key}`);
    await failed.waitFor();
    expect(flat(await failed.innerText())).toMatch(/^\W*Not saved: Could not reach the workshop host/);
    expect(await entry3.getByLabel('Your reading').inputValue()).toBe('3.05');
    expect(await entry3.getByLabel('Note').inputValue()).toBe('typed with the host stopped');
    await failed.evaluate((el) => el.scrollIntoView({ block: 'center' }));
    await screenshot(page, 'sheet-screen-reading-failed');
    expect(browser.pageErrors.filter((e) => !e.includes('Failed to load resource'))).toEqual([]);
    expect(browser.blocked).toEqual([]);
  });

  it('prints on A4 and Letter: cautions before the first step, every expected value and terminal, page numbers, the head on every page, no buttons', async () => {
    const { host, browser, page } = await startWorkshop(freshDir('sheet-print'));
    const plan = await saloonPlan(host);
    const coil = steps(await api<SheetAnswer>(host, 'sheet.get', { planId: plan.id })).find((s) => s.reading?.quantity === 'coil-primary-resistance')!;
    // One reading above its band (30 % over the top of it), so the print carries a flag too.
    await api(host, 'readings.add', { reading: { planId: plan.id, quantity: 'coil-primary-resistance', value: Math.round(coil.reading!.max * 130) / 100, unit: 'ohm', takenOn: '2026-01-10', note: '' } });
    await openSheetFromWeigh(page, plan);
    await page.getByTestId(`flag-${coil.key}`).waitFor();
    const first = steps(await api<SheetAnswer>(host, 'sheet.get', { planId: plan.id })).find((s) => s.fitting)!;
    await page.getByTestId(`tick-${first.key}`).check();
    await expect.poll(async () => (await api<SheetAnswer>(host, 'sheet.get', { planId: plan.id })).ticked).toContain(first.key);
    const truth = await api<SheetAnswer>(host, 'sheet.get', { planId: plan.id });

    const work = mkdtempSync(path.join(os.tmpdir(), 'ignition-sheet-pdf-'));
    try {
      for (const [format, label, size] of [
        ['A4', 'a4', /595\.\d+ x 841\.\d+|595\.\d+ x 842\.\d+/],
        ['Letter', 'letter', /612(\.\d+)? x 792(\.\d+)?/],
      ] as const) {
        await page.getByRole('radio', { name: format }).check();
        const pdf = path.join(work, `sheet-${label}.pdf`);
        await page.pdf({ path: pdf, format, printBackground: false });
        expect(execFileSync('pdfinfo', [pdf], { encoding: 'utf8' })).toMatch(new RegExp(`Page size:\\s+(${size.source})`));
        const text = pdfText(pdf);
        const pages = text.split('\f').filter((p) => p.trim() !== '');
        const all = squash(text);

        // Cautions first: each caution's text comes before the first step's title.
        const firstTitle = all.indexOf(squash(`1. ${steps(truth)[0]!.title}`));
        expect(firstTitle).toBeGreaterThan(0);
        for (const c of truth.sheet.cautions) {
          const at = all.indexOf(squash(c.text));
          expect(at, c.id).toBeGreaterThan(-1);
          expect(at, c.id).toBeLessThan(firstTitle);
        }
        // Every step, every terminal, every expected value and band, and the likely causes.
        for (const [i, s] of steps(truth).entries()) {
          expect(all).toContain(squash(`${i + 1}. ${s.title}`));
          for (const t of s.terminals) expect(all, `${s.key}: ${t}`).toContain(squash(t));
          if (s.reading) {
            const r = s.reading;
            expect(all, s.key).toContain(squash(`${withUnit(r.expected, r.unit)} (from ${band(r.min, r.max, r.unit)})`));
            for (const c of r.ifOutOfRange) expect(all, s.key).toContain(squash(c));
          }
        }
        // The flagged reading is printed in words.
        const taken = truth.readings.filter((x) => x.quantity === 'coil-primary-resistance').sort((a, b) => (a.takenOn === b.takenOn ? b.id - a.id : a.takenOn < b.takenOn ? 1 : -1))[0]!;
        expect(all).toContain(squash(`High: ${withUnit(taken.value, 'ohm')} is above ${band(coil.reading!.min, coil.reading!.max, 'ohm')}`));
        // No screen chrome: buttons, the reading form, the side list, the top bar.
        const words = flat(text);
        for (const chrome of ['Save reading', 'Plan status', 'Your reading', 'Date taken', 'Open its wiring sheet', 'Working on:', 'Plan on the bench:', 'Skip to the screen', 'Weigh a combination', 'Parts on the shelf', 'Load the demo']) {
          expect(words, chrome).not.toContain(chrome);
        }
        expect(words).not.toMatch(/\bPrint\b/);
        expect(words).not.toMatch(/\bDelete\b|\bChange\b/);
        // Page n of m on every page, m the real count; the running head on every page.
        expect(pages.length).toBeGreaterThan(1);
        for (const [i, p] of pages.entries()) {
          expect(flat(p), `page ${i + 1}`).toContain(`Page ${i + 1} of ${pages.length}`);
          expect(squash(p), `page ${i + 1}`).toContain(squash(`Wiring sheet · ${SALOON}`));
        }
        // No step split across pages: each step's numbered title and its last printed line (its last
        // likely cause, or its sentence when it has no reading) are on one page, in that order,
        // before the next step's title.
        const onPage = pages.map(squash);
        const list = steps(truth);
        for (const [i, s] of list.entries()) {
          const title = squash(`${i + 1}. ${s.title}`);
          const n = onPage.findIndex((p) => p.includes(title));
          expect(n, `${s.key}: its title is on a page`).toBeGreaterThan(-1);
          const p = onPage[n]!;
          const from = p.indexOf(title) + title.length;
          const last = squash(s.reading?.ifOutOfRange.at(-1) ?? s.text);
          const at = p.indexOf(last, from);
          expect(at, `${s.key}: its last line is on page ${n + 1} with its title`).toBeGreaterThan(-1);
          const next = list[i + 1];
          const nextAt = next ? p.indexOf(squash(`${i + 2}. ${next.title}`), from) : -1;
          if (nextAt > -1) expect(at, `${s.key}: its last line comes before the next step`).toBeLessThan(nextAt);
        }
        // Pictures of the pages for a person to look at.
        for (const f of readdirSync(outputDir).filter((f) => f.startsWith(`sheet-${label}-`) && f.endsWith('.png'))) rmSync(path.join(outputDir, f));
        execFileSync('pdftoppm', ['-r', '80', '-png', pdf, path.join(outputDir, `sheet-${label}`)]);
      }
    } finally {
      rmSync(work, { recursive: true, force: true });
    }
    expect(browser.pageErrors).toEqual([]);
  });
});
