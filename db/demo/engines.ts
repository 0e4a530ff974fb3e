/**
 * The demo workshop's engines: four invented cars, each chosen for a case the checker must get
 * right. Dimensions, dwell, gaps, timing and advance curves are typical of their class, not taken
 * from any real engine: four-cylinder dwell about 60 degrees, six about 38, eight about 30, points
 * gaps 0.38 to 0.45 mm, static timing a few degrees BTDC, advance curves that add 20 to 30 crank
 * degrees by about 4000 rpm (common practice; the exact figures here are from memory).
 */
import type { EngineInput, ExistingSetup } from '../schema.js';

export const DEMO_WORKSHOP_NAME = "Sparrowgate Restoration Shed";

/** The existing setup as the demo writes it: parts named by their demo name, resolved to ids on load. */
export type DemoExisting = Omit<ExistingSetup, 'coilPartId' | 'ballastPartId' | 'tachPartId' | 'leadsPartId' | 'plugPartId'> & {
  coilPart: string | null;
  ballastPart: string | null;
  tachPart: string | null;
  leadsPart: string | null;
  plugPart: string | null;
};
export type DemoEngine = Omit<EngineInput, 'existing'> & { existing: DemoExisting };

export const demoEngines: readonly DemoEngine[] = [
  {
    // The classic ballast case: a 1.5 ohm coil behind a 1.5 ohm iron-wire ballast, with a feed from
    // the starter solenoid that bypasses the ballast while cranking (so the coil sees nearly the
    // whole, sagging, battery voltage when it is needed most).
    name: 'Green four-door saloon',
    notes: `Customer car at ${DEMO_WORKSHOP_NAME}. Ballasted coil with cranking bypass from the starter solenoid. Owner wants electronic ignition before a long tour.`,
    yearText: 'about 1968',
    modelText: 'four-door saloon, 1.6 litre four',
    cylinders: 4,
    cycle: 'four-stroke',
    firingOrder: '1-3-4-2',
    boreMm: 81.0,
    strokeMm: 77.6,
    conRodMm: 130.0,
    compressionRatio: 8.8,
    idleRpm: 750,
    crankingRpm: 180,
    redlineRpm: 6000,
    systemVoltageV: 12,
    earthPolarity: 'negative',
    charging: 'alternator',
    pointsDwellDeg: 60,
    pointsGapMm: 0.38,
    pointsFloatRpm: 6500,
    staticTimingDegBtdc: 8,
    advanceCurve: [
      { rpm: 800, advanceDeg: 0 },
      { rpm: 1200, advanceDeg: 6 },
      { rpm: 2000, advanceDeg: 12 },
      { rpm: 3000, advanceDeg: 18 },
      { rpm: 4500, advanceDeg: 24 },
    ],
    existing: {
      trigger: 'points',
      coilPart: 'Canister coil, 1.5 ohm, for use with ballast',
      ballast: 'discrete',
      ballastPart: 'Iron-wire ballast, 1.5 ohm',
      crankingBypass: true,
      condenserUf: 0.22,
      tachPart: 'Pulse tachometer on coil negative',
      leadsPart: 'Carbon-core suppression leads',
      plugPart: '14 mm plug, non-resistor',
      plugGapMm: 0.64,
    },
    conditions: {},
  },
  {
    // Positive earth: the coil's + terminal goes to the contact breaker side and many modules
    // will not work at all. The dynamo charges lower than an alternator.
    name: 'Blue six-cylinder tourer',
    notes: `Customer car at ${DEMO_WORKSHOP_NAME}. Still positive earth with its dynamo; the owner will not convert it to negative earth.`,
    yearText: 'about 1957',
    modelText: 'two-door tourer, 2.6 litre six',
    cylinders: 6,
    cycle: 'four-stroke',
    firingOrder: '1-5-3-6-2-4',
    boreMm: 73.0,
    strokeMm: 104.0,
    conRodMm: 175.0,
    compressionRatio: 7.8,
    idleRpm: 600,
    crankingRpm: 150,
    redlineRpm: 5000,
    systemVoltageV: 12,
    earthPolarity: 'positive',
    charging: 'dynamo',
    pointsDwellDeg: 38,
    pointsGapMm: 0.4,
    staticTimingDegBtdc: 6,
    advanceCurve: [
      { rpm: 600, advanceDeg: 0 },
      { rpm: 1000, advanceDeg: 4 },
      { rpm: 1800, advanceDeg: 12 },
      { rpm: 2800, advanceDeg: 18 },
      { rpm: 4000, advanceDeg: 22 },
    ],
    existing: {
      trigger: 'points',
      coilPart: 'Canister coil, 3.0 ohm, full 12 V',
      ballast: 'none',
      ballastPart: null,
      crankingBypass: false,
      condenserUf: 0.2,
      tachPart: 'Cable-driven tachometer',
      leadsPart: 'Copper-core HT leads',
      plugPart: '14 mm plug, non-resistor',
      plugGapMm: 0.6,
    },
    // Dynamo output sags at idle and the old loom has a measured drop (from the owner's meter).
    conditions: { runningSupplyV: 13.5, harnessResistanceOhm: 0.15 },
  },
  {
    // Six volts: half the supply for the same coil current means a low-resistance coil, and a
    // cranking battery near 4.5 V, below many 12 V modules' minimum.
    name: 'Red flat-twin light car',
    notes: `Customer car at ${DEMO_WORKSHOP_NAME}. Air-cooled horizontally opposed twin, 6 V throughout.`,
    yearText: 'about 1955',
    modelText: 'two-seat light car, 0.6 litre flat twin',
    cylinders: 2,
    cycle: 'four-stroke',
    firingOrder: '1-2',
    boreMm: 74.0,
    strokeMm: 70.0,
    conRodMm: 125.0,
    compressionRatio: 7.0,
    idleRpm: 800,
    crankingRpm: 120,
    redlineRpm: 5000,
    systemVoltageV: 6,
    earthPolarity: 'positive',
    charging: 'dynamo',
    // Two-lobe cam: each firing period is 180 distributor degrees; about 58 % of it closed (from memory).
    pointsDwellDeg: 105,
    pointsGapMm: 0.45,
    staticTimingDegBtdc: 5,
    advanceCurve: [
      { rpm: 900, advanceDeg: 0 },
      { rpm: 1500, advanceDeg: 8 },
      { rpm: 2500, advanceDeg: 16 },
      { rpm: 3500, advanceDeg: 22 },
    ],
    existing: {
      trigger: 'points',
      coilPart: 'Six-volt canister coil, 1.4 ohm',
      ballast: 'none',
      ballastPart: null,
      crankingBypass: false,
      condenserUf: 0.25,
      tachPart: null,
      leadsPart: 'Copper-core HT leads',
      plugPart: '18 mm plug, non-resistor',
      plugGapMm: 0.55,
    },
    conditions: { crankingSupplyV: 4.6, ambientC: 8 },
  },
  {
    // A tach that senses coil-supply current reads a points or inductive ignition but usually not
    // a capacitive-discharge one (common practice): the trap waiting for a CD conversion.
    name: 'White eight-cylinder coupe',
    notes: `Customer car at ${DEMO_WORKSHOP_NAME}. Its tachometer has the coil feed looped through the back of the instrument.`,
    yearText: 'about 1966',
    modelText: 'two-door coupe, 4.7 litre V8',
    cylinders: 8,
    cycle: 'four-stroke',
    firingOrder: '1-5-4-2-6-3-7-8',
    boreMm: 101.6,
    strokeMm: 72.9,
    conRodMm: 130.0,
    compressionRatio: 9.5,
    idleRpm: 650,
    crankingRpm: 160,
    redlineRpm: 6000,
    systemVoltageV: 12,
    earthPolarity: 'negative',
    charging: 'alternator',
    pointsDwellDeg: 30,
    pointsGapMm: 0.43,
    pointsFloatRpm: 5500,
    staticTimingDegBtdc: 6,
    advanceCurve: [
      { rpm: 700, advanceDeg: 0 },
      { rpm: 1100, advanceDeg: 4 },
      { rpm: 1600, advanceDeg: 10 },
      { rpm: 2400, advanceDeg: 16 },
      { rpm: 3200, advanceDeg: 20 },
      { rpm: 4200, advanceDeg: 24 },
    ],
    existing: {
      trigger: 'points',
      coilPart: 'Canister coil, 1.5 ohm, for use with ballast',
      ballast: 'harness-wire',
      ballastPart: 'Resistive feed wire in the loom, 1.4 ohm',
      crankingBypass: true,
      condenserUf: 0.22,
      tachPart: 'Current-sensing tachometer (coil feed loops through it)',
      leadsPart: 'Carbon-core suppression leads',
      plugPart: '14 mm plug, 5 kohm resistor',
      plugGapMm: 0.89,
    },
    conditions: {},
  },
];
