/** Plain words for the part kinds and for each kind's choices, as a restorer would say them. */
import type { Ballast, IgnitionModule, Leads, PartKind, Tach } from '../../../db/schema.js';

type KindWords = { one: string; many: string; add: string; a: string };

export const kindWords: Record<PartKind, KindWords> = {
  coil: { one: 'Coil', many: 'Coils', add: 'Add a coil', a: 'a coil' },
  ballast: { one: 'Ballast resistor', many: 'Ballast resistors', add: 'Add a ballast resistor', a: 'a ballast resistor' },
  module: { one: 'Ignition module', many: 'Ignition modules', add: 'Add a module', a: 'an ignition module' },
  tach: { one: 'Rev counter', many: 'Rev counters', add: 'Add a rev counter', a: 'a rev counter' },
  leads: { one: 'HT leads', many: 'HT leads', add: 'Add a set of HT leads', a: 'a set of HT leads' },
  plug: { one: 'Spark plug', many: 'Spark plugs', add: 'Add a spark plug', a: 'a spark plug' },
};

export const kindChoices = (['coil', 'ballast', 'module', 'tach', 'leads', 'plug'] as const).map((k) => ({ value: k, label: kindWords[k].one }));

export const ballastTypeChoices: readonly { value: Ballast['ballastType']; label: string }[] = [
  { value: 'iron-wire', label: 'Iron wire' },
  { value: 'ceramic', label: 'Ceramic block' },
  { value: 'harness-wire', label: 'Resistive loom wire' },
];
export const ballastTypeWords: Record<Ballast['ballastType'], string> = { 'iron-wire': 'Iron wire', ceramic: 'Ceramic block', 'harness-wire': 'Resistive loom wire' };

export const moduleTypeChoices: readonly { value: IgnitionModule['moduleType']; label: string }[] = [
  { value: 'transistor-points', label: 'Transistor unit on points' },
  { value: 'breakerless-fixed-duty', label: 'Breakerless, fixed duty' },
  { value: 'breakerless-current-limited', label: 'Breakerless, current-limited' },
  { value: 'capacitive-discharge', label: 'Capacitive discharge (CD)' },
];
export const moduleTypeWords: Record<IgnitionModule['moduleType'], string> = {
  'transistor-points': 'Transistor unit on points',
  'breakerless-fixed-duty': 'Breakerless, fixed duty',
  'breakerless-current-limited': 'Breakerless, current-limited',
  'capacitive-discharge': 'Capacitive discharge',
};

export const sensesChoices: readonly { value: Tach['senses']; label: string }[] = [
  { value: 'coil-supply-current', label: 'Current in the coil feed' },
  { value: 'coil-negative-pulses', label: 'Pulses at coil negative' },
  { value: 'module-output', label: 'A module’s tach output' },
  { value: 'cable', label: 'A drive cable' },
];
export const sensesWords: Record<Tach['senses'], string> = {
  'coil-supply-current': 'Current in the coil feed',
  'coil-negative-pulses': 'Pulses at coil negative',
  'module-output': 'Module tach output',
  cable: 'Drive cable, not electrical',
};

export const coreChoices: readonly { value: Leads['core']; label: string }[] = [
  { value: 'copper', label: 'Copper (unsuppressed)' },
  { value: 'carbon', label: 'Carbon string' },
  { value: 'spiral', label: 'Spiral wound' },
];
export const coreWords: Record<Leads['core'], string> = { copper: 'Copper', carbon: 'Carbon string', spiral: 'Spiral wound' };

export const ratedVoltageChoices = [
  { value: '12', label: '12 V' },
  { value: '6', label: '6 V' },
] as const;

export const earthListWords = (e: readonly string[]): string =>
  e.includes('negative') && e.includes('positive') ? 'Either earth' : e.includes('positive') ? 'Positive earth only' : 'Negative earth only';
