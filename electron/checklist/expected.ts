/**
 * The physics behind each expected reading, kept apart from the words: Ohm's law on the primary
 * circuit the checker resolved (harness, ballast, coil, points contact), the copper law for the
 * bench reading of the coil, and the bands. Full precision throughout; the renderer rounds.
 */
import type { SheetContext } from './context.js';

/** Temperature coefficient of annealed copper at 20 degC (IACS), per kelvin. */
export const COPPER_ALPHA = 0.00393;

export interface Figures {
  expected: number;
  min: number;
  max: number;
}

/** A band of +/- `fraction` around a value (the band keeps low <= high for negative values too). */
export function band(expected: number, fraction: number): Figures {
  const a = expected * (1 - fraction);
  const b = expected * (1 + fraction);
  return { expected, min: Math.min(a, b), max: Math.max(a, b) };
}

/** A charged battery at rest, an hour off charge (state-of-charge table, common practice). */
export function restingBattery(six: boolean): Figures {
  return six ? { expected: 6.3, min: 6.2, max: 6.35 } : { expected: 12.6, min: 12.4, max: 12.7 };
}

/** Copper winding at the bench temperature: R20 (1 + 0.00393 (T - 20)). */
export function copperAt(r20: number, tempC: number): number {
  return r20 * (1 + COPPER_ALPHA * (tempC - 20));
}

/** The primary circuit with the key on, the engine stopped and the switch closed. */
export interface KeyOnCircuit {
  restV: number;
  switchV: number;
  harnessOhm: number;
  coilOhm: number;
  contactOhm: number;
  ballastColdOhm: number;
  /** The ballast once it has warmed (an iron-wire ballast rises; others stay). */
  ballastHotOhm: number;
  ironBallast: boolean;
  /** The module's current limit, when it has one. */
  limitA: number | null;
  currentColdA: number;
  currentHotA: number;
  /** Coil 15 to earth: the battery less the drop in harness and ballast. */
  coilFeedColdV: number;
  coilFeedHotV: number;
  /** Coil 1 to earth: the drop across the closed points, or the module's saturation voltage. */
  coilSwitchV: number;
  limited: boolean;
}

/** I = (V_r - V_switch) / (R_h + R_b + R_c + R_k), limited by a module's current limit. */
export function keyOnCircuit(ctx: SheetContext): KeyOnCircuit {
  const c = ctx.circuit;
  const restV = restingBattery(ctx.six).expected;
  const switchV = c.switchDropV;
  const rh = c.harnessResistanceOhm;
  const rc = c.coilResistanceColdOhm;
  const rk = c.contactResistanceOhm;
  const iron = ctx.ballast?.ballastType === 'iron-wire';
  const rbCold = ctx.ballast ? c.ballastResistanceColdOhm : 0;
  const rbHot = ctx.ballast ? (iron ? c.ballastResistanceHotOhm : rbCold) : 0;
  const limitA = ctx.module?.currentLimitA != null && ctx.module.currentLimitA > 0 ? ctx.module.currentLimitA : null;
  const current = (rb: number): number => {
    const r = rh + rb + rc + rk;
    const i = r > 0 ? Math.max(0, restV - switchV) / r : 0;
    return limitA !== null ? Math.min(i, limitA) : i;
  };
  const iCold = current(rbCold);
  const iHot = current(rbHot);
  return {
    restV,
    switchV,
    harnessOhm: rh,
    coilOhm: rc,
    contactOhm: rk,
    ballastColdOhm: rbCold,
    ballastHotOhm: rbHot,
    ironBallast: iron,
    limitA,
    currentColdA: iCold,
    currentHotA: iHot,
    coilFeedColdV: restV - iCold * (rh + rbCold),
    coilFeedHotV: restV - iHot * (rh + rbHot),
    coilSwitchV: ctx.kind === 'points' ? iCold * rk : switchV,
    limited: limitA !== null && iCold >= limitA,
  };
}

/** Coil 15 while cranking, with the switch closed: the bypass takes the ballast out of the path. */
export interface CrankingFeed {
  supplyV: number;
  resistances: number[];
  currentA: number;
  dropOhm: number;
  coilFeedV: number;
}

export function crankingFeed(ctx: SheetContext): CrankingFeed {
  const c = ctx.circuit;
  const supplyV = c.crankingSupplyV;
  const rb = ctx.ballast && !ctx.bypass ? c.ballastResistanceColdOhm : 0;
  const resistances = [c.harnessResistanceOhm, rb, c.coilResistanceColdOhm, c.contactResistanceOhm];
  const r = resistances.reduce((a, b) => a + b, 0);
  let i = r > 0 ? Math.max(0, supplyV - c.switchDropV) / r : 0;
  const limitA = ctx.module?.currentLimitA;
  if (limitA != null && limitA > 0) i = Math.min(i, limitA);
  const dropOhm = c.harnessResistanceOhm + rb;
  return { supplyV, resistances, currentA: i, dropOhm, coilFeedV: supplyV - i * dropOhm };
}

/** Dwell at idle in distributor degrees, with how it was found. */
export interface DwellFigure {
  degrees: number;
  tolerance: number;
  basis: 'points' | 'fixed-duty' | 'current-limited';
  fraction: number;
}

export function idleDwell(ctx: SheetContext): DwellFigure | null {
  const perCylinder = 360 / ctx.engine.cylinders;
  switch (ctx.kind) {
    case 'points':
    case 'transistor-points':
      return { degrees: ctx.engine.pointsDwellDeg, tolerance: 2, basis: 'points', fraction: (ctx.engine.pointsDwellDeg * ctx.engine.cylinders) / 360 };
    case 'breakerless-fixed-duty': {
      const f = ctx.module?.fixedDutyFraction ?? 0.5;
      return { degrees: f * perCylinder, tolerance: 2, basis: 'fixed-duty', fraction: f };
    }
    case 'breakerless-current-limited': {
      const idle = ctx.report.keyPoints.idle;
      const raw = idle.periodS > 0 ? idle.dwellTimeS / idle.periodS : 0;
      const cap = ctx.module?.maxDutyFraction ?? 1;
      const f = Math.min(raw, cap);
      const deg = f * perCylinder;
      return { degrees: deg, tolerance: Math.max(2, 0.15 * deg), basis: 'current-limited', fraction: f };
    }
    default:
      return null;
  }
}

/** The advance-curve row the timing check uses: the one nearest 3000 rpm (the lower on a tie). */
export function advanceCheckRow(ctx: SheetContext): { rpm: number; advanceDeg: number } | null {
  let best: { rpm: number; advanceDeg: number } | null = null;
  for (const r of ctx.engine.advanceCurve) {
    if (!Number.isFinite(r.rpm) || !Number.isFinite(r.advanceDeg)) continue;
    if (!best || Math.abs(r.rpm - 3000) < Math.abs(best.rpm - 3000)) best = r;
  }
  return best;
}

/** The charging supply at fast idle: the usual regulated range, widened to hold the checker's figure. */
export function runningSupply(ctx: SheetContext): Figures {
  const v = ctx.circuit.runningSupplyV;
  const [lo, hi] = ctx.six ? [6.8, 7.6] : ctx.input.about.charging === 'dynamo' ? [13.0, 14.5] : [13.5, 14.5];
  return { expected: v, min: v < lo ? v * 0.97 : lo, max: v > hi ? v * 1.03 : hi };
}
