/**
 * The wiring sheet as a plain model: what `buildSheet` returns and what the screen, the print and
 * the command line draw. Pure data, no functions; every number carries its unit in `unit` or in
 * its name. Like the checker, this folder imports nothing from Electron, Node, the DOM or `db/`
 * (test/checklist/purity.test.ts); it may import `electron/checker` and `electron/safety`.
 */
import type { EngineSpec, ResolvedConditions, SetupReport, SetupSpec, Verdict } from '../checker/types.js';

// ---------------------------------------------------------------------------------------------
// Input.

export type PlanStatus = 'draft' | 'checked' | 'wired' | 'done';

/**
* Every reading quantity a sheet step can ask for, each with exactly one workshop unit (the
 * store's `readingUnits` in `db/schema.ts`). The store's list (`db/schema.ts` `readingQuantities`) is the same list; a
 * type check in `electron/ipc/sheet-shapes.ts` keeps the two equal.
 */
export type ReadingQuantity =
  | 'battery-voltage-resting'
  | 'coil-primary-resistance'
  | 'coil-secondary-resistance'
  | 'ballast-resistance'
  | 'ht-lead-resistance'
  | 'key-on-current'
  | 'coil-feed-voltage-key-on'
  | 'coil-switch-voltage-key-on'
  | 'coil-voltage-after-shut-off'
  | 'supply-voltage-cranking'
  | 'coil-feed-voltage-cranking'
  | 'module-supply-voltage-cranking'
  | 'supply-voltage-running'
  | 'dwell-angle'
  | 'tach-idle-rpm'
  | 'timing-idle'
  | 'timing-advanced'
  | 'plug-gap'
  | 'other';

/** The units a restorer reads off a meter or a strobe; `''` only for 'other'. */
export type WorkshopUnit = 'V' | 'A' | 'ohm' | 'kohm' | 'deg' | 'rpm' | 'mm' | '';

/** What the sheet is built from: the engine, the plan's setup and the checker's reports on them. */
export interface SheetInput {
  engine: EngineSpec;
  /** Engine facts the checker does not need but the header and the steps do. */
  about: {
    yearText: string;
    modelText: string;
    /** As stored: "1-3-4-2". */
    firingOrder: string;
    charging: 'dynamo' | 'alternator';
    pointsGapMm: number;
  };
  /** The ignition fitted today (catalogue values; from the engine record). */
  existing: SetupSpec;
  plan: { name: string; status: PlanStatus };
  /**
   * The plan's setup with catalogue values only (no readings applied): the bench measurements
   * (coil primary, ballast, leads) are expected to match the catalogue.
   */
  setup: SetupSpec;
  /**
   * The checker's report on the plan's setup as it will be weighed (readings applied, existing
   * setup as baseline): the expected readings with the car wired come from its resolved circuit.
   */
  report: SetupReport;
  existingReport: SetupReport;
  conditions: ResolvedConditions;
  /** The date the sheet is made, YYYY-MM-DD (passed in: the builder reads no clock). */
  printedOn: string;
}

// ---------------------------------------------------------------------------------------------
// Output.

export type StageId = 'magneto' | 'before' | 'measure' | 'fit' | 'static' | 'cranking' | 'running' | 'finish';

export interface ExpectedReading {
  quantity: ReadingQuantity;
  unit: WorkshopUnit;
  expected: number;
  min: number;
  max: number;
  /** Where the probes go, in words with terminal numbers: "red probe on 15, black on 1". */
  probes: string;
  /** The state of the car: "ignition off, battery disconnected, coil leads off". */
  state: string;
  /** How the expected value was found: the formula in words with the figures put in. */
  how: string;
  /** Its source or label: "Ohm's law", "copper law (IACS)", "common practice", "from memory". */
  source: string;
  /** Likely causes when the reading is out of its band, most likely first, each with what to check next. */
  ifOutOfRange: string[];
}

export interface SheetStep {
  /** Stable across rebuilds of the same plan (ticks are stored by it): "measure.coil-primary". */
  key: string;
  stage: StageId;
  /** Short title: "Coil primary resistance". */
  title: string;
  /** One plain sentence (or two) of what to do. */
  text: string;
  /** Terminals the step touches, DIN 72552 number with words where the standard has one: "15 (coil supply side)". */
  terminals: string[];
  /** A step that changes the wiring or fits a part: all of them ticked means the plan is wired. */
  fitting: boolean;
  /** A measuring step's expected reading; null for a step that only does something. */
  reading: ExpectedReading | null;
}

export interface SheetStage {
  id: StageId;
  title: string;
  /** One sentence on the state of the car for the whole stage. */
  intro: string;
  steps: SheetStep[];
}

export interface SheetHeader {
  engine: {
    name: string;
    yearText: string;
    modelText: string;
    cylinders: number;
    systemVoltageV: 6 | 12;
    earthPolarity: 'negative' | 'positive';
    charging: 'dynamo' | 'alternator';
    firingOrder: string;
  };
  plan: {
    name: string;
    status: PlanStatus;
    /** "Current-limited breakerless module: <name>", or "Points kept". */
    switching: string;
    coil: string;
    ballast: string;
    crankingBypass: boolean;
    /** "Module fed from terminal 15" / "Module fed after the ballast"; '' without a module. */
    moduleFeed: string;
    tach: string;
    leads: string;
    plug: string;
    plugGapMm: number;
    suggestedGapMm: number | null;
  };
  verdict: { verdict: Verdict; line: string };
  /** Today's setup in one line, for "what you are changing from". */
  existingLine: string;
  printedOn: string;
}

export type DiagramPartKind =
  | 'battery'
  | 'earth'
  | 'ignition-switch'
  | 'starter-solenoid'
  | 'ballast'
  | 'coil'
  | 'points'
  | 'condenser'
  | 'module'
  | 'pickup'
  | 'tach'
  | 'tach-adaptor'
  | 'distributor'
  | 'plug'
  | 'magneto';

/** A connection point on a part, in the diagram's own coordinates (absolute). */
export interface DiagramTerminal {
  id: string;
  /** What is printed beside it: "15", "1", "4", "30", "31", "module supply". */
  label: string;
  x: number;
  y: number;
}

export interface DiagramPart {
  id: string;
  kind: DiagramPartKind;
  /** Printed in the box: "Coil", "Ballast 1.5 ohm". */
  label: string;
  x: number;
  y: number;
  width: number;
  height: number;
  terminals: DiagramTerminal[];
}

/** How a wire is drawn, so it reads in black and white: line weight and dash, never colour alone. */
export type WireStyle = 'supply' | 'switched' | 'low-tension' | 'high-tension' | 'cranking' | 'earth' | 'signal';

export interface DiagramWire {
  id: string;
  /** `partId.terminalId` at each end. */
  from: string;
  to: string;
  style: WireStyle;
  /** Corner points from `from` to `to`, ends included. */
  path: Array<{ x: number; y: number }>;
  /** Optional words beside the wire ("only while cranking"). */
  label: string;
}

export interface Diagram {
  /** The drawing's own coordinate box (the SVG viewBox is 0 0 width height). */
  width: number;
  height: number;
  parts: DiagramPart[];
  wires: DiagramWire[];
  /** Sentences printed under the drawing (earth polarity in words, a condenser taken off...). */
  notes: string[];
}

export interface Sheet {
  header: SheetHeader;
  /** The workshop cautions, before the first step, never folded away. */
  cautions: Array<{ id: string; text: string }>;
  stages: SheetStage[];
  diagram: Diagram;
}

// ---------------------------------------------------------------------------------------------
// Progress: the readings and ticks against the sheet.

/** Where a reading stands against its step's band. */
export type Band = 'in' | 'low' | 'high';

export interface TakenReading {
  id: number;
  quantity: ReadingQuantity;
  value: number;
  unit: string;
  takenOn: string;
}

export interface SheetProgress {
  fittingSteps: number;
  fittingTicked: number;
  /** Steps with an expected reading. */
  checkSteps: number;
  checksInBand: number;
  /** The furthest status the work has reached: 'wired' when every fitting step is ticked, 'done' when also every check reading is in its band. */
  reached: 'none' | 'wired' | 'done';
}
