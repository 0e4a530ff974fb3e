/**
 * The desktop print's options (webContents.printToPDF): the paper the person chose, the margins of
 * the print stylesheet converted to inches, no backgrounds, no Chromium header or footer. Checked
 * against the option names and meanings in Electron's PrintToPDFOptions documentation
 * (electronjs.org/docs/latest/api/structures/print-to-pdf-options: margins in inches, pageSize a
 * paper name, preferCSSPageSize false lets the given paper win) and the inch as exactly 25.4 mm
 * (international yard and pound agreement, 1959).
 */
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { pdfOptions, type PaperSize } from '../../electron/shell/print-options.js';

/** The print stylesheet's `@page { margin: T R B L }`, read from the file itself, in mm. */
function stylesheetMarginsMm(): { top: number; right: number; bottom: number; left: number } {
  const css = readFileSync(new URL('../../renderer/styles/sheet.css', import.meta.url), 'utf8');
  const m = /@page\s*\{[^}]*?margin:\s*([\d.]+)mm\s+([\d.]+)mm\s+([\d.]+)mm\s+([\d.]+)mm/.exec(css);
  if (!m) throw new Error('sheet.css has no "@page { margin: T R B L }" in mm');
  return { top: Number(m[1]), right: Number(m[2]), bottom: Number(m[3]), left: Number(m[4]) };
}

describe('pdfOptions', () => {
  for (const size of ['A4', 'Letter'] as const) {
    it(`prints on ${size}: that paper wins over any CSS page size, portrait, full scale`, () => {
      const o = pdfOptions(size);
      expect(o.pageSize).toBe(size);
      expect(o.preferCSSPageSize).toBe(false);
      expect(o.landscape).toBe(false);
      expect(o.scale).toBe(1);
    });
  }

  it('keeps the sheet black on white: no backgrounds, no header or footer of Chromium’s own', () => {
    const o = pdfOptions('A4');
    expect(o.printBackground).toBe(false);
    expect(o.displayHeaderFooter).toBe(false);
    expect(o.headerTemplate).toBeUndefined();
    expect(o.footerTemplate).toBeUndefined();
  });

  it('gives the print stylesheet’s @page margins, in inches (1 in = 25.4 mm exactly)', () => {
    const mm = stylesheetMarginsMm();
    const m = pdfOptions('Letter').margins!;
    // Hand arithmetic for the stylesheet's figures today: 14 mm = 0.5512 in, 13 mm = 0.5118 in, 16 mm = 0.6299 in.
    expect(mm).toEqual({ top: 14, right: 13, bottom: 16, left: 13 });
    expect(m.top).toBeCloseTo(0.5512, 4);
    expect(m.right).toBeCloseTo(0.5118, 4);
    expect(m.bottom).toBeCloseTo(0.6299, 4);
    expect(m.left).toBeCloseTo(0.5118, 4);
    for (const side of ['top', 'right', 'bottom', 'left'] as const) expect(m[side]! * 25.4, side).toBeCloseTo(mm[side], 9);
  });

  it('refuses a paper it does not know, naming the field', () => {
    expect(() => pdfOptions('Legal' as PaperSize)).toThrow(/^pageSize: use one of A4, Letter, not "Legal"\.$/);
  });
});
