/**
 * The demo's conversion plans, with the readings a restorer took while doing the first one.
 * Readings are typical bench figures (a healthy battery rests near 12.6 V and stays above 9.6 V
 * cranking, common practice), not measurements of any real car.
 */
import type { PlanInput, ReadingInput } from '../schema.js';

export type DemoPlan = Omit<PlanInput, 'engineId' | 'moduleId' | 'coilId' | 'ballastId' | 'tachId' | 'leadsId' | 'plugId'> & {
  engine: string;
  module: string | null;
  coil: string | null;
  ballast: string | null;
  tach: string | null;
  leads: string | null;
  plug: string | null;
  readings: Omit<ReadingInput, 'planId'>[];
};

export const demoPlans: readonly DemoPlan[] = [
  {
    engine: 'Green four-door saloon',
    name: 'Current-limited unit, full-voltage coil, ballast removed',
    notes: 'Module fed from switched 15, never from after the ballast. Ballast and bypass wire taken out.',
    status: 'wired',
    module: 'Breakerless unit, current-limited',
    coil: 'Canister coil, 3.0 ohm, full 12 V',
    ballast: null,
    crankingBypass: false,
    moduleFeed: 'switched-15',
    tach: 'Pulse tachometer on coil negative',
    leads: 'Carbon-core suppression leads',
    plug: '14 mm plug, 5 kohm resistor',
    plugGapMm: 0.8,
    readings: [
      { quantity: 'coil-primary-resistance', value: 3.1, unit: 'ohm', takenOn: '2024-03-09', note: 'Cold, on the bench, leads nulled.' },
      { quantity: 'battery-voltage-resting', value: 12.6, unit: 'V', takenOn: '2024-03-09', note: 'After standing overnight.' },
      { quantity: 'supply-voltage-cranking', value: 10.1, unit: 'V', takenOn: '2024-03-10', note: 'At the module supply terminal.' },
      { quantity: 'coil-voltage-after-shut-off', value: 12.3, unit: 'V', takenOn: '2024-03-10', note: 'Engine stopped; coil 1 to earth after the module shut the coil off.' },
    ],
  },
  {
    engine: 'White eight-cylinder coupe',
    name: 'Capacitive discharge, keep the resistive feed for now',
    notes: 'First idea; the tachometer question is still open.',
    status: 'draft',
    module: 'Capacitive-discharge unit, 1 uF at 400 V, multi-spark',
    coil: 'Canister coil, 1.5 ohm, for use with ballast',
    ballast: 'Resistive feed wire in the loom, 1.4 ohm',
    crankingBypass: true,
    moduleFeed: 'switched-15',
    tach: 'Current-sensing tachometer (coil feed loops through it)',
    leads: 'Carbon-core suppression leads',
    plug: '14 mm plug, 5 kohm resistor',
    plugGapMm: 0.89,
    readings: [],
  },
  {
    engine: 'Red flat-twin light car',
    name: 'Six-volt breakerless unit on the original coil',
    notes: 'Keeps the 6 V coil; checks the module still fires at cranking voltage.',
    status: 'checked',
    module: 'Six-volt breakerless unit, current-limited',
    coil: 'Six-volt canister coil, 1.4 ohm',
    ballast: null,
    crankingBypass: false,
    moduleFeed: 'switched-15',
    tach: null,
    leads: 'Spiral-wound suppression leads',
    plug: '18 mm plug, non-resistor',
    plugGapMm: 0.6,
    readings: [{ quantity: 'battery-voltage-resting', value: 6.3, unit: 'V', takenOn: '2024-04-02', note: '' }],
  },
  {
    engine: 'Blue six-cylinder tourer',
    name: 'Fixed-duty breakerless unit on the plain coil',
    notes: 'Found in the parts bin; check whether it will run on positive earth before fitting.',
    status: 'draft',
    module: 'Breakerless unit, fixed duty, negative earth only',
    coil: 'Canister coil, 3.0 ohm, full 12 V',
    ballast: null,
    crankingBypass: false,
    moduleFeed: 'switched-15',
    tach: 'Cable-driven tachometer',
    leads: 'Spiral-wound suppression leads',
    plug: '14 mm plug, 5 kohm resistor',
    plugGapMm: 0.7,
    readings: [],
  },
];
