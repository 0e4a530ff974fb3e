/**
 * Which dwell law a setup follows, and the dwell time it gives at one rpm. Shared by the ballast
 * heating solution and the rpm sweep so both see the same charging.
 */
import { timeToReachS } from './charge.js';
import { currentLimitedDwellS, floatedDwellFraction } from './dwell.js';

export enum DwellMode {
  /** Points or transistor-assisted points: the cam sets a dwell angle. */
  Cam = 0,
  FixedDuty = 1,
  CurrentLimited = 2,
  /** Capacitive discharge: the coil is not charged by current. */
  Cd = 3,
  /** Magneto: the break current comes from the armature, not from a charging time. */
  Magneto = 4,
}

export interface DwellParams {
  mode: DwellMode;
  camFraction: number;
  floatRpm: number | null;
  fixedDuty: number;
  maxDuty: number;
  holdS: number;
  limitA: number;
}

export function dwellTimeS(p: DwellParams, periodS: number, rpm: number, finalA: number, tauS: number): number {
  return dwellGivenLimitTimeS(p, periodS, rpm, p.mode === DwellMode.CurrentLimited ? timeToReachS(finalA, tauS, p.limitA) : Infinity);
}

/**
 * The same with the time to reach the current limit already known. For one supply case that time
 * is the same at every rpm (the RL rise does not depend on speed), so the sweep works it out once.
 */
export function dwellGivenLimitTimeS(p: DwellParams, periodS: number, rpm: number, timeToLimitS: number): number {
  switch (p.mode) {
    case DwellMode.Cam:
    case DwellMode.Magneto:
      return floatedDwellFraction(p.camFraction, rpm, p.floatRpm) * periodS;
    case DwellMode.FixedDuty:
      return p.fixedDuty * periodS;
    case DwellMode.CurrentLimited:
      return currentLimitedDwellS(timeToLimitS, p.holdS, periodS, p.maxDuty);
    default:
      return 0;
  }
}
