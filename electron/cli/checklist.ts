/**
 * `checklist`: the wiring sheet of one candidate in a plan file, as JSON (the default) or as one
 * self-contained printable HTML page drawn by the same components as the app's screen.
 */
import { writeFileSync } from 'node:fs';
import { buildSheet, type Sheet } from '../checklist/index.js';
import { localDate, sheetInput } from '../setup/sheet.js';
import { choiceFlag, intFlag, onePositional, onlyFlags, type ParsedArgs } from './args.js';
import { CliError } from './errors.js';
import { toJson } from './output.js';
import { readPlanFile } from './plan-file.js';
import { readJsonFile, guarded } from './commands.js';
import { diagramSvg, sheetHtml } from './sheet-html.js';

const formats = ['json', 'html'] as const;
/** The paper the HTML sheet is laid out for: its named @page size (A4 by default). */
const papers = ['a4', 'letter'] as const;

/** The sheet in the command line's JSON shape (README, "Command line"): workshop units in `unit`. */
export function sheetJson(sheet: Sheet): unknown {
  return {
    plan: sheet.header.plan,
    engine: sheet.header.engine,
    verdict: sheet.header.verdict,
    existing: sheet.header.existingLine,
    printedOn: sheet.header.printedOn,
    cautions: sheet.cautions.map((c) => c.text),
    steps: sheet.stages.flatMap((stage) =>
      stage.steps.map((s) => ({
        stage: stage.title,
        key: s.key,
        title: s.title,
        text: s.text,
        terminals: s.terminals,
        reading: s.reading
          ? {
              quantity: s.reading.quantity,
              unit: s.reading.unit,
              expected: s.reading.expected,
              min: s.reading.min,
              max: s.reading.max,
              probes: s.reading.probes,
              state: s.reading.state,
              how: `${s.reading.how} (${s.reading.source})`,
              ifOutOfRange: s.reading.ifOutOfRange,
            }
          : null,
      })),
    ),
    diagram: { svg: diagramSvg(sheet.diagram), notes: sheet.diagram.notes },
  };
}

export function checklistCommand(args: ParsedArgs): string {
  onlyFlags(args, ['candidate', 'format', 'out', 'paper']);
  const file = onePositional(args, 'plan file');
  const w = readPlanFile(readJsonFile(file));
  const format = choiceFlag(args, 'format', formats, 'json');
  const paper = choiceFlag(args, 'paper', papers, 'a4');
  if (format === 'json' && args.flags.has('paper')) throw new CliError('--paper: only the HTML sheet has pages; add --format html.');
  const out = args.flags.get('out');
  if (out === true || out === '') throw new CliError('--out: give the file to write, for example --out sheet.html.');
  if (w.plans.length === 0) throw new CliError('candidates: the plan file has no candidate; a wiring sheet is written for one candidate.');
  const index = intFlag(args, 'candidate', 1, 3, 1)!;
  if (index > w.plans.length) throw new CliError(`--candidate: ${index} names no candidate; the file has ${w.plans.length}.`);
  const sheet = guarded(() => buildSheet(sheetInput(w.engine, w.plans[index - 1]!, w.parts, [], localDate())));
  const text = format === 'json' ? toJson(sheetJson(sheet)) : sheetHtml(sheet, paper === 'letter' ? 'Letter' : 'A4');
  if (out === undefined) return text;
  try {
    writeFileSync(out, text);
  } catch (e) {
    throw new CliError(`--out: cannot write ${out}: ${(e as Error).message}`);
  }
  return `Wrote the wiring sheet for "${sheet.header.plan.name}" to ${out}.\n`;
}
