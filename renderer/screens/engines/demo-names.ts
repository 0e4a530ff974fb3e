/**
 * The demo workshop's record names (db/demo), so the first-run path can leave the demo out of
 * "yours". The renderer may not import db/demo (test/e2e/renderer-boundary.test.ts), so the names
 * are written out here; test/renderer/first-steps.test.ts fails if they drift from db/demo.
 */
export const demoEngineNames: readonly string[] = [
  'Green four-door saloon',
  'Blue six-cylinder tourer',
  'Red flat-twin light car',
  'White eight-cylinder coupe',
];

/** [kind, name] of each demo part. */
export const demoPartNames: readonly (readonly [string, string])[] = [
  ['coil', 'Canister coil, 1.5 ohm, for use with ballast'],
  ['coil', 'Canister coil, 3.0 ohm, full 12 V'],
  ['coil', 'Sports canister coil, 3.3 ohm'],
  ['coil', 'Low-resistance performance coil, 0.7 ohm'],
  ['coil', 'Six-volt canister coil, 1.4 ohm'],
  ['ballast', 'Iron-wire ballast, 1.5 ohm'],
  ['ballast', 'Ceramic ballast block, 1.6 ohm'],
  ['ballast', 'Resistive feed wire in the loom, 1.4 ohm'],
  ['ballast', 'Ceramic ballast block, 0.8 ohm'],
  ['module', 'Points-triggered transistor unit'],
  ['module', 'Breakerless unit, fixed duty, negative earth only'],
  ['module', 'Breakerless unit, current-limited'],
  ['module', 'Six-volt breakerless unit, current-limited'],
  ['module', 'Capacitive-discharge unit, 1 uF at 400 V, multi-spark'],
  ['module', 'Capacitive-discharge unit, 0.8 uF at 350 V, single spark'],
  ['tach', 'Current-sensing tachometer (coil feed loops through it)'],
  ['tach', 'Pulse tachometer on coil negative'],
  ['tach', 'Tachometer for a module tach output'],
  ['tach', 'Cable-driven tachometer'],
  ['leads', 'Copper-core HT leads'],
  ['leads', 'Carbon-core suppression leads'],
  ['leads', 'Spiral-wound suppression leads'],
  ['plug', '14 mm plug, non-resistor'],
  ['plug', '14 mm plug, 5 kohm resistor'],
  ['plug', '18 mm plug, non-resistor'],
];

export const demoPlanNames: readonly string[] = [
  'Current-limited unit, full-voltage coil, ballast removed',
  'Capacitive discharge, keep the resistive feed for now',
  'Six-volt breakerless unit on the original coil',
  'Fixed-duty breakerless unit on the plain coil',
];
