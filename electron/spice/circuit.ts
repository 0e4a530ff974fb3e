/**
 * The circuit the exporter draws: one ignition setup at one operating point, fully resolved
 * (temperatures, ballast self-heating, dwell and supply already worked out by the checker).
 * All values are SI and carry their unit in the name. The exporter adds no physics of its own
 * beyond the circuit itself; ngspice then solves that circuit independently of the checker's
 * closed forms, which is what makes it a useful outside reference.
 */
import { DEFAULT_COUPLING_K } from '../checker/index.js';

/** How the coil's primary is fed and switched while charging. */
export interface PrimarySide {
  /** Voltage at the battery terminals at this operating point (charging, or cranking), V. */
  supplyV: number;
  /** Feed wiring and ignition switch, lumped, ohm. */
  harnessResistanceOhm: number;
  /** Ballast at its working temperature; 0 when there is none or it is bypassed, ohm. */
  ballastResistanceOhm: number;
  /** Primary winding at its working temperature, ohm. */
  coilResistanceOhm: number;
  /** Primary inductance, H. */
  primaryInductanceH: number;
  /** Points contacts, or the module's on-resistance, ohm. */
  contactResistanceOhm: number;
  /** Saturation voltage of a transistor switch; 0 for points, V. */
  switchDropV: number;
  /** Module current limit, A; null when the switch does not limit. */
  currentLimitA: number | null;
  /** How long the switch is closed before the break, s (unused by the capacitive-discharge deck). */
  dwellS: number;
  /** Condenser across the switch, F; null when there is none (most modules). */
  condenserF: number | null;
  /** Zener-type clamp of a module's switch, V; null when there is none (points). */
  primaryClampV: number | null;
}

/** The coil's secondary and what hangs on it before the plug fires. */
export interface SecondarySide {
  /** Secondary-to-primary turns ratio n; L2 = n^2 * Lp. */
  turnsRatio: number;
  /** Coil, lead and plug capacitance lumped at the coil tower, F. */
  secondaryCapacitanceF: number;
  /** Secondary winding resistance, ohm (in series with L2 inside the coil). */
  secondaryResistanceOhm: number;
}

/** A capacitive-discharge stage at this operating point (charge voltage already rpm-limited). */
export interface CdStage {
  capacitorF: number;
  chargeVoltageV: number;
}

export interface SpiceCircuit {
  /** What the deck is of, for its title line: engine, setup and rpm in plain words. */
  title: string;
  primary: PrimarySide;
  secondary: SecondarySide;
  cd: CdStage | null;
  /**
   * Coupling of the coil windings as the checker resolved it for this engine (the `couplingK`
   * working condition); absent: `defaultCouplingK`. A deck option `couplingK` overrides it.
   */
  couplingK?: number;
}

export type Scenario = 'charge' | 'break' | 'fouled' | 'cd';

export interface DeckOptions {
  /** Magnetic coupling between primary and secondary (0 < k < 1). */
  couplingK?: number;
  /** Fouled-plug shunt across the secondary, ohm (scenario 'fouled'). */
  fouledShuntOhm?: number;
  /** Divide the maximum timestep by this (1 = the default); tests use it to show convergence. */
  timestepRefinement?: number;
}

/**
 * Coupling of a closed-iron ignition coil: the checker's labelled default (`DEFAULT_COUPLING_K`,
 * 0.995, from memory: oil-filled canister coils are usually quoted at 0.98 to 0.999), so the deck
 * and the checker's capacitive-discharge closed form use one value. The inductive closed forms
 * assume an ideal transformer (k = 1), which a SPICE K element cannot be (the inductance matrix
 * becomes singular). k = 0.995 leaves 1 - k^2 = 1 % of the primary energy in leakage: close enough
 * to ideal that the first inductive secondary peak moves by well under 1 % between k = 0.995 and
 * k = 0.999, yet a real, non-zero leakage inductance 2 (1 - k) Lp that sets the capacitive-discharge
 * transfer (its rise and, with the loop resistance, its damping).
 */
export const defaultCouplingK: number = DEFAULT_COUPLING_K.value;

/** Fouled-plug shunt when none is given: carbon tracking of a few hundred kilohm (from memory). */
export const defaultFouledShuntOhm = 500e3;

/**
 * Output capacitance of a module's switching transistor, used only when there is no condenser:
 * without some primary capacitance the leakage flux would have nowhere to go at the break. At
 * 1 nF (from memory: IGBT output capacitance is of order 0.1 to 1 nF) it reflects into the
 * secondary as 1 nF / n^2, about 0.1 pF, which changes the secondary peak negligibly.
 */
export const switchOutputCapacitanceF = 1e-9;

/** Check the circuit before writing it: every value finite and physically possible. */
export function circuitProblems(c: SpiceCircuit, scenario: Scenario): string[] {
  const out: string[] = [];
  const need = (path: string, v: number, min: number, strict: boolean): void => {
    if (!Number.isFinite(v)) out.push(`${path}: must be a finite number.`);
    else if (strict ? !(v > min) : !(v >= min)) out.push(`${path}: must be ${strict ? 'more than' : 'at least'} ${min}.`);
  };
  const p = c.primary;
  need('primary.supplyV', p.supplyV, 0, true);
  need('primary.harnessResistanceOhm', p.harnessResistanceOhm, 0, false);
  need('primary.ballastResistanceOhm', p.ballastResistanceOhm, 0, false);
  need('primary.coilResistanceOhm', p.coilResistanceOhm, 0, true);
  need('primary.primaryInductanceH', p.primaryInductanceH, 0, true);
  need('primary.contactResistanceOhm', p.contactResistanceOhm, 0, false);
  need('primary.switchDropV', p.switchDropV, 0, false);
  if (scenario !== 'cd') need('primary.dwellS', p.dwellS, 0, true);
  if (p.currentLimitA !== null) need('primary.currentLimitA', p.currentLimitA, 0, true);
  if (p.condenserF !== null) need('primary.condenserF', p.condenserF, 0, true);
  if (p.primaryClampV !== null) need('primary.primaryClampV', p.primaryClampV, 0, true);
  if (p.switchDropV >= p.supplyV) out.push('primary.switchDropV: the switch drop must be below the supply.');
  const s = c.secondary;
  need('secondary.turnsRatio', s.turnsRatio, 1, true);
  need('secondary.secondaryCapacitanceF', s.secondaryCapacitanceF, 0, true);
  need('secondary.secondaryResistanceOhm', s.secondaryResistanceOhm, 0, false);
  if (scenario === 'cd') {
    if (c.cd === null) out.push('cd: a capacitive-discharge deck needs the capacitor and its charge voltage.');
    else {
      need('cd.capacitorF', c.cd.capacitorF, 0, true);
      need('cd.chargeVoltageV', c.cd.chargeVoltageV, 0, true);
    }
  }
  return out;
}
