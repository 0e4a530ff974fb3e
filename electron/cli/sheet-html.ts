/**
 * The wiring sheet as one self-contained printable HTML page, drawn by the very components the
 * app's "Wiring sheet" screen uses (renderer/sheet, renderer/diagram) with react-dom/server, and
 * the screen's own stylesheet (renderer/styles/sheet.css) inlined. No script: the page only prints.
 */
import { readFileSync } from 'node:fs';
import { createElement } from 'react';
import { renderToStaticMarkup } from 'react-dom/server';
import type { Diagram, Sheet } from '../checklist/types.js';
import { WiringDiagram } from '../../renderer/diagram/WiringDiagram.js';
import { SheetDocument, type PageSize } from '../../renderer/sheet/SheetDocument.js';
import { CliError } from './errors.js';

/**
 * The sheet stylesheet: beside the source when run with tsx (electron/cli -> renderer/styles), or
 * beside the bundle (build/bundle-electron.mjs copies it into dist-electron/).
 */
function sheetCss(): string {
  const candidates = [new URL('../../renderer/styles/sheet.css', import.meta.url), new URL('./sheet.css', import.meta.url)];
  for (const url of candidates) {
    try {
      return readFileSync(url, 'utf8');
    } catch {
      // try the next place
    }
  }
  throw new CliError('Internal fault: the sheet stylesheet (sheet.css) is missing from the installation.', 1);
}

const escapeHtml = (s: string): string => s.replace(/&/g, '&amp;').replace(/</g, '&lt;').replace(/>/g, '&gt;').replace(/"/g, '&quot;');

/**
 * The wiring diagram alone, as one SVG document: the drawing the screen shows (the figure's first
 * <svg>, which holds no other), without the HTML legend around it.
 */
export function diagramSvg(diagram: Diagram): string {
  const figure = renderToStaticMarkup(createElement(WiringDiagram, { diagram }));
  const start = figure.indexOf('<svg');
  const end = figure.indexOf('</svg>', start);
  if (start < 0 || end < 0) throw new CliError('Internal fault: the wiring diagram drew no SVG.', 1);
  return figure.slice(start, end + '</svg>'.length);
}

/**
 * The whole sheet as an HTML document: styles inlined, no script, the cautions before the first
 * step, laid out for `pageSize` (the sheet's named @page: a browser's print takes that paper).
 */
export function sheetHtml(sheet: Sheet, pageSize: PageSize = 'A4'): string {
  const body = renderToStaticMarkup(createElement(SheetDocument, { sheet, pageSize, headingLevel: 1 }));
  const title = `Wiring sheet: ${sheet.header.plan.name} (${sheet.header.engine.name})`;
  return `<!doctype html>
<html lang="en">
<head>
<meta charset="utf-8">
<meta name="viewport" content="width=device-width, initial-scale=1">
<meta http-equiv="Content-Security-Policy" content="default-src 'none'; style-src 'unsafe-inline'; img-src data:">
<title>${escapeHtml(title)}</title>
<style>
body { margin: 1.5rem; font-family: system-ui, 'DejaVu Sans', sans-serif; background: #fff; }
@media print { body { margin: 0; } }
${sheetCss()}
</style>
</head>
<body class="sheet-page">
${body}
</body>
</html>
`;
}
