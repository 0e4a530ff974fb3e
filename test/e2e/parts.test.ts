/**
 * "Parts on the shelf" end to end: the real browser host on a fresh data folder, the built
 * renderer, Debian's Chromium. What the page shows is checked against what the store answers on
 * its own API, and against the record on disk after the host is restarted.
 */
import { describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { api, e2eSuite, freshDir, messageBeside, openApp, openScreen, screenshot, type Host, type Workshop } from './harness.js';

type StoredPart = { id: number; kind: string; name: string; [field: string]: unknown };
type StoredPlan = { id: number; name: string; moduleId: number | null; coilId: number | null; ballastId: number | null; tachId: number | null; leadsId: number | null; plugId: number | null };
type EngineSummary = { id: number; name: string };
type StoredEngine = { id: number; name: string; existing: Record<string, unknown> };

const kinds = ['coil', 'ballast', 'module', 'tach', 'leads', 'plug'] as const;
const kindHeading: Record<(typeof kinds)[number], string> = {
  coil: 'Coils',
  ballast: 'Ballast resistors',
  module: 'Ignition modules',
  tach: 'Rev counters',
  leads: 'HT leads',
  plug: 'Spark plugs',
};

const suite = e2eSuite();

async function showParts(page: Page): Promise<void> {
  await openScreen(page, 'Parts on the shelf');
  await page.getByTestId('parts-table-coil').waitFor();
}

async function openParts(page: Page, host: Host): Promise<void> {
  await openApp(page, host);
  await showParts(page);
}

async function startWorkshop(dataDir = freshDir('data')): Promise<Workshop> {
  const workshop = await suite.startWorkshop(dataDir);
  await showParts(workshop.page);
  return workshop;
}

/** Every part id a plan or an engine's fitted ignition names, with who names it. */
async function partUsers(host: Host): Promise<Map<number, string[]>> {
  const users = new Map<number, string[]>();
  const note = (id: unknown, who: string): void => {
    if (typeof id === 'number') users.set(id, [...(users.get(id) ?? []), who]);
  };
  for (const p of await api<StoredPlan[]>(host, 'plans.list', {})) {
    for (const id of [p.moduleId, p.coilId, p.ballastId, p.tachId, p.leadsId, p.plugId]) note(id, p.name);
  }
  for (const s of await api<EngineSummary[]>(host, 'engines.list', {})) {
    const e = await api<StoredEngine>(host, 'engines.get', { id: s.id });
    for (const key of ['coilPartId', 'ballastPartId', 'tachPartId', 'leadsPartId', 'plugPartId']) note(e.existing[key], e.name);
  }
  return users;
}

describe('the parts screen', () => {
  it('lists every part of every kind with its key figures in workshop units', async () => {
    const { host, browser, page } = await startWorkshop();
    const stored = await api<StoredPart[]>(host, 'parts.list', {});
    // The demo workshop is loaded on first run and holds every kind (contract of the demo loader).
    for (const kind of kinds) {
      const ofKind = stored.filter((p) => p.kind === kind);
      expect(ofKind.length, `demo parts of kind ${kind}`).toBeGreaterThan(0);
      const table = page.getByTestId(`parts-table-${kind}`);
      expect(await table.locator('tbody tr').count()).toBe(ofKind.length);
      expect(await page.getByRole('heading', { level: 2, name: `${kindHeading[kind]} (${ofKind.length})` }).count()).toBe(1);
      for (const p of ofKind) expect(await page.getByTestId(`part-row-${p.id}`).getByRole('rowheader').innerText()).toContain(p.name);
    }
    await screenshot(page, 'parts-list');

    // Stored henries are shown in millihenries: 1 mH = 0.001 H (SI prefix milli).
    const coil = stored.find((p) => p.kind === 'coil')!;
    const coilRow = page.getByTestId(`part-row-${coil.id}`);
    const coilCells = await coilRow.locator('td').allInnerTexts();
    expect(coilCells[0]).toBe(`${coil.primaryResistanceOhm20C} Ω`);
    expect(coilCells[1]).toBe(`${Number(((coil.primaryInductanceH as number) * 1000).toFixed(2))} mH`);
    expect(coilCells[4]).toBe(coil.forBallast ? 'Behind a ballast' : 'Full supply');

    // A CD module shows its capacitor in µF and its charge voltage; a current-limited one its limit.
    const modules = stored.filter((p) => p.kind === 'module');
    const cdModule = modules.find((m) => m.moduleType === 'capacitive-discharge')!;
    const cd = cdModule.cd as { capacitorUf: number; chargeVoltageV: number };
    expect(await page.getByTestId(`part-row-${cdModule.id}`).innerText()).toContain(`${cd.capacitorUf} µF charged to ${cd.chargeVoltageV} V`);
    const limited = modules.find((m) => m.moduleType === 'breakerless-current-limited')!;
    const limitedText = await page.getByTestId(`part-row-${limited.id}`).innerText();
    expect(limitedText).toContain(`Limits at ${limited.currentLimitA} A`);
    expect(limitedText).toContain(`${limited.supplyMinV} to ${limited.supplyMaxV} V`);
    await page.getByTestId('kind-module').scrollIntoViewIfNeeded();
    await screenshot(page, 'parts-list-modules');

    // Showing one kind hides the others; the choice survives going to another screen and back.
    await page.getByRole('radio', { name: /^Spark plugs/ }).check();
    expect(await page.getByTestId('parts-table-coil').count()).toBe(0);
    expect(await page.getByTestId('parts-table-plug').locator('tbody tr').count()).toBe(stored.filter((p) => p.kind === 'plug').length);
    // Gaps follow the mm/inch choice: 1 in = 25.4 mm exactly (international yard and pound agreement, 1959).
    const plug = stored.find((p) => p.kind === 'plug')!;
    await page.getByRole('radio', { name: 'inch' }).check();
    const gapCell = await page.getByTestId(`part-row-${plug.id}`).locator('td').nth(1).innerText();
    expect(gapCell).toBe(`${((plug.gapMinMm as number) / 25.4).toFixed(3)} to ${((plug.gapMaxMm as number) / 25.4).toFixed(3)} in`);
    await screenshot(page, 'parts-list-plugs-inch');
    await page.getByRole('navigation', { name: 'Screens' }).getByRole('button', { name: 'Engines' }).click();
    await page.getByRole('navigation', { name: 'Screens' }).getByRole('button', { name: 'Parts on the shelf' }).click();
    await page.getByTestId('parts-table-plug').waitFor();
    expect(await page.getByTestId('parts-table-coil').count()).toBe(0);
    await page.getByRole('radio', { name: /^Every kind/ }).check();
    await page.getByTestId('parts-table-coil').waitFor();
    expect(browser.pageErrors).toEqual([]);
  });

  it('adds a coil, shows bad values beside their fields, saves the fix, edits it, and keeps it across a restart', async () => {
    const dataDir = freshDir('data');
    const first = await startWorkshop(dataDir);
    const page = first.page;
    const name = 'Bench test coil, 1.6 ohm';

    await page.getByRole('button', { name: 'Add a coil' }).click();
    await page.getByRole('heading', { level: 1, name: 'New coil' }).waitFor();
    expect(await page.getByLabel('Kind of part').inputValue()).toBe('coil');
    await page.getByLabel('Name', { exact: true }).fill(name);
    await page.getByLabel('Primary resistance at 20 °C (Ω)').fill('-1.6');
    await page.getByLabel('Primary inductance (mH)').fill('abc');
    await page.getByLabel('Secondary resistance (Ω)').fill('8000');
    await page.getByRole('button', { name: 'Save the part' }).click();

    // zod's own sentence from db/schema.ts, and the form's "type a number" for unreadable text.
    expect(await messageBeside(page, 'Primary resistance at 20 °C (Ω)', 'primaryResistanceOhm20C')).toBe('Primary resistance must be more than zero.');
    expect(await messageBeside(page, 'Primary inductance (mH)', 'primaryInductanceH')).toBe('Primary inductance must be a number, for example 12 or 0.4.');
    await screenshot(page, 'part-editor-errors');
    expect((await api<StoredPart[]>(first.host, 'parts.list', { kind: 'coil' })).some((p) => p.name === name)).toBe(false);

    // 150 mH is 0.15 H, over the schema's 0.1 H limit: the typed unit really is millihenries.
    await page.getByLabel('Primary resistance at 20 °C (Ω)').fill('1.6');
    await page.getByLabel('Primary inductance (mH)').fill('150');
    await page.getByRole('button', { name: 'Save the part' }).click();
    expect(await messageBeside(page, 'Primary inductance (mH)', 'primaryInductanceH')).toBe('A primary inductance over 100 mH is not plausible.');
    expect(await page.getByTestId('error-primaryResistanceOhm20C').count()).toBe(0);

    // The schema's cross-field rule (zod runs it once the single fields are right): a coil needs
    // its turns ratio or its secondary inductance.
    await page.getByLabel('Primary inductance (mH)').fill('6.5');
    await page.getByRole('button', { name: 'Save the part' }).click();
    expect(await messageBeside(page, 'Turns ratio (to 1)', 'turnsRatio')).toBe('Give the turns ratio or the secondary inductance.');

    // Enter in a field saves the form.
    await page.getByLabel('Turns ratio (to 1)').fill('90');
    await page.getByLabel('Turns ratio (to 1)').press('Enter');
    await page.getByTestId('editor-status').getByText(`Saved “${name}”.`).waitFor();
    await page.getByRole('heading', { level: 1, name: `Coil: ${name}` }).waitFor();
    const saved = (await api<StoredPart[]>(first.host, 'parts.list', { kind: 'coil' })).find((p) => p.name === name);
    expect(saved).toBeDefined();
    expect(saved!.primaryResistanceOhm20C).toBe(1.6);
    expect(saved!.primaryInductanceH).toBeCloseTo(0.0065, 12); // 6.5 mH
    expect(saved!.turnsRatio).toBe(90);

    // Edit: a bigger turns ratio and "for ballast", saved with the button.
    await page.getByLabel('Turns ratio (to 1)').fill('95');
    await page.getByLabel('Made to run behind a ballast resistor').check();
    await page.getByTestId('unsaved').waitFor();
    await page.getByRole('button', { name: 'Save the part' }).click();
    await page.getByTestId('editor-status').getByText(`Saved “${name}”.`).waitFor();
    expect(await page.getByTestId('unsaved').count()).toBe(0);
    await screenshot(page, 'part-editor-saved');

    await first.host.stop();
    const second = await suite.startHost(dataDir);
    await openParts(page, second);
    const row = page.getByTestId(`part-row-${saved!.id}`);
    expect(await row.getByRole('rowheader').innerText()).toContain(name);
    expect(await row.locator('td').nth(1).innerText()).toBe('6.5 mH');
    expect(await row.locator('td').nth(4).innerText()).toBe('Behind a ballast');
    await row.getByRole('button', { name: `Edit ${name}` }).click();
    await page.getByRole('heading', { level: 1, name: `Coil: ${name}` }).waitFor();
    expect(await page.getByLabel('Primary inductance (mH)').inputValue()).toBe('6.5');
    expect(await page.getByLabel('Turns ratio (to 1)').inputValue()).toBe('95');
    const stored = await api<StoredPart>(second, 'parts.get', { id: saved!.id });
    expect(stored.turnsRatio).toBe(95);
    expect(stored.forBallast).toBe(true);
  });

  it('asks a module only for the fields its type has, in per cent and µF, and stores SI', async () => {
    const { host, page } = await startWorkshop();
    await page.getByRole('button', { name: 'Add a module' }).click();
    await page.getByRole('heading', { level: 1, name: 'New ignition module' }).waitFor();
    const type = page.getByLabel('Type of module');
    const visible = async (label: string): Promise<boolean> => (await page.getByLabel(label, { exact: true }).count()) === 1;

    await type.selectOption('breakerless-fixed-duty');
    expect(await visible('Fixed duty (% of each firing period)')).toBe(true);
    expect(await visible('Current limit (A)')).toBe(false);
    expect(await visible('Capacitor (µF)')).toBe(false);
    await type.selectOption('transistor-points');
    expect(await visible('Fixed duty (% of each firing period)')).toBe(false);
    expect(await visible('Current limit (A)')).toBe(false);
    await type.selectOption('breakerless-current-limited');
    expect(await visible('Current limit (A)')).toBe(true);
    expect(await visible('Maximum duty (% of each firing period)')).toBe(true);
    expect(await visible('Capacitor (µF)')).toBe(false);
    await type.selectOption('capacitive-discharge');
    expect(await visible('Capacitor (µF)')).toBe(true);
    expect(await visible('Current limit (A)')).toBe(false);

    const name = 'Bench CD unit, 1.2 uF';
    await page.getByLabel('Name', { exact: true }).fill(name);
    await page.getByLabel('Works from (V)').fill('9');
    await page.getByLabel('Works up to (V)').fill('8');
    await page.getByLabel('Smallest coil resistance (Ω)').fill('0.4');
    await page.getByLabel('Maximum switched current (A)').fill('4');
    await page.getByLabel('Voltage lost across the switch (V)').fill('1');
    await page.getByLabel('Maximum spark rate (sparks a second)').fill('600');
    await page.getByLabel('Capacitor (µF)').fill('1.2');
    await page.getByLabel('Charger power (W)').fill('30');
    await page.getByLabel('Negative earth').uncheck();
    await page.getByRole('button', { name: 'Save the part' }).click();
    // A CD stage needs its charge voltage: blank is refused beside that box.
    expect(await messageBeside(page, 'Charged to (V)', 'cd.chargeVoltageV')).toBe('Charge voltage is needed: type a number.');
    expect(await page.getByTestId('error-earthPolarities').innerText()).toContain('Tick at least one earth polarity.');
    await screenshot(page, 'part-editor-module-errors');

    await page.getByLabel('Charged to (V)').fill('380');
    await page.getByLabel('Negative earth').check();
    await page.getByRole('button', { name: 'Save the part' }).click();
    // The schema's cross-field rule (shown only once the single fields are right).
    expect(await messageBeside(page, 'Works up to (V)', 'supplyMaxV')).toBe('The maximum supply must be above the minimum.');
    await page.getByLabel('Works up to (V)').fill('16');
    await page.getByRole('button', { name: 'Save the part' }).click();
    await page.getByTestId('editor-status').getByText(`Saved “${name}”.`).waitFor();
    const cdUnit = (await api<StoredPart[]>(host, 'parts.list', { kind: 'module' })).find((p) => p.name === name)!;
    expect(cdUnit.cd).toEqual({ capacitorUf: 1.2, chargeVoltageV: 380, chargerPowerW: 30, multiSparkBelowRpm: null });
    expect(cdUnit.currentLimitA).toBeNull();
    expect(cdUnit.earthPolarities).toEqual(['negative']);

    // The same part as a current-limited unit: duty typed in per cent is stored as a fraction.
    await type.selectOption('breakerless-current-limited');
    expect(await visible('Capacitor (µF)')).toBe(false);
    await page.getByLabel('Current limit (A)').fill('6');
    await page.getByLabel('Maximum duty (% of each firing period)').fill('120');
    await page.getByRole('button', { name: 'Save the part' }).click();
    // Duty is a share of the period, so below 100 % (a fraction below 1 in the schema).
    expect(await messageBeside(page, 'Maximum duty (% of each firing period)', 'maxDutyFraction')).toBe('Maximum duty must be below 100 %.');
    await page.getByLabel('Maximum duty (% of each firing period)').fill('75');
    await page.getByRole('button', { name: 'Save the part' }).click();
    // A part that contradicts itself: a 6 A limit on a switch rated for 4 A is refused beside the limit.
    expect(await messageBeside(page, 'Current limit (A)', 'currentLimitA')).toBe("The current limit cannot be above the module's own maximum current (4 A).");
    await page.getByLabel('Maximum switched current (A)').fill('8');
    await page.getByRole('button', { name: 'Save the part' }).click();
    await page.getByTestId('editor-status').getByText(`Saved “${name}”.`).waitFor();
    const limited = await api<StoredPart>(host, 'parts.get', { id: cdUnit.id });
    expect(limited.moduleType).toBe('breakerless-current-limited');
    expect(limited.maxDutyFraction).toBeCloseTo(0.75, 12);
    expect(limited.currentLimitA).toBe(6);
    expect(limited.cd).toBeNull();
    await screenshot(page, 'part-editor-module');
  });

  it('refuses to delete or change the kind of a part a plan uses, saying who uses it, and loses nothing', async () => {
    const { host, page } = await startWorkshop();
    const users = await partUsers(host);
    const parts = await api<StoredPart[]>(host, 'parts.list', {});
    const plans = await api<StoredPlan[]>(host, 'plans.list', {});
    const used = parts.find((p) => p.kind === 'coil' && plans.some((pl) => pl.coilId === p.id));
    expect(used, 'the demo workshop should hold a coil that a plan uses').toBeDefined();
    const target = used!;

    // One dialog, saying who uses it first: no "Delete?" question that ends in a refusal.
    await page.getByRole('button', { name: `Delete ${target.name}` }).click();
    const refused = page.getByRole('dialog', { name: `${target.name} is in use` });
    await refused.waitFor();
    expect(await refused.getByRole('button', { name: 'Delete the part' }).count()).toBe(0);
    expect(await page.getByRole('dialog', { name: `Delete ${target.name}?` }).count()).toBe(0);
    const sentence = await refused.getByTestId('delete-part-refusal').innerText();
    for (const who of users.get(target.id)!) expect(sentence).toContain(who);
    expect(await refused.innerText()).toContain('Nothing was deleted');
    await screenshot(page, 'part-delete-refused');
    await page.keyboard.press('Escape');
    await refused.waitFor({ state: 'detached' });
    expect((await api<StoredPart[]>(host, 'parts.list', {})).length).toBe(parts.length);
    expect(await page.getByTestId(`part-row-${target.id}`).count()).toBe(1);

    // Changing its kind is refused by the store, and its sentence appears beside the kind.
    await page.getByRole('button', { name: `Edit ${target.name}` }).click();
    await page.getByRole('heading', { level: 1, name: `Coil: ${target.name}` }).waitFor();
    await page.getByLabel('Kind of part').selectOption('ballast');
    await page.getByLabel('Cold resistance (Ω)').fill('1.5');
    await page.getByRole('button', { name: 'Save the part' }).click();
    const message = await messageBeside(page, 'Kind of part', 'kind');
    expect(message).toContain('so its kind cannot change');
    for (const who of users.get(target.id)!) expect(message).toContain(who);
    expect(await page.getByTestId('editor-status').innerText()).toContain('Everything you typed is still here.');
    await screenshot(page, 'part-editor-kind-refused');
    const after = await api<StoredPart>(host, 'parts.get', { id: target.id });
    expect(after).toEqual(target);

    // Going back to coil brings back the coil's figures as they were.
    await page.getByLabel('Kind of part').selectOption('coil');
    expect(await page.getByLabel('Primary resistance at 20 °C (Ω)').inputValue()).toBe(String(target.primaryResistanceOhm20C));
    expect(await page.getByTestId('unsaved').count()).toBe(0);
  });

  it('deletes an unused part only after asking; Escape keeps it', async () => {
    const { host, page } = await startWorkshop();
    const users = await partUsers(host);
    const unused = (await api<StoredPart[]>(host, 'parts.list', {})).find((p) => !users.has(p.id));
    expect(unused, 'the demo workshop should hold a part nothing uses').toBeDefined();
    const target = unused!;

    await page.getByRole('button', { name: `Delete ${target.name}` }).click();
    const dialog = page.getByRole('dialog', { name: `Delete ${target.name}?` });
    await dialog.waitFor();
    // Focus starts on the safe choice.
    expect(await page.locator(':focus').innerText()).toBe('Keep it');
    await screenshot(page, 'part-delete-dialog');
    await page.keyboard.press('Escape');
    await dialog.waitFor({ state: 'detached' });
    expect((await api<StoredPart[]>(host, 'parts.list', {})).some((p) => p.id === target.id)).toBe(true);

    await page.getByRole('button', { name: `Delete ${target.name}` }).click();
    await dialog.getByRole('button', { name: 'Delete the part' }).click();
    const note = page.getByTestId('removal-notice');
    await note.getByText(`${target.name} was taken off the shelf.`).waitFor();
    expect(await page.getByTestId(`part-row-${target.id}`).count()).toBe(0);
    expect((await api<StoredPart[]>(host, 'parts.list', {})).some((p) => p.id === target.id)).toBe(false);
    // Undo puts it back on the shelf as it was.
    await note.getByRole('button', { name: 'Undo' }).click();
    await page.getByTestId(`part-row-${target.id}`).waitFor();
    expect((await api<StoredPart[]>(host, 'parts.list', {})).find((p) => p.id === target.id)).toEqual(target);
  });

  it('warns before leaving unsaved edits, and deletes from the editor after asking', async () => {
    const { host, page } = await startWorkshop();
    const plug = (await api<StoredPart[]>(host, 'parts.list', { kind: 'plug' }))[0]!;
    await page.getByRole('button', { name: `Edit ${plug.name}` }).click();
    await page.getByRole('heading', { level: 1, name: `Spark plug: ${plug.name}` }).waitFor();
    // Switching mm/inch alone is not an edit; the gap is re-shown in inches (25.4 mm to the inch).
    await page.getByRole('radio', { name: 'inch' }).check();
    expect(await page.getByLabel('Smallest gap (in)').inputValue()).toBe(((plug.gapMinMm as number) / 25.4).toFixed(3));
    expect(await page.getByLabel('Largest gap (in)').inputValue()).toBe(((plug.gapMaxMm as number) / 25.4).toFixed(3));
    expect(await page.getByTestId('unsaved').count()).toBe(0);
    await screenshot(page, 'part-editor-plug-inch');
    await page.getByRole('button', { name: 'Back to the parts' }).click();
    await page.getByRole('heading', { level: 1, name: 'Parts on the shelf' }).waitFor();

    const users = await partUsers(host);
    const unused = (await api<StoredPart[]>(host, 'parts.list', {})).find((p) => !users.has(p.id));
    expect(unused, 'the demo workshop should hold a part nothing uses').toBeDefined();
    const target = unused!;
    await page.getByRole('button', { name: `Edit ${target.name}` }).click();
    await page.getByRole('heading', { level: 1 }).filter({ hasText: target.name }).waitFor();
    await page.getByLabel('Notes', { exact: true }).fill('Checked at the bench');
    await page.getByTestId('unsaved').waitFor();
    await page.getByRole('button', { name: 'Back to the parts' }).click();
    const leave = page.getByRole('dialog', { name: 'Leave without saving?' });
    await leave.waitFor();
    await page.keyboard.press('Escape');
    await leave.waitFor({ state: 'detached' });
    expect(await page.getByLabel('Notes', { exact: true }).inputValue()).toBe('Checked at the bench');

    await page.getByRole('button', { name: 'Delete this part' }).click();
    await page.getByRole('dialog', { name: `Delete ${target.name}?` }).getByRole('button', { name: 'Delete the part' }).click();
    await page.getByRole('heading', { level: 1, name: 'Parts on the shelf' }).waitFor();
    await page.getByTestId('removal-notice').getByText(`${target.name} was taken off the shelf.`).waitFor();
    expect((await api<StoredPart[]>(host, 'parts.list', {})).some((p) => p.id === target.id)).toBe(false);
  });
});
