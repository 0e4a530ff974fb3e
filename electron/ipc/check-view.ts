/**
 * The checker's full reports (SI, 200-point sweeps, every intermediate value) trimmed to what the
 * "weigh a combination" screen shows: display units (mJ, kV, mm, ms), the four key points, the
 * rules with their figures, and the sweep downsampled for charts. Pure functions, no store.
 */
import type { ConditionName, Figure, OperatingPoint, ResolvedConditions, RuleResult, SetupReport } from '../checker/types.js';
import { conditionUnits, secondaryCeilingDefaultV } from '../checker/conditions.js';
import type { ShownFigure, ShownPoint, ShownRule, ShownSeries, ShownSetup } from './check-shapes.js';

/** How many points a chart gets; the checker's own sweep is finer. */
export const CHART_POINTS = 100;

const fin = (x: number): number => (Number.isFinite(x) ? x : 0);
/** Rounds away float noise (0.30000000000000004) without losing what a person could read. */
const tidy = (x: number, digits = 6): number => fin(Number(fin(x).toPrecision(digits)));

/**
 * Evenly spaced indices into a sweep of `n` points, always keeping the first and the last. With
 * `n <= m` every index is kept.
 */
export function pickIndices(n: number, m: number): number[] {
  const count = Math.max(0, Math.floor(n));
  const want = Math.max(2, Math.floor(m));
  if (count <= want) return Array.from({ length: count }, (_, i) => i);
  const out: number[] = [];
  for (let i = 0; i < want; i++) {
    const k = Math.round((i * (count - 1)) / (want - 1));
    if (out[out.length - 1] !== k) out.push(k);
  }
  return out;
}

export function shownPoint(p: OperatingPoint): ShownPoint {
  return {
    rpm: tidy(p.rpm),
    supplyV: tidy(p.supplyV),
    currentA: tidy(p.currentAtBreakA),
    dwellMs: tidy(p.dwellTimeS * 1e3),
    energyMj: tidy(p.storedEnergyJ * 1e3),
    availableKv: tidy(p.availableV / 1e3),
    requiredKv: tidy(p.requiredV / 1e3),
    reserveRatio: tidy(p.reserveRatio),
    noSparkReason: p.noSparkReason,
    sparkEnergyMj: tidy(p.sparkEnergyJ * 1e3),
    sparkDurationMs: tidy(p.sparkDurationS * 1e3),
    cappedAtCeiling: p.cappedAtCeiling,
  };
}

export function shownSeries(points: readonly OperatingPoint[], m = CHART_POINTS): ShownSeries {
  const idx = pickIndices(points.length, m);
  const picked = idx.map((i) => points[i]!);
  let crankingCount = 0;
  while (crankingCount < picked.length && picked[crankingCount]!.supplyCase === 'cranking') crankingCount++;
  return {
    rpm: picked.map((p) => tidy(p.rpm)),
    energyMj: picked.map((p) => tidy(p.storedEnergyJ * 1e3)),
    availableKv: picked.map((p) => tidy(p.availableV / 1e3)),
    requiredKv: picked.map((p) => tidy(p.requiredV / 1e3)),
    crankingCount,
    noSpark: picked.map((p) => p.noSparkReason !== null),
    noSparkNote: picked.find((p) => p.noSparkReason !== null)?.noSparkReason ?? null,
  };
}

export function shownFigure(f: Figure): ShownFigure {
  return { name: f.name, value: tidy(f.value), unit: f.unit, measured: f.provenance === 'measured', source: f.provenance ?? null };
}

function shownRule(r: RuleResult): ShownRule {
  return { id: r.id, title: r.title, verdict: r.verdict, figures: r.figures.map(shownFigure), why: r.why, action: r.action };
}

/** Where a setup came from, and the gap it was computed with (the report itself does not carry it). */
export type SetupOrigin = { kind: ShownSetup['kind']; planId: number | null; plugGapM: number; name?: string };

/** One setup's report in the screen's shape. `extraMeasured` adds readings the report cannot name (a measured plug gap). */
export function shownSetup(r: SetupReport, origin: SetupOrigin, extraMeasured: readonly ShownFigure[] = []): ShownSetup {
  const counts = { pass: 0, caution: 0, fail: 0 };
  for (const rule of r.rules) counts[rule.verdict]++;
  const gapM = r.gap?.suggestedGapM ?? null;
  return {
    kind: origin.kind,
    planId: origin.planId,
    name: origin.name ?? r.label,
    verdict: r.verdict,
    counts,
    rules: r.rules.map(shownRule),
    actions: [...r.actions],
    keyPoints: {
      cranking: shownPoint(r.keyPoints.cranking),
      idle: shownPoint(r.keyPoints.idle),
      mid: shownPoint(r.keyPoints.mid),
      redline: shownPoint(r.keyPoints.redline),
    },
    belowMarginFromRpm: r.belowMarginFromRpm === null ? null : tidy(r.belowMarginFromRpm),
    worstReserveRatio: tidy(r.worstReserveRatio),
    worstReserveRpm: tidy(r.worstReserveRpm),
    plugGapMm: tidy(origin.plugGapM * 1e3, 4),
    suggestedGapMm: gapM === null || !Number.isFinite(gapM) ? null : tidy(gapM * 1e3, 4),
    measured: [...r.inputs.filter((f) => f.provenance === 'measured').map(measuredFigure), ...extraMeasured],
    setupFigures: r.figures.map(shownFigure),
    series: shownSeries(r.points),
  };
}

/** Plain names for the working conditions, as a restorer would say them. */
const conditionWords: Record<ConditionName, string> = {
  runningSupplyV: 'Supply while running',
  crankingSupplyV: 'Supply while cranking',
  harnessResistanceOhm: 'Loom resistance, switch to coil',
  ambientC: 'Air temperature',
  underBonnetC: 'Under-bonnet temperature',
  volumetricEfficiency: 'Volumetric efficiency at full load',
  ambientPressurePa: 'Air pressure',
  inletChargeC: 'Charge temperature at inlet closing',
  pointsContactResistanceOhm: 'Points contact resistance',
  secondaryCapacitanceF: 'Capacitance of coil tower, lead and plug',
  transferEfficiency: 'Coil transfer efficiency',
  arcVoltageV: 'Spark arc voltage',
  fouledShuntOhm: 'Fouled-plug leakage resistance',
  ballastThermalResistanceKPerW: 'Ballast thermal resistance',
  coilDissipationLimitW: 'Coil heat limit',
  currentLimitHoldS: 'Current-limit hold time',
  marginRatio: 'Voltage margin wanted',
  polytropicIndex: 'Compression exponent (polytropic index)',
  couplingK: 'Coil coupling between windings',
  dynamoCutInRpm: 'Engine speed where the dynamo starts charging',
  restingBatteryV: 'Battery at rest (not charging)',
  secondaryCeilingV: 'Coil secondary rating when the coil gives none',
};

/** A measured input, named in words (a condition key such as crankingSupplyV becomes "Supply while cranking"). */
function measuredFigure(f: Figure): ShownFigure {
  const words = (conditionWords as Record<string, string | undefined>)[f.name];
  return { ...shownFigure(f), name: words ?? f.name };
}

/** SI units that read badly on a bench become the units people use there. */
function displayUnit(value: number, unit: string): { value: number; unit: string } {
  switch (unit) {
    case 'F':
      return { value: value * 1e12, unit: 'pF' };
    case 'Pa':
      return { value: value / 1e3, unit: 'kPa' };
    case 's':
      return { value: value * 1e3, unit: 'ms' };
    case 'V/s':
      return { value: value / 1e9, unit: 'kV/us' };
    default:
      return { value, unit };
  }
}

export function shownConditions(c: ResolvedConditions): ShownFigure[] {
  return (Object.keys(conditionWords) as ConditionName[]).map((key) => {
    const d = displayUnit(c[key].value, conditionUnits[key]);
    return { name: conditionWords[key], value: tidy(d.value, 4), unit: d.unit, measured: c[key].provenance === 'measured', source: sourceOf(key, c) };
  });
}

/**
 * Where a condition came from. The secondary ceiling's default is the engine-level one; a setup
 * with a capacitive-discharge unit takes its own kind's default (checker/conditions.ts), which the
 * list of conditions must say rather than show 30 kV beside a CD plan as if it applied.
 */
function sourceOf(key: ConditionName, c: ResolvedConditions): string {
  const p = c[key].provenance;
  if (key !== 'secondaryCeilingV' || !p.startsWith('default')) return p;
  return `${p}; ${secondaryCeilingDefaultV('capacitive-discharge') / 1000} kV with a capacitive-discharge unit`;
}
