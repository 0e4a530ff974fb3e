/**
 * The weighing screen printed: nothing folded away (every rule's why and what to do, the working
 * conditions), the engine and the date on top, the cautions, and none of the screen's controls.
 * Printed with Chromium's page.pdf, read back with pdftotext, pages saved as PNGs to look at.
 */
import { execFileSync } from 'node:child_process';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import type { ComparisonAnswer } from '../../electron/ipc/channels.js';
import { api, e2eSuite, freshDir, openScreen, outputDir } from './harness.js';

const SALOON = 'Green four-door saloon';
const { startWorkshop } = e2eSuite();
const squash = (t: string): string => t.replace(/[\s\-\u2010\u2011]+/g, '');

describe('the weighing screen in print', () => {
  it('prints every rule unfolded, the engine, the date and the cautions, without the controls', async () => {
    const { host, page } = await startWorkshop(freshDir('weigh-print'));
    const saloon = (await api<Array<{ id: number; name: string }>>(host, 'engines.list', {})).find((e) => e.name === SALOON)!;
    const plans = await api<Array<{ id: number }>>(host, 'plans.list', { engineId: saloon.id });
    await openScreen(page, 'Weigh a combination');
    await page.getByLabel('Engine', { exact: true }).selectOption({ label: SALOON });
    const truth = await api<ComparisonAnswer>(host, 'check.plans', { engineId: saloon.id, planIds: plans.map((p) => p.id) });
    // Print once the screen shows every setup with every rule's reasons (folded, but in the page),
    // as a restorer would: on a loaded machine the cards can arrive a moment apart.
    await page.getByTestId(`setup-card-${truth.candidates.length}`).waitFor();
    const wanted = [truth.existing, ...truth.candidates].flatMap((setup) => setup.rules.map((rule) => squash(rule.why)));
    await expect.poll(async () => {
      const shown = squash((await page.locator('body').textContent()) ?? '');
      return wanted.filter((w) => !shown.includes(w)).length;
    }).toBe(0);

    const pdf = path.join(outputDir, 'weigh-print.pdf');
    await page.pdf({ path: pdf, format: 'A4' });
    execFileSync('pdftoppm', ['-r', '60', '-png', pdf, path.join(outputDir, 'weigh-print')]);
    const text = squash(execFileSync('pdftotext', ['-enc', 'UTF-8', pdf, '-'], { encoding: 'utf8' }));

    const d = new Date();
    const today = `${d.getFullYear()}-${String(d.getMonth() + 1).padStart(2, '0')}-${String(d.getDate()).padStart(2, '0')}`;
    expect(text).toContain(squash(`Engine: ${SALOON}`));
    expect(text).toContain(squash(`Printed on ${today}`));
    // Folded on screen, printed in full: each rule's why and what to do, for every setup.
    for (const setup of [truth.existing, ...truth.candidates]) {
      for (const rule of setup.rules) {
        expect(text, rule.id).toContain(squash(rule.why));
        expect(text, rule.id).toContain(squash(rule.action));
      }
    }
    expect(text).toContain(squash('Working conditions these figures assume'));
    for (const caution of truth.cautions) expect(text).toContain(squash(caution.text));
    expect(text).not.toMatch(/Print(?!edon)/);
    for (const control of ['Editthisplan', 'Newplan', 'Makethisaplan', 'Skiptothescreen', 'Paper']) expect(text).not.toContain(control);

    // The browser host cannot print to a file: the Print button hands over to the browser's own
    // print (last, since headless Chromium then holds the page in its print job), with no problem shown.
    await page.getByRole('button', { name: 'Print' }).click();
    expect(await page.getByTestId('weigh-printed').count()).toBe(0);
  });
});
