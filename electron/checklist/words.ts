/**
 * Names of terminals and parts in the sheet's words: DIN 72552 numbers where the standard has one
 * (30, 31, 15, 15a, 1, 4, 50), with plain words beside them; the module's own terminals in words
 * only. Also the short number formats the "how" sentences use (the model keeps full precision).
 */
import type { SwitchingKind, TachSenses } from '../checker/types.js';

/** Terminal names; the battery's two depend on which side is earthed. */
export interface TerminalWords {
  t30: string;
  t31: string;
  t15: string;
  t15a: string;
  coil15: string;
  coil1: string;
  coil4: string;
  t50: string;
  bypass: string;
  moduleSupply: string;
  moduleEarth: string;
  moduleTrigger: string;
  moduleOutput: string;
  moduleTach: string;
  points: string;
  pickup: string;
  tachWire: string;
  capCentre: string;
}

export function terminalWords(positiveEarth: boolean): TerminalWords {
  return {
    t30: positiveEarth ? '30 (battery negative, the live side on this car)' : '30 (battery positive, direct)',
    t31: positiveEarth ? '31 (earth; battery positive on this car)' : '31 (earth; battery negative)',
    t15: '15 (switched supply from the ignition switch)',
    t15a: '15a (ballast output, coil side)',
    coil15: '15 (coil supply side)',
    coil1: '1 (coil switch side)',
    coil4: '4 (coil high tension, centre tower)',
    t50: '50 (starter control)',
    bypass: "starter solenoid's ignition bypass terminal (live only while cranking)",
    moduleSupply: 'module supply',
    moduleEarth: 'module earth',
    moduleTrigger: 'module trigger input',
    moduleOutput: 'module output',
    moduleTach: 'module tach output',
    points: 'points terminal (low-tension lead in the distributor)',
    pickup: 'pickup wires',
    tachWire: 'tach wire',
    capCentre: 'distributor cap centre',
  };
}

/** The sentence every positive-earth step and note carries. */
export const POSITIVE_EARTH_SENTENCE = 'On this car 31 (earth) is battery positive: it is positive earth.';

/** The kind of switching in a few words. */
export function switchingWords(kind: SwitchingKind): string {
  switch (kind) {
    case 'points':
      return 'Points';
    case 'magneto':
      return 'Magneto';
    case 'transistor-points':
      return 'Transistor switch triggered by the points';
    case 'breakerless-fixed-duty':
      return 'Fixed-duty breakerless module';
    case 'breakerless-current-limited':
      return 'Current-limited breakerless module';
    case 'capacitive-discharge':
      return 'Capacitive-discharge module';
  }
}

export function tachSensesWords(s: TachSenses): string {
  switch (s) {
    case 'coil-supply-current':
      return 'senses the current in the coil feed';
    case 'coil-negative-pulses':
      return 'counts pulses at coil 1';
    case 'module-output':
      return "reads a module's tach output";
    case 'cable':
      return 'cable-driven, no wiring';
  }
}

/** A number with fixed decimals for a sentence ("12.60"); never "-0.00". */
export function num(x: number, digits = 2): string {
  const s = x.toFixed(digits);
  return /^-0\.?0*$/.test(s) ? s.slice(1) : s;
}

/** A resistance sum in words: "(0.10 + 0.80 + 1.56 + 0.10) ohm", zero terms left out. */
export function ohmSum(terms: readonly number[]): string {
  const shown = terms.filter((t) => t !== 0);
  return `(${(shown.length ? shown : [0]).map((t) => num(t)).join(' + ')}) ohm`;
}

/** Meter probes for a voltage from a terminal to earth, the red probe on the more positive side. */
export function probesToEarth(terminal: string, positiveEarth: boolean): string {
  return positiveEarth
    ? `Red probe on 31 (a clean earth; battery positive on this car), black probe on ${terminal}; read the size of the voltage.`
    : `Red probe on ${terminal}, black probe on 31 (a clean earth).`;
}

/** Meter probes across the battery posts. */
export function batteryProbes(positiveEarth: boolean): string {
  return positiveEarth
    ? 'Red probe on the battery post of 31 (earth; battery positive on this car), black probe on the post of 30.'
    : 'Red probe on the battery post of 30 (positive), black probe on the post of 31 (earth).';
}

/** Where a condition came from, in words for a "how" sentence. */
export function provenanceWords(p: string): string {
  switch (p) {
    case 'default (workshop documentation)':
      return 'the default from workshop manuals';
    case 'default (from memory)':
      return 'a default, from memory';
    case 'default (common practice)':
      return 'a default, common practice';
    case 'default (standard value)':
      return 'a standard value';
    case 'engine override':
      return "this engine's own figure";
    case 'measured':
      return 'measured on this car';
    default:
      return p;
  }
}
