/**
 * The checker's figures that ngspice can reproduce, at one sweep point. ngspice simulates the
 * circuit without the checker's transfer efficiency (a labelled allowance for the core losses
 * neither side draws), so the secondary peaks compared are the checker's before the efficiency:
 * its peak divided by the efficiency (the test's own 0.8, below), and never above the clamp (n x V_clamp), which is a hard
 * physical limit in both. For an inductive coil that is the lossless peak; for a CD firing it
 * already carries the damping of the transfer loop (winding resistance and leakage, cd.ts), which
 * ngspice draws too. The names keep "lossless" for "without the efficiency".
 */
import type { OperatingPoint, SetupReport } from '../../electron/checker/index.js';

export interface CheckerFigures {
  currentAtBreakA: number;
  storedEnergyJ: number;
  losslessPeakV: number;
  losslessFouledPeakV: number;
}

/**
 * The checker's coil transfer efficiency, held here as its own copy rather than read from the
 * report (dividing by the report's own figure would let a wrong efficiency cancel out): 0.8, the
 * labelled default of the `transferEfficiency` condition in electron/checker/conditions.ts,
 * "default (from memory)", an allowance for the core's eddy-current and hysteresis losses that
 * neither the closed forms nor the decks draw (design notes, checker-models.md section 6: "a coil
 * property; default from memory, labelled"). No published source: from memory. No demo engine
 * overrides it.
 */
export const TRANSFER_EFFICIENCY = 0.8;

export function checkerFigures(report: SetupReport, p: OperatingPoint): CheckerFigures {
  const c = report.circuit;
  const cap = c.primaryClampV !== null ? c.turnsRatio * c.primaryClampV : Infinity;
  const eta = TRANSFER_EFFICIENCY;
  const lossless = (v: number): number => (v >= cap ? cap : Math.min(v / eta, cap));
  return {
    currentAtBreakA: p.currentAtBreakA,
    storedEnergyJ: p.storedEnergyJ,
    // Before the coil's secondary ceiling (its insulation rating, which ngspice does not draw).
    losslessPeakV: lossless(p.availableBeforeCeilingV),
    losslessFouledPeakV: lossless(p.fouledPeakV),
  };
}

/** Three running-supply sweep points: idle, the middle of the range, and the top of the sweep. */
export function threeRunningPoints(report: SetupReport): OperatingPoint[] {
  const running = report.points.filter((p) => p.supplyCase === 'running');
  const idle = report.keyPoints.idle;
  const nearIdle = running.reduce((b, p) => (Math.abs(p.rpm - idle.rpm) < Math.abs(b.rpm - idle.rpm) ? p : b), running[0]!);
  return [nearIdle, running[Math.floor(running.length / 2)]!, running[running.length - 1]!];
}

export const ratio = (simulated: number, checker: number): number => Math.abs(simulated) / Math.abs(checker);
