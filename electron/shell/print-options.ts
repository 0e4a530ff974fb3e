/**
 * The options of `webContents.printToPDF` for the File menu's "Save as PDF" and the screens' Print
 * button. Pure, so they are tested without Electron. The paper is the one the person chose (A4 or
 * Letter) and wins over any CSS page size; the margins are the print stylesheet's own @page margins
 * (renderer/styles/sheet.css: 14 mm 13 mm 16 mm 13 mm), given here in inches as Electron wants, so
 * the page numbers in the bottom margin have room whichever of the two decides; no backgrounds (the
 * sheet prints black on white) and no Chromium header or footer (the stylesheet prints its own).
 */
import type { PrintToPDFOptions } from 'electron';

export type PaperSize = 'A4' | 'Letter';
export const PAPER_SIZES: readonly PaperSize[] = ['A4', 'Letter'];

/** The print stylesheet's @page margins in millimetres (top, right, bottom, left as CSS writes them). */
export const PAGE_MARGINS_MM = { top: 14, right: 13, bottom: 16, left: 13 } as const;

/** One inch is 25.4 mm exactly. */
const MM_PER_INCH = 25.4;

export function pdfOptions(pageSize: PaperSize): PrintToPDFOptions {
  if (!PAPER_SIZES.includes(pageSize)) throw new RangeError(`pageSize: use one of ${PAPER_SIZES.join(', ')}, not "${String(pageSize)}".`);
  const inches = (mm: number): number => mm / MM_PER_INCH;
  return {
    pageSize,
    // The chosen paper decides; the sheet's named @page size (A4 or Letter) follows the same choice on screen.
    preferCSSPageSize: false,
    landscape: false,
    scale: 1,
    margins: { top: inches(PAGE_MARGINS_MM.top), right: inches(PAGE_MARGINS_MM.right), bottom: inches(PAGE_MARGINS_MM.bottom), left: inches(PAGE_MARGINS_MM.left) },
    printBackground: false,
    displayHeaderFooter: false,
  };
}
