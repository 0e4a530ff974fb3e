/**
 * The three commands. Each reads its file, runs the same checker and setup adapter the app uses,
 * and returns the text to print.
 */
import { readFileSync } from 'node:fs';
import { checkSetup, compareSetups, searchBest, CheckerInputError, type SetupReport } from '../checker/index.js';
import { comparisonInput, conditionInputs, engineSpec, existingSetupSpec, planSetupSpec, searchInput, SetupAdapterError } from '../setup/index.js';
import { buildDeck, circuitFromReport, DeckError, ExportError, type Scenario } from '../spice/index.js';
import { MAX_RPM_POINTS, MIN_RPM_POINTS } from '../checker/grid.js';
import { choiceFlag, intFlag, numberFlag, onePositional, onlyFlags, switchFlag, type ParsedArgs } from './args.js';
import { ignitionCautions } from '../safety/cautions.js';
import { SheetInputError } from '../checklist/errors.js';
import { CliError } from './errors.js';
import { toJson } from './output.js';
import { readBinFile, readPlanFile, type Workshop } from './plan-file.js';

/** The workshop cautions, printed with every report that says what to change on the ignition. */
const cautions = ignitionCautions.map((c) => c.text);

/** Read and parse a JSON file, refusing a missing file or bad JSON with a plain sentence. */
export function readJsonFile(path: string): unknown {
  let text: string;
  try {
    text = readFileSync(path, 'utf8');
  } catch (e) {
    const code = (e as NodeJS.ErrnoException).code;
    const why = code === 'ENOENT' ? 'there is no such file' : code === 'EISDIR' ? 'it is a folder, not a file' : code === 'EACCES' ? 'permission denied' : 'it cannot be read';
    throw new CliError(`${path}: cannot read the file: ${why}.`);
  }
  try {
    return JSON.parse(text) as unknown;
  } catch (e) {
    throw new CliError(`${path}: not valid JSON (${(e as Error).message}).`);
  }
}

/** Errors from the adapter and the checker are input problems: exit 2 with their sentence. */
export function guarded<T>(run: () => T): T {
  try {
    return run();
  } catch (e) {
    if (e instanceof SetupAdapterError || e instanceof CheckerInputError || e instanceof ExportError || e instanceof SheetInputError) throw new CliError(e.message);
    if (e instanceof DeckError) throw new CliError(e.problems.join('\n'));
    throw e;
  }
}

function checkOptions(w: Workshop, rpmPoints?: number | null): { rpmPoints?: number; breakdownModel?: 'empirical-air' | 'paschen' } {
  const o: { rpmPoints?: number; breakdownModel?: 'empirical-air' | 'paschen' } = {};
  const points = rpmPoints ?? w.options.rpmPoints;
  if (points !== undefined) o.rpmPoints = points;
  if (w.options.breakdownModel !== undefined) o.breakdownModel = w.options.breakdownModel;
  return o;
}

/** A setup's report without its sweep (unless asked for): the key points carry the figures. */
function trimReport(r: SetupReport, withSweep: boolean): Partial<SetupReport> {
  if (withSweep) return r;
  const { points: _points, ...rest } = r;
  return rest;
}

export function checkCommand(args: ParsedArgs): string {
  onlyFlags(args, ['sweep', 'rpm-points']);
  const file = onePositional(args, 'plan file');
  const sweep = switchFlag(args, 'sweep');
  const rpmPoints = intFlag(args, 'rpm-points', MIN_RPM_POINTS, MAX_RPM_POINTS, null);
  const w = readPlanFile(readJsonFile(file));
  return guarded(() => {
    const report = compareSetups(comparisonInput(w.engine, w.plans, w.parts, undefined, checkOptions(w, rpmPoints)));
    return toJson({
      engine: w.engine.name,
      conditions: report.conditions,
      rows: report.rows,
      existing: trimReport(report.existing, sweep),
      candidates: report.candidates.map((c) => trimReport(c, sweep)),
      cautions,
    });
  });
}

export function searchCommand(args: ParsedArgs): string {
  onlyFlags(args, ['top', 'rpm-points']);
  const file = onePositional(args, 'parts-bin file');
  const w = readBinFile(readJsonFile(file));
  const top = intFlag(args, 'top', 1, 50, w.topN ?? 5)!;
  const rpmPoints = intFlag(args, 'rpm-points', MIN_RPM_POINTS, MAX_RPM_POINTS, null);
  return guarded(() => {
    const input = searchInput(w.engine, w.parts, top, checkOptions(w, rpmPoints));
    const result = searchBest(input);
    return toJson({
      engine: w.engine.name,
      evaluated: result.evaluated,
      withoutFail: result.withoutFail,
      rejectedByRule: result.rejectedByRule,
      top: result.top.map((c, i) => ({
        rank: i + 1,
        module: input.modules[c.moduleIndex]!.name,
        coil: input.coils[c.coilIndex]!.name,
        ballast: c.ballastIndex >= 0 ? input.ballasts[c.ballastIndex]!.name : null,
        crankingBypass: c.crankingBypass,
        verdict: c.report.verdict,
        worstReserveRatio: c.report.worstReserveRatio,
        worstReserveRpm: c.report.worstReserveRpm,
        belowMarginFromRpm: c.report.belowMarginFromRpm,
        keyPoints: c.report.keyPoints,
        rules: c.report.rules,
      })),
      cautions,
    });
  });
}

const scenarios = ['break', 'fouled', 'cd', 'charge'] as const;

export function netlistCommand(args: ParsedArgs): string {
  onlyFlags(args, ['candidate', 'rpm', 'scenario', 'coupling']);
  const file = onePositional(args, 'plan file');
  const w = readPlanFile(readJsonFile(file));
  const index = intFlag(args, 'candidate', 0, 3, 1)!;
  const rpm = numberFlag(args, 'rpm');
  const scenario: Scenario = choiceFlag(args, 'scenario', scenarios, 'break');
  const couplingRaw = args.flags.get('coupling');
  let couplingK: number | undefined;
  if (couplingRaw !== undefined) {
    const k = Number(couplingRaw);
    if (couplingRaw === true || !(k > 0 && k < 1)) throw new CliError('--coupling: give the coupling factor k, between 0 and 1 (for example 0.995).');
    couplingK = k;
  }
  if (index > w.plans.length) {
    throw new CliError(`--candidate: ${index} names no candidate; the file has ${w.plans.length} (use 0 for the existing setup).`);
  }
  return guarded(() => {
    const spec = index === 0 ? existingSetupSpec(w.engine, w.parts) : planSetupSpec(w.engine, w.plans[index - 1]!, w.parts);
    const engine = engineSpec(w.engine);
    const report = checkSetup(engine, spec, conditionInputs(w.engine), { ...checkOptions(w), skipGapSuggestion: true });
    const lo = report.points[0]!.rpm;
    const hi = report.points[report.points.length - 1]!.rpm;
    if (rpm < lo || rpm > hi) throw new CliError(`--rpm: ${rpm} is outside the range the checker sweeps for this engine, ${Math.round(lo)} to ${Math.round(hi)} rpm.`);
    const isCd = spec.switching === 'capacitive-discharge';
    if (scenario === 'cd' && !isCd) throw new CliError(`--scenario cd: "${spec.label}" is not a capacitive-discharge setup; use break, fouled or charge.`);
    if (scenario !== 'cd' && isCd) throw new CliError(`--scenario ${scenario}: "${spec.label}" is a capacitive-discharge setup; use --scenario cd.`);
    const circuit = circuitFromReport(spec, report, rpm, `${w.engine.name}: ${spec.label} at ${rpm} rpm`);
    const opts: { couplingK?: number; fouledShuntOhm?: number } = { fouledShuntOhm: report.circuit.fouledShuntOhm };
    if (couplingK !== undefined) opts.couplingK = couplingK;
    return buildDeck(circuit, scenario, opts).text;
  });
}
