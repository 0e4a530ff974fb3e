/**
 * Run lengths, measurement windows and timestep limits, from the circuit's own time constants.
 * These are circuit facts (resonant periods), not results: the deck still lets ngspice find the
 * peak, only the window it looks in is set here.
 */
import type { SpiceCircuit } from './circuit.js';
import { secondaryInductanceH } from './secondary.js';
import { switchOutputCapacitanceF } from './circuit.js';

/** The switch closes a little after t = 0 so the run starts from a clean, uncharged coil. */
export const closeAtS = 10e-6;

/** Half period of the secondary ring after an inductive break: pi * sqrt(Ls * (Cs + Cp / n^2)). */
export function secondaryHalfPeriodS(c: SpiceCircuit): number {
  const ls = secondaryInductanceH(c.primary.primaryInductanceH, c.secondary.turnsRatio);
  const cp = c.primary.condenserF ?? switchOutputCapacitanceF;
  const ctot = c.secondary.secondaryCapacitanceF + cp / (c.secondary.turnsRatio * c.secondary.turnsRatio);
  return Math.PI * Math.sqrt(ls * ctot);
}

/**
 * Half period of the fast capacitive-discharge transfer: the leakage inductance 2 (1 - k) Lp
 * (primary-referred) rings with the CD capacitor in series with the reflected secondary
 * capacitance n^2 * Cs. This is what sets the CD module's fast rise.
 */
export function cdTransferHalfPeriodS(c: SpiceCircuit, couplingK: number): number {
  if (c.cd === null) throw new RangeError('No capacitive-discharge stage in this circuit.');
  const leak = 2 * (1 - couplingK) * c.primary.primaryInductanceH;
  const reflected = c.secondary.turnsRatio * c.secondary.turnsRatio * c.secondary.secondaryCapacitanceF;
  const series = (c.cd.capacitorF * reflected) / (c.cd.capacitorF + reflected);
  return Math.PI * Math.sqrt(leak * series);
}

/** The largest timestep ngspice may take: fine against the shortest time constant that matters. */
export function maxStepS(c: SpiceCircuit, scenario: 'charge' | 'break' | 'fouled' | 'cd', couplingK: number, refinement: number): number {
  const r = Math.max(refinement, 1);
  if (scenario === 'cd') return cdTransferHalfPeriodS(c, couplingK) / 200 / r;
  // Fine against both the dwell and the primary time constant L/R: the energy integral is taken
  // over the output samples, so they must follow the current's rise closely.
  const p = c.primary;
  const totalOhm = p.harnessResistanceOhm + p.ballastResistanceOhm + p.coilResistanceOhm + p.contactResistanceOhm;
  const charge = Math.min(p.dwellS / 500, p.primaryInductanceH / totalOhm / 200);
  if (scenario === 'charge') return charge / r;
  return Math.min(charge, secondaryHalfPeriodS(c) / 400) / r;
}
