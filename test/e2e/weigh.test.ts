/**
 * The "weigh a combination" screen end to end: the real browser host on a fresh data folder (which
 * loads the demo workshop), the built renderer and Debian's Chromium. What the page shows is
 * checked against what the host's own API answers for the same request.
 */
import { describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import type { ComparisonAnswer, SearchAnswer } from '../../electron/ipc/channels.js';
import { ignitionCautions } from '../../electron/safety/cautions.js';
import { api, e2eSuite, freshDir, openScreen, screenshot, type Browser, type Host } from './harness.js';

type Summary = { id: number; name: string };
type Plan = { id: number; engineId: number; name: string; moduleId: number | null; coilId: number | null; ballastId: number | null; crankingBypass: boolean; plugGapMm: number };
type Part = { id: number; kind: string; name: string };

const SALOON = 'Green four-door saloon';
/** Our words for the verdicts, as the screen must show them (never colour alone). */
const WORDS = { pass: 'Fine', caution: 'Take care', fail: 'Not like this' } as const;

const { startWorkshop } = e2eSuite();

async function openWeigh(): Promise<{ host: Host; browser: Browser; page: Page; saloon: Summary }> {
  const { host, browser, page } = await startWorkshop(freshDir('weigh'));
  await openScreen(page, 'Weigh a combination');
  const saloon = (await api<Summary[]>(host, 'engines.list', {})).find((e) => e.name === SALOON)!;
  await page.getByLabel('Engine', { exact: true }).selectOption({ label: SALOON });
  await expect.poll(() => page.getByTestId('current-engine').innerText()).toContain(SALOON);
  return { host, browser, page, saloon };
}

const scrollTo = (page: Page, testId: string) => page.getByTestId(testId).evaluate((el) => el.scrollIntoView({ block: 'start' }));

/** Reads a card's verdict word and checks the icon shape travels with it. */
async function cardVerdict(page: Page, index: number): Promise<string> {
  const badge = page.getByTestId(`verdict-${index}`);
  await badge.waitFor();
  const verdict = (await badge.getAttribute('data-verdict'))!;
  expect(await badge.locator(`svg.verdict-mark.mark-${verdict}`).count()).toBe(1);
  return (await badge.locator('.verdict-word').innerText()).trim();
}

describe('the weigh screen', () => {
  it('weighs the saloon’s demo plan beside the fitted ignition: words, rules, charts, four speeds, cautions and the shelf', async () => {
    const { host, browser, page, saloon } = await openWeigh();
    const plans = await api<Plan[]>(host, 'plans.list', { engineId: saloon.id });
    expect(plans.length).toBe(1);
    const demoPlan = plans[0]!;
    // The demo plan is ticked on arrival and weighed.
    await expect.poll(() => page.getByTestId(`plan-row-${demoPlan.id}`).getByRole('checkbox').isChecked()).toBe(true);
    await page.getByTestId('setup-card-1').waitFor();

    const truth = await api<ComparisonAnswer>(host, 'check.plans', { engineId: saloon.id, planIds: [demoPlan.id] });
    expect(await cardVerdict(page, 0)).toBe(WORDS[truth.existing.verdict]);
    expect(await cardVerdict(page, 1)).toBe(WORDS[truth.candidates[0]!.verdict]);
    expect(await page.getByTestId('setup-card-1').innerText()).toContain(demoPlan.name);
    await screenshot(page, 'weigh-compare');

    // Every rule of the plan is there, each with its word, why it matters and what to do.
    const rules = page.getByTestId('rules-1').locator('li.rule');
    expect(await rules.count()).toBe(truth.candidates[0]!.rules.length);
    for (const r of truth.candidates[0]!.rules) {
      const item = page.getByTestId(`rule-1-${r.id}`);
      const text = await item.textContent();
      expect(text).toContain(WORDS[r.verdict]);
      expect(text).toContain(`Why it matters: ${r.why}`);
      expect(text).toContain(`What to do: ${r.action}`);
    }

    // The charts: vector SVG with a line for the fitted ignition and one for the plan, and the margin band.
    await scrollTo(page, 'charts');
    for (const id of ['energy-0', 'energy-1']) {
      const d = await page.getByTestId('energy-chart').locator(`svg g[data-series="${id}"] path`).getAttribute('d');
      expect(d?.length ?? 0).toBeGreaterThan(200);
    }
    for (const id of ['available-0', 'available-1']) expect(await page.getByTestId('voltage-chart').locator(`svg g[data-series="${id}"] path`).count()).toBe(1);
    expect(await page.getByTestId('voltage-chart').getByTestId('margin-band').getAttribute('d')).toMatch(/^M.+Z$/);
    // The two lines differ in dash pattern as well as colour.
    const dashes = await page.getByTestId('energy-chart').locator('svg g[data-series] > path').evaluateAll((ps) => ps.map((p) => p.getAttribute('stroke-dasharray') ?? ''));
    expect(new Set(dashes).size).toBe(dashes.length);

    // Pointing at the energy chart reads the values the API gives at that speed.
    const box = (await page.getByTestId('energy-chart').locator('svg.chart-svg').boundingBox())!;
    await page.mouse.move(box.x + box.width * 0.5, box.y + box.height * 0.4);
    const readout = await page.getByTestId('energy-chart-readout').innerText();
    const m = /^At ([\d,]+) rpm: Fitted now ([\d.]+) mJ; .+ ([\d.]+) mJ\.$/.exec(readout);
    expect(m, readout).not.toBeNull();
    const rpm = Number(m![1]!.replace(/,/g, ''));
    const i = truth.existing.series.rpm.findIndex((r) => Math.round(r) === rpm);
    expect(i).toBeGreaterThan(0);
    expect(Number(m![2])).toBeCloseTo(truth.existing.series.energyMj[i]!, 1);
    expect(Number(m![3])).toBeCloseTo(truth.candidates[0]!.series.energyMj[i]!, 1);
    await screenshot(page, 'weigh-charts');
    // From the keyboard: End reads the last point, 110 % of the 6000 rpm redline (the sweep's end).
    await page.getByTestId('voltage-chart').locator('svg.chart-svg').focus();
    await page.keyboard.press('End');
    expect(await page.getByTestId('voltage-chart-readout').innerText()).toMatch(/^At 6,600 rpm: Fitted now: available [\d.]+ kV/);

    // The four speeds, at the engine's own cranking, idle and redline.
    const table = page.getByTestId('key-points');
    await table.scrollIntoViewIfNeeded();
    const tableText = await table.innerText();
    for (const row of ['Cranking, 180 rpm', 'Idle, 750 rpm', 'Mid-range', 'Redline, 6,000 rpm']) expect(tableText).toContain(row);
    expect(tableText).toContain(`${truth.candidates[0]!.keyPoints.idle.energyMj.toFixed(1)} mJ`);
    // Beside the stored energy, what the spark delivers and how long it lasts (Heywood 1988, ch. 9),
    // and the cylinder state at the spark per speed; the card lists the setup's worked-out figures.
    expect(tableText).toContain(`${truth.candidates[0]!.keyPoints.idle.sparkEnergyMj.toFixed(2)} mJ`);
    expect(tableText).toContain(`${truth.candidates[0]!.keyPoints.idle.sparkDurationMs.toFixed(2)} ms`);
    expect(tableText).toContain('Cylinder pressure at the spark');
    const figuresText = await page.getByTestId('setup-figures-1').innerText();
    expect(figuresText).toMatch(/Time to reach the current limit, idle: [\d.]+ ms|Current limit not reached, idle: the final current [\d.]+ A/);
    expect(figuresText).toMatch(/Coil secondary ceiling \(insulation rating\): [\d.]+ kV/);

    // The cautions, word for word, and the best from the shelf as the API ranks it.
    const cautions = await page.getByTestId('cautions').innerText();
    for (const c of ignitionCautions) expect(cautions).toContain(c.text);
    const shelf = await api<SearchAnswer>(host, 'check.search', { engineId: saloon.id, top: 5 });
    await page.getByTestId('shelf-list').waitFor();
    const items = page.getByTestId('shelf-list').locator('li.shelf-item');
    expect(await items.count()).toBe(shelf.suggestions.length);
    for (const [k, s] of shelf.suggestions.entries()) {
      const t = await items.nth(k).innerText();
      expect(t).toContain(s.moduleName);
      expect(t).toContain(s.coilName);
      expect(t).toContain(WORDS[s.setup.verdict]);
    }
    await scrollTo(page, 'shelf');
    await screenshot(page, 'weigh-shelf');
    expect(browser.pageErrors).toEqual([]);
    expect(browser.blocked).toEqual([]);
  });

  it('makes a plan with the 1.5 ohm ballast coil and no ballast; a current-limited unit carries it, a points-triggered unit fails it for key-on heat', async () => {
    const { host, browser, page, saloon } = await openWeigh();
    const parts = await api<Part[]>(host, 'parts.list', {});
    const coil = parts.find((p) => p.name === 'Canister coil, 1.5 ohm, for use with ballast')!;
    const limited = parts.find((p) => p.name === 'Breakerless unit, current-limited')!;
    const transistor = parts.find((p) => p.name === 'Points-triggered transistor unit')!;
    await page.getByTestId('setup-card-1').waitFor();

    await page.getByRole('button', { name: 'Make a new plan' }).click();
    const editor = page.getByTestId('plan-editor');
    await editor.waitFor();
    await editor.getByLabel('Plan name').fill('Ballast coil, ballast out');
    await editor.getByLabel('Ignition module').selectOption({ label: limited.name });
    await editor.getByLabel('Coil', { exact: true }).selectOption({ label: coil.name });
    expect(await editor.getByLabel('Ballast resistor').inputValue()).toBe('');
    // The module's own feed is explained in plain words; terminal 15 is the default.
    await expect.poll(() => editor.getByRole('radio', { name: /Straight from terminal 15/ }).isChecked()).toBe(true);
    expect(await editor.innerText()).toContain('This is the right way.');
    await screenshot(page, 'weigh-plan-editor');
    // Enter in a field saves the form.
    await editor.getByLabel('Plan name').press('Enter');
    await page.getByTestId('weigh-done').waitFor();
    await page.getByTestId('setup-card-2').waitFor();

    const stored = (await api<Plan[]>(host, 'plans.list', { engineId: saloon.id })).find((p) => p.name === 'Ballast coil, ballast out')!;
    expect(stored).toMatchObject({ moduleId: limited.id, coilId: coil.id, ballastId: null, crankingBypass: false });
    const ticked = (await api<Plan[]>(host, 'plans.list', { engineId: saloon.id })).map((p) => p.id);
    let truth = await api<ComparisonAnswer>(host, 'check.plans', { engineId: saloon.id, planIds: ticked });
    let mine = truth.candidates.findIndex((c) => c.planId === stored.id) + 1;
    expect(mine).toBe(2);
    // The module limits the current and shuts off at a stall (its record says so), so the coil is
    // protected: the screen shows what the checker says for both rules, in our words.
    for (const id of ['key-on-heat', 'coil-resistance-floor']) {
      const r = truth.candidates[mine - 1]!.rules.find((x) => x.id === id)!;
      expect(r.verdict).not.toBe('fail');
      expect(await page.getByTestId(`rule-${mine}-${id}`).textContent()).toContain(WORDS[r.verdict]);
    }

    // Now change the plan to the points-triggered unit, which has no current limit or stall shut-off.
    await page.getByRole('button', { name: 'Change the plan Ballast coil, ballast out' }).click();
    await editor.waitFor();
    await editor.getByLabel('Ignition module').selectOption({ label: transistor.name });
    await editor.getByRole('button', { name: 'Save the changes' }).click();
    await page.getByTestId('weigh-done').waitFor();
    truth = await api<ComparisonAnswer>(host, 'check.plans', { engineId: saloon.id, planIds: ticked });
    mine = truth.candidates.findIndex((c) => c.planId === stored.id) + 1;
    const keyOn = truth.candidates[mine - 1]!.rules.find((x) => x.id === 'key-on-heat')!;
    // 14 V across 1.5 + 0.1 + 0.1 ohm is about 8.2 A and about 100 W in the coil, I^2 R (design note section 9).
    expect(keyOn.verdict).toBe('fail');
    await expect.poll(() => page.getByTestId(`verdict-${mine}`).getAttribute('data-verdict')).toBe('fail');
    const item = page.getByTestId(`rule-${mine}-key-on-heat`);
    await expect.poll(() => item.textContent()).toContain(WORDS.fail);
    const text = (await item.textContent())!;
    expect(text).toContain(`Why it matters: ${keyOn.why}`);
    expect(text).toContain(`What to do: ${keyOn.action}`);
    const watts = /coil dissipation\s*([\d.]+) W/.exec(text);
    expect(Number(watts?.[1])).toBeGreaterThan(80);
    await item.evaluate((el) => el.scrollIntoView({ block: 'center' }));
    await screenshot(page, 'weigh-new-plan-fail');
    // The candidate's lines are on the charts too.
    expect(await page.getByTestId('energy-chart').locator(`svg g[data-series="energy-${mine}"] path`).count()).toBe(1);
    expect(browser.pageErrors).toEqual([]);
  });

  it('shows the store’s messages beside the fields, keeps what was typed, and asks before unsaved edits are dropped', async () => {
    const { host, browser, page, saloon } = await openWeigh();
    await page.getByTestId('setup-card-1').waitFor();
    const before = (await api<Plan[]>(host, 'plans.list', {})).length;
    await page.getByRole('button', { name: 'Make a new plan' }).click();
    const editor = page.getByTestId('plan-editor');
    await editor.getByLabel(/^Plug gap/).fill('0,8');
    await editor.getByRole('button', { name: 'Save the plan' }).click();
    // planInput's own message for a blank name, and the number reader's for a comma decimal.
    expect((await page.getByTestId('error-name').innerText()).replace(/^!\s*/, '')).toBe('Give the plan a name.');
    expect(await page.getByTestId('error-plugGapMm').innerText()).toContain('Write decimals with a point');
    expect(await editor.getByLabel('Plan name').getAttribute('aria-invalid')).toBe('true');
    expect((await api<Plan[]>(host, 'plans.list', {})).length).toBe(before);
    await screenshot(page, 'weigh-plan-errors');

    await editor.getByLabel('Plan name').fill('Half-typed idea');
    // Leaving the screen asks first; staying keeps everything typed.
    await page.getByRole('navigation', { name: 'Screens' }).getByRole('button', { name: 'Engines' }).click();
    const leave = page.getByTestId('leave-dialog');
    await leave.waitFor();
    await leave.getByRole('button', { name: 'Stay and keep editing' }).click();
    expect(await editor.getByLabel('Plan name').inputValue()).toBe('Half-typed idea');
    // Picking another engine asks too.
    const other = (await api<Summary[]>(host, 'engines.list', {})).find((e) => e.id !== saloon.id)!;
    await page.getByLabel('Engine', { exact: true }).selectOption({ label: other.name });
    const ask = page.getByTestId('plan-leave-dialog');
    await ask.waitFor();
    await screenshot(page, 'weigh-leave-dialog');
    await ask.getByRole('button', { name: 'Stay and keep editing' }).click();
    expect(await page.getByLabel('Engine', { exact: true }).inputValue()).toBe(String(saloon.id));
    expect(await editor.getByLabel('Plan name').inputValue()).toBe('Half-typed idea');
    // Going on throws the edit away and shows the other engine.
    await page.getByLabel('Engine', { exact: true }).selectOption({ label: other.name });
    await ask.getByRole('button', { name: 'Leave and lose the changes' }).click();
    await expect.poll(() => page.getByTestId('current-engine').innerText()).toContain(other.name);
    expect(await page.getByTestId('plan-editor').count()).toBe(0);
    expect((await api<Plan[]>(host, 'plans.list', {})).length).toBe(before);
    expect(browser.pageErrors).toEqual([]);
  });

  it('turns a suggestion from the shelf into a saved plan that is weighed at once', async () => {
    const { host, browser, page, saloon } = await openWeigh();
    const shelf = await api<SearchAnswer>(host, 'check.search', { engineId: saloon.id, top: 5 });
    const best = shelf.suggestions[0]!;
    await page.getByTestId('shelf-item-1').waitFor();
    await page.getByTestId('shelf-item-1').getByRole('button', { name: /Make this a plan/ }).click();
    const editor = page.getByTestId('plan-editor');
    await editor.waitFor();
    expect(await editor.getByLabel('Plan name').inputValue()).toBe(best.planName);
    expect(await editor.getByLabel('Ignition module').inputValue()).toBe(String(best.moduleId));
    // Not saved yet, and it says so.
    await editor.getByTestId('plan-unsaved').waitFor();
    await editor.getByRole('button', { name: 'Save the plan' }).click();
    await page.getByTestId('weigh-done').waitFor();
    const saved = (await api<Plan[]>(host, 'plans.list', { engineId: saloon.id })).find((p) => p.name === best.planName)!;
    expect(saved).toMatchObject({ moduleId: best.moduleId, coilId: best.coilId, ballastId: best.ballastId });
    await page.getByTestId('setup-card-2').waitFor();
    expect(await page.getByTestId('setup-card-2').innerText()).toContain(best.planName);
    // The same combination weighed as a plan gives the same verdict the shelf showed.
    expect(await page.getByTestId('verdict-2').getAttribute('data-verdict')).toBe(best.setup.verdict);
    expect(browser.pageErrors).toEqual([]);
  });
});
