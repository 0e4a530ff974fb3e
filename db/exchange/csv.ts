/**
 * Parts as CSV (RFC 4180, read and written by papaparse), one kind per file, columns from
 * csv-columns.ts. Reading is all or nothing: every row is checked with the store's part schema
 * and every problem is named by its row (the header is row 1, as a spreadsheet counts) and
 * column, `row 14, primary resistance: must be more than zero.`; any problem refuses the file.
 */
import Papa from 'papaparse';
import { partInput, type Part, type PartInput, type PartKind } from '../schema.js';
import { csvColumns, type Column } from './csv-columns.js';
import type { Problem } from './problems.js';

/** A number as text without float noise (6.000000000000001 -> 6). */
const numText = (n: number): string => String(Number(n.toPrecision(12)));

function cell(part: Record<string, unknown>, c: Column): string {
  const [head, tail] = c.key.split('.');
  const raw = tail === undefined ? part[head!] : (part[head!] as Record<string, unknown> | null)?.[tail];
  if (raw === null || raw === undefined) return '';
  switch (c.type) {
    case 'yes-no':
      return raw ? 'yes' : 'no';
    case 'list':
      return (raw as string[]).join('; ');
    case 'number':
    case 'number-or-blank':
      return numText((raw as number) * (c.factor ?? 1));
    default:
      return String(raw);
  }
}

/** The parts of one kind as CSV text with a header row. */
export function partsToCsv(kind: PartKind, parts: readonly Part[]): string {
  const cols = csvColumns[kind];
  const rows = parts.filter((p) => p.kind === kind).map((p) => cols.map((c) => cell(p as unknown as Record<string, unknown>, c)));
  return `${Papa.unparse({ fields: cols.map((c) => c.header), data: rows }, { newline: '\n' })}\n`;
}

export type CsvParse = { ok: true; parts: PartInput[] } | { ok: false; problems: Problem[] };

/** A zod message without the field's own words at its start ("Primary resistance must be ..." -> "must be ..."). */
function shorten(message: string, label: string): string {
  const lower = message.toLowerCase();
  return lower.startsWith(`${label.toLowerCase()} `) ? message.slice(label.length + 1) : message;
}

function typedValue(c: Column, text: string): { value: unknown } | { problem: string } {
  const t = text.trim();
  switch (c.type) {
    case 'text':
      return { value: text };
    case 'yes-no': {
      const l = t.toLowerCase();
      if (['yes', 'y', 'true'].includes(l)) return { value: true };
      if (['no', 'n', 'false'].includes(l)) return { value: false };
      return { problem: `write yes or no${t === '' ? '' : `, not "${t}"`}.` };
    }
    case 'choice':
      if (c.choices!.includes(t)) return { value: t };
      return { problem: `use one of ${c.choices!.join(', ')}${t === '' ? '' : `, not "${t}"`}.` };
    case 'list': {
      const items = t === '' ? [] : t.split(/[;,]/).map((s) => s.trim()).filter((s) => s !== '');
      const bad = items.find((s) => !c.choices!.includes(s));
      if (bad !== undefined) return { problem: `use ${c.choices!.join(' and/or ')} separated by ";", not "${bad}".` };
      return { value: items };
    }
    case 'number':
    case 'number-or-blank': {
      if (t === '') return c.type === 'number' ? { problem: 'give a number.' } : { value: null };
      if (/^[+-]?\d+,\d+$/.test(t)) return { problem: `"${t}" has a decimal comma; write a decimal point (${t.replace(',', '.')}).` };
      const n = Number(t);
      if (!Number.isFinite(n)) return { problem: `"${t}" is not a number.` };
      return { value: n / (c.factor ?? 1) };
    }
  }
}

/** Reads a CSV of one kind of part; all rows or none. */
export function partsFromCsv(kind: PartKind, text: string): CsvParse {
  const cols = csvColumns[kind];
  const problems: Problem[] = [];
  const parsed = Papa.parse<string[]>(text.replace(/^\uFEFF/, ''), { header: false, skipEmptyLines: false });
  for (const e of parsed.errors) problems.push({ where: `row ${(e.row ?? 0) + 1}`, message: `the CSV cannot be read here (${e.message}).` });
  const rows = parsed.data;
  if (rows.length === 0 || rows[0]!.every((h) => h.trim() === '')) return { ok: false, problems: [{ where: 'row 1', message: 'the file is empty; the first row must name the columns.' }] };
  const headers = rows[0]!.map((h) => h.trim());
  const index = new Map<string, number>();
  headers.forEach((h, i) => {
    const col = cols.find((c) => c.header === h);
    if (!col) problems.push({ where: `row 1, column ${i + 1}`, message: `"${h}" is not a column of a ${kind} list; the columns are: ${cols.map((c) => c.header).join(', ')}.` });
    else if (index.has(col.key)) problems.push({ where: `row 1, column ${i + 1}`, message: `"${h}" appears twice.` });
    else index.set(col.key, i);
  });
  for (const c of cols) if (!c.optional && !index.has(c.key)) problems.push({ where: 'row 1', message: `the column "${c.header}" is missing.` });
  if (problems.length > 0) return { ok: false, problems };

  const parts: PartInput[] = [];
  for (let r = 1; r < rows.length; r++) {
    const row = rows[r]!;
    if (row.every((v) => v.trim() === '')) continue;
    const where = (c: Column): string => `row ${r + 1}, ${c.label}`;
    if (row.length !== headers.length) {
      problems.push({ where: `row ${r + 1}`, message: `has ${row.length} values but the header names ${headers.length} columns.` });
      continue;
    }
    const candidate: Record<string, unknown> = { kind };
    const cd: Record<string, unknown> = {};
    let rowOk = true;
    for (const c of cols) {
      const i = index.get(c.key);
      if (i === undefined) continue;
      const v = typedValue(c, row[i]!);
      if ('problem' in v) {
        problems.push({ where: where(c), message: v.problem });
        rowOk = false;
        continue;
      }
      const [head, tail] = c.key.split('.');
      if (c.optional && v.value === null) continue; // a field added later: blank means absent
      if (tail === undefined) candidate[head!] = v.value;
      else cd[tail] = v.value;
    }
    if (kind === 'module') {
      const given = Object.entries(cd).filter(([k, v]) => v !== null && k !== 'multiSparkBelowRpm');
      candidate['cd'] = given.length === 0 && (cd['multiSparkBelowRpm'] ?? null) === null ? null : cd;
    }
    if (!rowOk) continue;
    const checked = partInput.safeParse(candidate);
    if (!checked.success) {
      for (const issue of checked.error.issues) {
        const path = issue.path.map(String);
        const col = cols.find((c) => c.key === path.join('.')) ?? cols.find((c) => c.key.startsWith(`${path[0]}`));
        problems.push(col ? { where: where(col), message: shorten(issue.message, col.label) } : { where: `row ${r + 1}`, message: issue.message });
      }
      continue;
    }
    parts.push(checked.data);
  }
  if (problems.length > 0) return { ok: false, problems };
  if (parts.length === 0) return { ok: false, problems: [{ where: 'row 2', message: 'the file has a header but no parts.' }] };
  return { ok: true, parts };
}
