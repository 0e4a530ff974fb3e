/**
 * Screenshots for the look tests, in colour and in grey, under test-output/look/. The grey one is
 * the page drawn through CSS `filter: grayscale(1)` (set through the CSSOM, which the page's CSP
 * allows), to see that every mark and state still reads without colour.
 */
import { mkdirSync } from 'node:fs';
import path from 'node:path';
import type { Locator, Page } from 'playwright-core';
import { outputDir } from './harness.js';

export const lookDir = path.join(outputDir, 'look');

async function setGrey(page: Page, on: boolean): Promise<void> {
  await page.evaluate((grey) => {
    document.documentElement.style.filter = grey ? 'grayscale(1)' : '';
  }, on);
}

/** Writes `<name>-colour.png` and `<name>-grey.png` of the page or of one element. */
export async function shotBoth(page: Page, name: string, target?: Locator): Promise<string[]> {
  mkdirSync(lookDir, { recursive: true });
  const files: string[] = [];
  for (const grey of [false, true]) {
    await setGrey(page, grey);
    const file = path.join(lookDir, `${name}-${grey ? 'grey' : 'colour'}.png`);
    if (target) await target.screenshot({ path: file });
    else await page.screenshot({ path: file });
    files.push(file);
  }
  await setGrey(page, false);
  return files;
}
