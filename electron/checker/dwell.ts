/**
 * Firing period and dwell time. The coil can only charge while the switch is closed, so at high rpm
 * a fixed dwell angle leaves less and less time: that is why points energy falls with speed.
 */
import type { EngineCycle } from './types.js';

/**
 * Sparks per second: rpm x cylinders / 120 for a four-stroke (each cylinder fires once every two
 * revolutions), / 60 for a two-stroke.
 */
export function sparkRateHz(rpm: number, cylinders: number, cycle: EngineCycle): number {
  return (rpm * cylinders) / (cycle === 'two-stroke' ? 60 : 120);
}

/** Dwell fraction from a dwell angle in distributor degrees: dwellDeg x cylinders / 360. */
export function dwellFractionFromAngle(dwellDeg: number, cylinders: number): number {
  return Math.min(0.98, Math.max(0, (dwellDeg * cylinders) / 360));
}

/**
 * Points float: above the float rpm the follower no longer tracks the cam and the contacts close
 * late. The spring force needed to follow the cam grows with rpm^2, so we shrink the effective
 * dwell by (floatRpm / rpm)^2 above it (our model; no published law was found for this).
 */
export function floatedDwellFraction(fraction: number, rpm: number, floatRpm: number | null): number {
  if (floatRpm === null || !(rpm > floatRpm) || !(floatRpm > 0)) return fraction;
  const k = floatRpm / rpm;
  return fraction * k * k;
}

/**
 * Current-limited module dwell: the time to reach the limit plus a short hold, capped at the module's
 * maximum duty of the period. When the limit is never reached the cap applies.
 */
export function currentLimitedDwellS(timeToLimitS: number, holdS: number, periodS: number, maxDutyFraction: number): number {
  const cap = maxDutyFraction * periodS;
  if (!Number.isFinite(timeToLimitS)) return cap;
  return Math.min(cap, timeToLimitS + holdS);
}
