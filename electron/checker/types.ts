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
  | 'cdRiseRateVPerS'
  | 'marginRatio';

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

export interface RuleResult {
  id: RuleId;
  title: string;
  verdict: Verdict;
  figures: Figure[];
  /** Why it matters to a restorer, in plain sentences. */
  why: string;
  /** What to do. */
  action: string;
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
  /** Lowest reserve ratio from cranking to redline, and where. */
  worstReserveRatio: number;
  worstReserveRpm: number;
  /** Lowest rpm (running, up to 110 % redline) where available/required falls below the margin; null if never. */
  belowMarginFromRpm: number | null;
  gap: PlugGapSuggestion | null;
  /** Which breakdown law the required voltage used. */
  breakdownModel: BreakdownModel;
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
