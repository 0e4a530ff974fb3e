/**
 * Input and report types of the conversion checker.
 *
 * The checker is pure: it takes these plain values and returns plain values. Every quantity is SI
 * (V, A, ohm, H, F, s, J, K, Pa, m) unless its name says otherwise (`ambientC`, `advanceDeg`), and
 * every name carries its unit. Nothing here refers to the store; `electron/setup/` converts stored
 * engines, parts and plans into these shapes.
 */

// ---------------------------------------------------------------------------------------------
// Provenance: where a number came from, so the report can say it.

export type Provenance =
  | 'default (workshop documentation)'
  | 'default (from memory)'
  | 'default (common practice)'
  | 'default (standard value)'
  | 'engine override'
  | 'measured'
  | 'catalogue';

/** A number with the place it came from. */
export interface Sourced {
  value: number;
  provenance: Provenance;
}

/** A named number in a report, with its unit and (where it is an input) its provenance. */
export interface Figure {
  name: string;
  value: number;
  unit: string;
  provenance?: Provenance;
}

// ---------------------------------------------------------------------------------------------
// The engine.

export type EngineCycle = 'four-stroke' | 'two-stroke';
export type EarthPolarity = 'negative' | 'positive';

/** One row of the mechanical advance curve: crankshaft degrees added to the static timing. */
export interface AdvanceRow {
  rpm: number;
  advanceDeg: number;
}

export interface EngineSpec {
  name: string;
  cylinders: number;
  cycle: EngineCycle;
  boreM: number;
  strokeM: number;
  conRodM: number;
  compressionRatio: number;
  idleRpm: number;
  crankingRpm: number;
  redlineRpm: number;
  systemVoltageV: 6 | 12;
  earthPolarity: EarthPolarity;
  /** Points dwell in distributor degrees. */
  pointsDwellDeg: number;
  /** Above this rpm the points follower leaves the cam and the effective dwell shrinks. */
  pointsFloatRpm: number | null;
  staticTimingDegBtdc: number;
  advanceCurve: AdvanceRow[];
  /**
   * How the battery is kept charged. A dynamo gives nothing below its cut-in speed, so there the
   * coil sees the battery at rest; an alternator charges from idle. Absent: 'alternator'.
   */
  charging?: 'dynamo' | 'alternator';
}

// ---------------------------------------------------------------------------------------------
// Operating conditions (every one overridable; the resolved set reports its provenance).

export type ConditionName =
  | 'runningSupplyV'
  | 'crankingSupplyV'
  | 'harnessResistanceOhm'
  | 'ambientC'
  | 'underBonnetC'
  | 'volumetricEfficiency'
  | 'ambientPressurePa'
  | 'inletChargeC'
  | 'pointsContactResistanceOhm'
  | 'secondaryCapacitanceF'
  | 'transferEfficiency'
  | 'arcVoltageV'
  | 'fouledShuntOhm'
  | 'ballastThermalResistanceKPerW'
  | 'coilDissipationLimitW'
  | 'currentLimitHoldS'
  | 'marginRatio'
  | 'polytropicIndex'
  | 'couplingK'
  | 'dynamoCutInRpm'
  | 'restingBatteryV'
  | 'secondaryCeilingV';

/** What the caller supplies: any subset, each with its own provenance. */
export type ConditionInputs = Partial<Record<ConditionName, Sourced>>;

/** Every condition filled in, defaults labelled. */
export type ResolvedConditions = Record<ConditionName, Sourced>;

// ---------------------------------------------------------------------------------------------
// Parts, as the checker needs them.

export interface CoilSpec {
  name: string;
  /** Primary winding resistance at 20 degC (a measured reading wins over the catalogue). */
  primaryResistanceOhm20C: Sourced;
  primaryInductanceH: number;
  secondaryResistanceOhm: number;
  /** Turns ratio n = Ns/Np; if null it is derived as sqrt(Ls/Lp). */
  turnsRatio: number | null;
  secondaryInductanceH: number | null;
  /** A low-resistance coil built to run behind a ballast. */
  forBallast: boolean;
  ratedVoltageV: 6 | 12;
  maxDissipationW: number | null;
  /**
   * Rated (insulation) secondary voltage: the most the coil is built to give. Absent or null: the
   * engine's `secondaryCeilingV` condition, or while that is a default, the default for the
   * setup's kind (30 kV, 40 kV with a capacitive-discharge unit; from memory).
   */
  ratedSecondaryV?: number | null;
  /**
   * Coupling between the windings (0.9 to 1, from the maker or a measurement of the two
   * inductances). Absent or null: the `couplingK` condition (a labelled default). Only the
   * capacitive-discharge peak uses it: its transfer rings through the leakage 2 (1 - k) Lp.
   */
  couplingK?: number | null;
}

export type BallastType = 'iron-wire' | 'ceramic' | 'harness-wire';

export interface BallastSpec {
  name: string;
  ballastType: BallastType;
  /** Resistance at 20 degC (a measured reading wins over the catalogue). */
  coldResistanceOhm: Sourced;
  /** Thermal resistance to the surrounding air; null means use the labelled default. */
  thermalResistanceKPerW: number | null;
}

export type ModuleType = 'transistor-points' | 'breakerless-fixed-duty' | 'breakerless-current-limited' | 'capacitive-discharge';

export interface CdStageSpec {
  capacitorF: number;
  chargeVoltageV: number;
  chargerPowerW: number;
  /** Below this rpm the module fires several sparks per firing event. */
  multiSparkBelowRpm: number | null;
}

export interface ModuleSpec {
  name: string;
  moduleType: ModuleType;
  supplyMinV: number;
  supplyMaxV: number;
  /** Below this supply a CD charger stops altogether; null means 0.75 x supplyMinV (from memory). */
  cutOutV?: number | null;
  earthPolarities: EarthPolarity[];
  minCoilResistanceOhm: number;
  maxCurrentA: number;
  currentLimitA: number | null;
  switchSaturationV: number;
  primaryClampV: number | null;
  fixedDutyFraction: number | null;
  maxDutyFraction: number | null;
  stallShutOff: boolean;
  maxSparkRateHz: number;
  tachOutput: boolean;
  needsSuppressedLeads: boolean;
  cd: CdStageSpec | null;
}

export type TachSenses = 'coil-supply-current' | 'coil-negative-pulses' | 'module-output' | 'cable';

export interface TachSpec {
  name: string;
  senses: TachSenses;
}

export interface LeadsSpec {
  name: string;
  core: 'copper' | 'carbon' | 'spiral';
  resistancePerLeadOhm: number;
  /** Where the resistance came from (a measured reading wins over the catalogue); absent: not reported as an input. */
  resistanceProvenance?: Provenance;
}

export interface PlugSpec {
  name: string;
  resistor: boolean;
  resistorOhm: number;
  gapMinM: number;
  gapMaxM: number;
}

export interface MagnetoSpec {
  /** Break current the magneto reaches at full output. */
  ratedCurrentA: number;
  /** Rpm at which it gets there; below it the current falls away (weak when cranked). */
  fullOutputRpm: number;
}

export type SwitchingKind =
  | 'points'
  | 'magneto'
  | 'transistor-points'
  | 'breakerless-fixed-duty'
  | 'breakerless-current-limited'
  | 'capacitive-discharge';

/** How the coil's marked terminals are connected relative to the car's earth polarity. */
export type CoilWiring = 'as-marked-for-earth' | 'reversed';

/** One complete ignition arrangement on one engine. */
export interface SetupSpec {
  label: string;
  switching: SwitchingKind;
  coil: CoilSpec;
  ballast: BallastSpec | null;
  /** The starter circuit feeds the coil directly while cranking, bypassing the ballast. */
  crankingBypass: boolean;
  /** Where the module takes its own supply. */
  moduleFeed: 'switched-15' | 'after-ballast';
  /** Null for points and magneto. */
  module: ModuleSpec | null;
  /** Condenser across the points, in farad; null when none is fitted. */
  condenserF: number | null;
  tach: TachSpec | null;
  leads: LeadsSpec | null;
  plug: PlugSpec | null;
  plugGapM: number;
  magneto: MagnetoSpec | null;
  /** Default 'as-marked-for-earth' (negative centre electrode). */
  coilWiring?: CoilWiring;
}

export type BreakdownModel = 'empirical-air' | 'paschen';

export interface CheckOptions {
  /** Points in the rpm sweep from cranking to 110 % of redline; at least 2, default 200. */
  rpmPoints?: number;
  /** Which breakdown law gives the required voltage; default 'empirical-air'. */
  breakdownModel?: BreakdownModel;
  /** Skip the plug-gap search (used inside the parts-bin search for speed). */
  skipGapSuggestion?: boolean;
}

// ---------------------------------------------------------------------------------------------
// Reports.

export type Verdict = 'pass' | 'caution' | 'fail';

export type RuleId =
  | 'coil-resistance-floor'
  | 'peak-current'
  | 'ballast-plan'
  | 'cranking-supply'
  | 'module-supply-max'
  | 'total-advance'
  | 'earth-polarity'
  | 'coil-polarity'
  | 'tach'
  | 'spark-energy'
  | 'voltage-reserve'
  | 'spark-rate'
  | 'key-on-heat'
  | 'six-volt'
  | 'condenser'
  | 'suppressed-leads'
  | 'off-time'
  | 'plug-gap'
  | 'module-heat'
  | 'setup-complete';

/**
 * What a rule's action asks for, so the report can merge every rule's advice into one list
 * without contradictions (advice.ts lists the pairs that cannot both be done).
 */
export type Intent =
  | 'ballast:add'
  | 'ballast:remove'
  | 'ballast:keep'
  | 'bypass:add'
  | 'bypass:remove'
  | 'coil-resistance:raise'
  | 'coil-resistance:lower'
  | 'dwell:longer'
  | 'dwell:shorter'
  | 'gap:close'
  | 'gap:widen'
  | 'condenser:fit'
  | 'condenser:remove'
  | 'feed:improve';

export interface RuleResult {
  id: RuleId;
  title: string;
  verdict: Verdict;
  figures: Figure[];
  /** Why it matters to a restorer, in plain sentences. */
  why: string;
  /** What to do. */
  action: string;
  /** What the action asks for (absent: nothing another action could contradict). */
  intents?: Intent[];
}

/** Which supply case a sweep point was computed for. */
export type SupplyCase = 'cranking' | 'running';

/**
 * The rpm-independent circuit values of one setup, as the checker resolved them. These are the
 * primitives a SPICE deck needs (see `CircuitAtRpm` for the per-rpm values).
 */
export interface ResolvedCircuit {
  runningSupplyV: number;
  crankingSupplyV: number;
  /** Voltage lost in the switch: points 0 V (their contact resistance is in the resistance), a module its saturation voltage. */
  switchDropV: number;
  /** Coil + ballast + harness + contact, hot (running, ballast at its self-heated equilibrium). */
  primaryResistanceHotOhm: number;
  /** The same with everything at ambient temperature. */
  primaryResistanceColdOhm: number;
  /** The cranking path: cold coil, ballast removed when the cranking bypass is fitted. */
  primaryResistanceCrankingOhm: number;
  coilResistanceColdOhm: number;
  coilResistanceHotOhm: number;
  ballastResistanceColdOhm: number;
  ballastResistanceHotOhm: number;
  ballastTemperatureHotK: number;
  harnessResistanceOhm: number;
  contactResistanceOhm: number;
  primaryInductanceH: number;
  condenserF: number;
  secondaryCapacitanceF: number;
  turnsRatio: number;
  secondaryInductanceH: number;
  /** Secondary winding + lead + plug resistor. */
  secondaryResistanceOhm: number;
  transferEfficiency: number;
  primaryClampV: number | null;
  arcVoltageV: number;
  fouledShuntOhm: number;
  /** Steady current with the switch closed, running supply, hot resistances. */
  finalCurrentRunningA: number;
  finalCurrentCrankingA: number;
  /** The supply the module itself sees while cranking (null without a module). */
  moduleSupplyCrankingV: number | null;
  moduleSupplyRunningV: number | null;
  cd: { capacitorF: number; nominalChargeVoltageV: number; chargerPowerW: number } | null;
  /** The battery at rest, what a dynamo car's coil sees below the cut-in speed (the running supply otherwise). */
  restingSupplyV: number;
  /** The coil's rated secondary (insulation) voltage; available voltage never exceeds it. */
  secondaryCeilingV: number;
  /** e^(-alpha t*): what the secondary series resistance takes off the inductive peak (source-free series RLC). */
  secondaryDampingFactor: number;
  /** Coupling of the coil windings used for the CD transfer loop (a working condition). */
  couplingK: number;
}

/** One point of the rpm sweep. */
export interface OperatingPoint {
  rpm: number;
  supplyCase: SupplyCase;
  supplyV: number;
  primaryResistanceOhm: number;
  sparkRateHz: number;
  periodS: number;
  /** Time the coil charges each period (0 for CD, whose coil is not charged by current). */
  dwellTimeS: number;
  offTimeS: number;
  currentAtBreakA: number;
  /** Energy delivered to the coil each spark: 0.5 L i^2 inductive, 0.5 C V^2 for CD. */
  storedEnergyJ: number;
  availableV: number;
  requiredV: number;
  reserveV: number;
  reserveRatio: number;
  riseTimeS: number;
  sparkDurationS: number;
  sparkAngleDegBtdc: number;
  cylinderPressurePa: number;
  cylinderTemperatureK: number;
  fouledPeakV: number;
  cdChargeVoltageV: number | null;
  multiSpark: boolean;
  moduleDissipationW: number;
  /**
   * Why this point has no spark (the module's own supply is below what it needs to switch), or null
   * when it sparks. A point without a spark has zero current, energy and available voltage, reserve 0.
   */
  noSparkReason: string | null;
  /** Available voltage before the coil's secondary ceiling; above `availableV` exactly when capped. */
  availableBeforeCeilingV: number;
  /** True where the coil's rated secondary voltage caps the available voltage. */
  cappedAtCeiling: boolean;
  /**
   * Energy delivered to the spark itself over its duration (the arc at the arc voltage), which is
   * what compares kinds fairly: a CD spark is short and hands over little of its stored energy.
   */
  sparkEnergyJ: number;
  /** Ballast temperature at this point (its own steady state at this rpm); null without a ballast. */
  ballastTemperatureK: number | null;
}

/** Everything a SPICE deck needs for one rpm: the resolved circuit plus the per-rpm values. */
export interface CircuitAtRpm {
  rpm: number;
  supplyV: number;
  switchDropV: number;
  primaryResistanceOhm: number;
  primaryInductanceH: number;
  dwellTimeS: number;
  currentAtBreakA: number;
  storedEnergyJ: number;
  condenserF: number;
  secondaryCapacitanceF: number;
  turnsRatio: number;
  secondaryInductanceH: number;
  secondaryResistanceOhm: number;
  transferEfficiency: number;
  primaryClampV: number | null;
  availablePeakV: number;
  fouledShuntOhm: number;
  fouledPeakV: number;
  cd: { capacitorF: number; chargeVoltageV: number; peakV: number } | null;
}

export interface KeyOnReport {
  /** True when current flows with the engine stopped (points may rest closed; module without stall shut-off). */
  currentFlows: boolean;
  currentA: number;
  coilDissipationW: number;
  ballastDissipationW: number;
  moduleDissipationW: number;
}

export interface PlugGapSuggestion {
  /** Largest gap meeting the margin at the worst rpm, within the plug's range when known; null if none does. */
  suggestedGapM: number | null;
  searchedFromM: number;
  searchedToM: number;
  marginRatio: number;
}

export interface KeyPoints {
  cranking: OperatingPoint;
  idle: OperatingPoint;
  mid: OperatingPoint;
  redline: OperatingPoint;
}

export interface SetupReport {
  label: string;
  switching: SwitchingKind;
  circuit: ResolvedCircuit;
  points: OperatingPoint[];
  keyPoints: KeyPoints;
  keyOn: KeyOnReport;
  rules: RuleResult[];
  /** Worst verdict among the rules. */
  verdict: Verdict;
  /**
   * What to do, merged from every rule that is not a pass: fails first, then cautions, in report
   * order, each once and without contradictions (advice.ts).
   */
  actions: string[];
  /** Lowest reserve ratio from cranking to redline, and where. */
  worstReserveRatio: number;
  worstReserveRpm: number;
  /** Lowest rpm (running, up to 110 % redline) where available/required falls below the margin; null if never. */
  belowMarginFromRpm: number | null;
  gap: PlugGapSuggestion | null;
  /** Which breakdown law the required voltage used. */
  breakdownModel: BreakdownModel;
  /**
   * Figures a restorer would otherwise work out by hand: time to the current limit, CD recharge
   * time and the rpm where CD energy starts to fall, how much the coupling moves a CD peak, the
   * cylinder pressure and temperature at the spark at each key speed, the secondary ceiling.
   */
  figures: Figure[];
  /** Inputs that were defaulted or overridden, with provenance. */
  inputs: Figure[];
}

export interface ComparisonInput {
  engine: EngineSpec;
  existing: SetupSpec;
  /** Up to three candidates. */
  candidates: SetupSpec[];
  conditions?: ConditionInputs;
  options?: CheckOptions;
}

export interface ComparisonRow {
  label: string;
  verdict: Verdict;
  cranking: OperatingPoint;
  idle: OperatingPoint;
  mid: OperatingPoint;
  redline: OperatingPoint;
  belowMarginFromRpm: number | null;
}

export interface ComparisonReport {
  conditions: ResolvedConditions;
  existing: SetupReport;
  candidates: SetupReport[];
  rows: ComparisonRow[];
}

/** The parts bin searched for the best combination on one engine. */
export interface SearchInput {
  engine: EngineSpec;
  existing: SetupSpec;
  coils: CoilSpec[];
  modules: ModuleSpec[];
  ballasts: BallastSpec[];
  /** Fitted to every candidate as they stand. */
  tach: TachSpec | null;
  leads: LeadsSpec | null;
  plug: PlugSpec | null;
  plugGapM: number;
  /**
   * Other tachometers, HT leads and plugs on the shelf. Where the fitted ones make a combination
   * fail and some of these would cure it, the search fits them (search.ts says which it picks).
   * Absent or empty: the search only changes module, coil and ballast.
   */
  shelf?: { tachs: TachSpec[]; leads: LeadsSpec[]; plugs: PlugSpec[] };
  conditions?: ConditionInputs;
  options?: CheckOptions;
  /** How many full reports to return; default 5. */
  topN?: number;
}

export interface SearchCandidate {
  coilIndex: number;
  moduleIndex: number;
  /** -1 for no ballast. */
  ballastIndex: number;
  crankingBypass: boolean;
  /** Index into `shelf.tachs`, `shelf.leads`, `shelf.plugs` of a part fitted instead of today's; -1 keeps today's. */
  tachIndex: number;
  leadsIndex: number;
  plugIndex: number;
  report: SetupReport;
}

export interface SearchResult {
  evaluated: number;
  withoutFail: number;
  top: SearchCandidate[];
  /** How many combinations each rule failed (a combination can count under several rules). */
  rejectedByRule: Partial<Record<RuleId, number>>;
}

/** A checker error: a code the UI can show and a sentence a restorer understands. */
export class CheckerInputError extends Error {
  readonly code = 'INVALID_INPUT' as const;
  constructor(message: string) {
    super(message);
    this.name = 'CheckerInputError';
  }
}
