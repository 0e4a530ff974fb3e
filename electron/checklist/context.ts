/**
 * What every stage and the diagram need to know about a plan, worked out once from the sheet's
 * input: the kind of switching, what stays and what goes, the earth, the tachometer's route, and
 * the checker's resolved circuit. Input that cannot make a sheet is refused here, naming the field.
 */
import type { BallastSpec, EngineSpec, ModuleSpec, ResolvedCircuit, RuleResult, SetupReport, SetupSpec, TachSpec } from '../checker/types.js';
import { SheetInputError } from './errors.js';
import type { SheetInput } from './types.js';
import { terminalWords, type TerminalWords } from './words.js';

export type PlanKind = 'points' | 'transistor-points' | 'breakerless-fixed-duty' | 'breakerless-current-limited' | 'capacitive-discharge';

/** Where the tachometer takes its signal on the new wiring. */
export type TachRoute = 'coil-1' | 'module-tach-output' | 'coil-feed' | 'cable';

export interface SheetContext {
  input: SheetInput;
  engine: EngineSpec;
  setup: SetupSpec;
  existing: SetupSpec;
  report: SetupReport;
  circuit: ResolvedCircuit;
  kind: PlanKind;
  module: ModuleSpec | null;
  positiveEarth: boolean;
  six: boolean;
  /** The points stay in the distributor: as the switch, or as a module's trigger. */
  keepsPoints: boolean;
  /** A breakerless module: a pickup replaces the points. */
  pickup: boolean;
  /** The condenser stays across the points (a points plan). */
  keepsCondenser: boolean;
  ballast: BallastSpec | null;
  /** The cranking bypass as it works: only with a ballast to bypass. */
  bypass: boolean;
  /** Today's wiring has a ballast / a bypass that this plan takes out. */
  removesBallast: boolean;
  removesBypass: boolean;
  /** The module takes its supply after the ballast (the plan says so and there is a ballast). */
  moduleAfterBallast: boolean;
  tach: TachSpec | null;
  tachRoute: TachRoute | null;
  tachAdaptor: boolean;
  tachRule: RuleResult | null;
  /** Current flows through the coil with the key on and the engine stopped. */
  keyOnFlows: boolean;
  /** A switching module with a stall shut-off: coil 15 and 1 both read the battery at rest. */
  afterShutOff: boolean;
  firingOrder: number[];
  words: TerminalWords;
}

const MODULE_KINDS = new Set(['transistor-points', 'breakerless-fixed-duty', 'breakerless-current-limited', 'capacitive-discharge']);

function finiteOr(field: string, x: unknown): number {
  if (typeof x !== 'number' || !Number.isFinite(x)) throw new SheetInputError(field, 'must be a finite number.');
  return x;
}

function checkCircuit(c: ResolvedCircuit): void {
  for (const [k, v] of Object.entries(c)) {
    if (typeof v === 'number') finiteOr(`report.circuit.${k}`, v);
  }
}

/** "1-3-4-2" to [1, 3, 4, 2], each cylinder once. */
export function parseFiringOrder(text: string, cylinders: number): number[] {
  const order = text.split('-').map((s) => Number(s.trim()));
  const sorted = [...order].sort((a, b) => a - b);
  if (order.length !== cylinders || sorted.some((n, i) => n !== i + 1)) {
    throw new SheetInputError('about.firingOrder', `"${text}" must name each cylinder 1 to ${cylinders} once, joined by dashes.`);
  }
  return order;
}

export function sheetContext(input: SheetInput): SheetContext {
  const { engine, setup, existing, report } = input;
  if (setup.switching === 'magneto') throw new SheetInputError('setup.switching', 'a wiring sheet is made for a battery ignition plan, not for a magneto.');
  const kind = setup.switching;
  if (!Number.isInteger(engine.cylinders) || engine.cylinders < 1) throw new SheetInputError('engine.cylinders', 'must be a whole number of at least 1.');
  for (const k of ['idleRpm', 'pointsDwellDeg', 'staticTimingDegBtdc'] as const) finiteOr(`engine.${k}`, engine[k]);
  finiteOr('setup.coil.primaryResistanceOhm20C', setup.coil.primaryResistanceOhm20C.value);
  finiteOr('setup.plugGapM', setup.plugGapM);
  finiteOr('conditions.ambientC', input.conditions.ambientC.value);
  finiteOr('about.pointsGapMm', input.about.pointsGapMm);
  if (!/^\d{4}-\d{2}-\d{2}$/.test(input.printedOn)) throw new SheetInputError('printedOn', 'must be a date written YYYY-MM-DD.');
  checkCircuit(report.circuit);
  const isModule = MODULE_KINDS.has(kind);
  const module = isModule ? setup.module : null;
  if (isModule && !module) throw new SheetInputError('setup.module', `a ${kind} plan needs its module.`);
  const ballast = setup.ballast;
  const bypass = ballast !== null && setup.crankingBypass;
  const tach = setup.tach;
  const tachRule = report.rules.find((r) => r.id === 'tach') ?? null;
  const tachAdaptor = tach !== null && tach.senses !== 'cable' && tachRule !== null && tachRule.verdict !== 'pass';
  let tachRoute: TachRoute | null = null;
  if (tach) {
    const tachOut = module?.tachOutput === true;
    if (tach.senses === 'cable') tachRoute = 'cable';
    else if (tach.senses === 'module-output') tachRoute = tachOut ? 'module-tach-output' : 'coil-1';
    else if (tach.senses === 'coil-negative-pulses') tachRoute = tachOut && kind === 'capacitive-discharge' ? 'module-tach-output' : 'coil-1';
    else tachRoute = tachAdaptor ? (tachOut ? 'module-tach-output' : 'coil-1') : 'coil-feed';
  }
  const stall = module?.stallShutOff === true;
  const keyOnFlows = kind === 'points' || ((kind === 'transistor-points' || kind === 'breakerless-fixed-duty' || kind === 'breakerless-current-limited') && !stall);
  const positiveEarth = engine.earthPolarity === 'positive';
  return {
    input,
    engine,
    setup,
    existing,
    report,
    circuit: report.circuit,
    kind,
    module,
    positiveEarth,
    six: engine.systemVoltageV === 6,
    keepsPoints: kind === 'points' || kind === 'transistor-points' || kind === 'capacitive-discharge',
    pickup: kind === 'breakerless-fixed-duty' || kind === 'breakerless-current-limited',
    keepsCondenser: kind === 'points',
    ballast,
    bypass,
    removesBallast: ballast === null && existing.ballast !== null,
    removesBypass: !bypass && existing.ballast !== null && existing.crankingBypass,
    moduleAfterBallast: module !== null && setup.moduleFeed === 'after-ballast' && ballast !== null,
    tach,
    tachRoute,
    tachAdaptor,
    tachRule,
    keyOnFlows,
    afterShutOff: module !== null && kind !== 'capacitive-discharge' && stall,
    firingOrder: parseFiringOrder(input.about.firingOrder, engine.cylinders),
    words: terminalWords(positiveEarth),
  };
}
