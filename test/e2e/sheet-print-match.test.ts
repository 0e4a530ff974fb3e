/**
 * The command line's HTML sheet and the app's "Wiring sheet" screen are drawn by the same
 * components, so printed by Chromium they must read the same: the same header, cautions, steps,
 * terminals, expected values and diagram notes, in the same order. Checked on a demo plan without
 * readings (readings would change the screen's expected values, not the file's), both printed on
 * A4 with page.pdf and read back with pdftotext.
 */
import { execFileSync, spawnSync } from 'node:child_process';
import { readFileSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { demoPlans } from '../../db/demo/plans.js';
import { planFileOf } from '../cli/demo-plan.js';
import { api, e2eSuite, freshDir, openScreen, projectRoot } from './harness.js';

const PLAN = 'Fixed-duty breakerless unit on the plain coil';
const { startWorkshop } = e2eSuite();

/**
 * The printed words without what legitimately differs: the page furniture (running head, "Page n
 * of m", whose breaks may fall differently), and the spaces and hyphens pdftotext moves at line ends.
 */
const squash = (t: string): string => t.replace(/[\s\-\u2010\u2011\f]+/g, '');

function words(pdf: string, engine: string, plan: string): string {
  const text = execFileSync('pdftotext', ['-enc', 'UTF-8', pdf, '-'], { encoding: 'utf8' });
  const head = [`Wiringsheet·${squash(engine)}`];
  let out = squash(
    text
      .split('\n')
      .filter((line) => !/^Page \d+ of \d+$/.test(line.trim()) && line.trim() !== 'Ignition Planner')
      .join(' '),
  );
  // The running head on every page ("Wiring sheet · engine   plan   Printed date"); its pieces may
  // come back apart, so each is taken out wherever it stands (the plan's name with them).
  out = out.split(head[0]!).join('').split(squash(plan)).join('').replace(/Printed\d{8}/g, '');
  // The plan's status: a file's plan is an idea, the store's was weighed on the way to its sheet.
  return out.replace(/Plan:(Idea|Weighed|Wiredin|Finished)Workdoneby/, 'Plan:Workdoneby');
}

describe('the sheet printed from the command line and from the screen', () => {
  it('reads the same', async () => {
    const demo = demoPlans.find((p) => p.name === PLAN)!;
    const dir = freshDir('sheet-match');
    const { host, browser, page } = await startWorkshop(dir);

    // The command line's page, printed in the same browser.
    const planFile = path.join(dir, 'plan.json');
    writeFileSync(planFile, JSON.stringify(planFileOf(demo)));
    const html = path.join(dir, 'sheet.html');
    const cli = spawnSync('npx', ['tsx', 'electron/cli.ts', 'checklist', planFile, '--format', 'html', '--out', html], { cwd: projectRoot, encoding: 'utf8' });
    expect(cli.status, cli.stderr).toBe(0);
    const filePage = await browser.context.newPage();
    // Set as the page's content (the test browser refuses any address but the host's); it needs nothing else.
    await filePage.setContent(readFileSync(html, 'utf8'));
    const fromFile = path.join(dir, 'from-file.pdf');
    await filePage.pdf({ path: fromFile, format: 'A4' });

    // The screen's sheet of the same plan in the store.
    const engines = await api<Array<{ id: number; name: string }>>(host, 'engines.list', {});
    const engine = engines.find((e) => e.name === demo.engine)!;
    await openScreen(page, 'Weigh a combination');
    await page.getByLabel('Engine', { exact: true }).selectOption({ label: engine.name });
    await page.getByRole('button', { name: `Open its wiring sheet: ${PLAN}` }).click();
    await page.getByTestId('sheet-document').waitFor();
    const fromScreen = path.join(dir, 'from-screen.pdf');
    await page.pdf({ path: fromScreen, format: 'A4' });

    const a = words(fromFile, engine.name, PLAN);
    const b = words(fromScreen, engine.name, PLAN);
    expect(a.length).toBeGreaterThan(3000);
    // The same words: two-column blocks may come back from pdftotext in another reading order, so
    // the letters are compared as a multiset, and the sheet's own items in order below.
    expect([...b].sort().join('')).toBe([...a].sort().join(''));
    const json = JSON.parse(spawnSync('npx', ['tsx', 'electron/cli.ts', 'checklist', planFile], { cwd: projectRoot, encoding: 'utf8' }).stdout);
    const items: string[] = [...json.cautions, ...json.steps.flatMap((st: { title: string; terminals: string[] }) => [st.title, ...st.terminals])];
    for (const text of [a, b]) {
      let from = 0;
      for (const item of items) {
        const at = text.indexOf(squash(item), from);
        expect(at, `"${item}" in order`).toBeGreaterThanOrEqual(0);
        from = at;
      }
    }
  });
});
