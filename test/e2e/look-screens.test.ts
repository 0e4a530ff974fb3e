/**
 * Issue 9, item 3: every screen looked at with fresh eyes. Each screen is opened in Chromium
 * through the browser host and photographed (test-output/look/screen-*.png), and none may show
 * the borrowed banner words the look replaced ("Problem:", "Done:", "Note:" banners with a
 * "Dismiss" button) or a verdict drawn as a bare glyph instead of its spark-gap mark.
 */
import { describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { e2eSuite, openScreen } from './harness.js';
import { shotBoth } from './look-shots.js';

const { startWorkshop } = e2eSuite();

const SALOON = 'Green four-door saloon';

async function noBorrowedWords(page: Page, where: string): Promise<void> {
  const text = await page.locator('main').innerText();
  for (const banned of [/\bProblem:/, /\bDone:/, /\bNote:/, /\bDismiss\b/]) expect(text, `${where} shows ${banned}`).not.toMatch(banned);
  // A verdict always carries its mark (an SVG), never a glyph alone.
  const bare = await page.locator('.verdict').evaluateAll((els) => els.filter((e) => e.querySelector('svg.verdict-mark') === null).length);
  expect(bare, `${where}: verdicts without their mark`).toBe(0);
}

describe('every screen, looked at again', () => {
  it('shows our own words and marks on each screen', async () => {
    const { browser, page } = await startWorkshop();
    await noBorrowedWords(page, 'Engines');
    await shotBoth(page, 'screen-engines');

    await page.getByRole('table', { name: 'Engines in this workshop' }).getByRole('button', { name: SALOON }).first().click();
    await page.getByRole('heading', { level: 1, name: `Engine: ${SALOON}` }).waitFor();
    await noBorrowedWords(page, 'Engine editor');
    await shotBoth(page, 'screen-engine-editor');

    await openScreen(page, 'Parts on the shelf');
    await noBorrowedWords(page, 'Parts');
    await shotBoth(page, 'screen-parts');

    await openScreen(page, 'Weigh a combination');
    await page.getByLabel('Engine', { exact: true }).selectOption({ label: SALOON });
    await page.getByTestId('setup-card-1').waitFor();
    await noBorrowedWords(page, 'Weigh');
    await shotBoth(page, 'screen-weigh');

    await openScreen(page, 'Wiring sheet');
    await page.getByTestId('sheet-document').waitFor();
    await noBorrowedWords(page, 'Wiring sheet');
    await shotBoth(page, 'screen-sheet');

    await openScreen(page, 'Records and backups');
    await noBorrowedWords(page, 'Records');
    await shotBoth(page, 'screen-records');
    expect(browser.pageErrors).toEqual([]);
  });
});
