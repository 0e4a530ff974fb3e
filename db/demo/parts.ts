/**
 * The demo workshop's parts bin. Every part is of our own invention: descriptive names, no maker.
 * Figures are typical of their kind so the checker has something realistic to weigh; where a
 * figure is a typical value it says so ("from memory" or "common practice") in the comment above
 * its group. None of these is a catalogue value of any real product.
 */
import type { PartInput } from '../schema.js';

const coils: PartInput[] = [
  // Coils. Primary resistance: about 1.5 ohm for a coil meant to run behind a ballast, 3.0 to 3.5
  // ohm for one that takes the full supply (common practice). Primary inductance 3 to 10 mH,
  // secondary 5 to 10 kohm, turns ratio 60 to 120 (from memory). Dissipation limits are invented
  // round figures for the demo, of the right order for an oil-filled canister coil (from memory).
  {
    kind: 'coil',
    name: 'Canister coil, 1.5 ohm, for use with ballast',
    notes: 'Marked "use with ballast". Without its ballast it overheats with the engine stopped.',
    primaryResistanceOhm20C: 1.5,
    primaryInductanceH: 0.0055,
    secondaryResistanceOhm: 8200,
    turnsRatio: 85,
    secondaryInductanceH: null,
    forBallast: true,
    ratedVoltageV: 12,
    maxDissipationW: 40,
  },
  {
    kind: 'coil',
    name: 'Canister coil, 3.0 ohm, full 12 V',
    notes: 'The plain 12 V coil for cars without a ballast.',
    primaryResistanceOhm20C: 3.0,
    primaryInductanceH: 0.008,
    secondaryResistanceOhm: 8500,
    turnsRatio: 100,
    secondaryInductanceH: null,
    forBallast: false,
    ratedVoltageV: 12,
    maxDissipationW: 70,
  },
  {
    kind: 'coil',
    name: 'Sports canister coil, 3.3 ohm',
    notes: 'Higher turns ratio than the plain coil; same full-voltage feed.',
    primaryResistanceOhm20C: 3.3,
    primaryInductanceH: 0.0095,
    secondaryResistanceOhm: 9800,
    turnsRatio: 115,
    secondaryInductanceH: null,
    forBallast: false,
    ratedVoltageV: 12,
    maxDissipationW: 65,
  },
  {
    kind: 'coil',
    name: 'Low-resistance performance coil, 0.7 ohm',
    notes: 'Only for a module that limits coil current. On points or a fixed-duty module it draws far too much.',
    primaryResistanceOhm20C: 0.7,
    primaryInductanceH: 0.003,
    secondaryResistanceOhm: 6000,
    turnsRatio: 90,
    secondaryInductanceH: null,
    forBallast: false,
    ratedVoltageV: 12,
    maxDissipationW: 50,
  },
  {
    kind: 'coil',
    name: 'Six-volt canister coil, 1.4 ohm',
    notes: 'For 6 V cars. On 12 V it would need a ballast of about its own resistance.',
    primaryResistanceOhm20C: 1.4,
    primaryInductanceH: 0.005,
    secondaryResistanceOhm: 7000,
    turnsRatio: 90,
    secondaryInductanceH: null,
    forBallast: false,
    ratedVoltageV: 6,
    maxDissipationW: 35,
  },
];

const ballasts: PartInput[] = [
  // Ballasts. About 1.5 ohm to pair with a 1.5 ohm coil (common practice). An iron-wire ballast's
  // resistance rises as it heats; a ceramic one stays nearly constant; a resistive harness wire is
  // a length of loom cable of about 1.4 ohm (from memory). Thermal resistances are guesses of the
  // right order for a finned body in free air (from memory).
  {
    kind: 'ballast',
    name: 'Iron-wire ballast, 1.5 ohm',
    notes: 'Open-frame iron wire on a ceramic former; gets hot in use, mount it clear of the loom.',
    ballastType: 'iron-wire',
    // Its 1.5 ohm is the working figure: the iron wire reads well under that cold on a meter and
    // roughly doubles as it heats (iron's resistivity about doubles from 20 to 200 degC, handbook
    // table, from memory), so the cold reading here is 0.8 ohm.
    coldResistanceOhm: 0.8,
    thermalResistanceKPerW: 10,
  },
  {
    kind: 'ballast',
    name: 'Ceramic ballast block, 1.6 ohm',
    notes: 'Wire-wound resistor sealed in a ceramic block.',
    ballastType: 'ceramic',
    coldResistanceOhm: 1.6,
    thermalResistanceKPerW: 15,
  },
  {
    kind: 'ballast',
    name: 'Resistive feed wire in the loom, 1.4 ohm',
    notes: 'A length of resistive cable from the ignition switch to the coil, inside the harness.',
    ballastType: 'harness-wire',
    coldResistanceOhm: 1.4,
    thermalResistanceKPerW: null,
  },
  {
    kind: 'ballast',
    name: 'Ceramic ballast block, 0.8 ohm',
    notes: 'For a low-resistance coil on a module without current limiting.',
    ballastType: 'ceramic',
    coldResistanceOhm: 0.8,
    thermalResistanceKPerW: 15,
  },
];

const modules: PartInput[] = [
  // Modules. Switch drop: a Darlington 1.2 to 2.0 V, an IGBT 1.5 to 2.0 V (from memory). Primary
  // clamps 350 to 450 V, spark-rate limits of several hundred sparks per second, CD stages of about
  // 1 uF charged to 400 V from a charger of a few tens of watts (from memory). Minimum coil
  // resistances are the kind of floor such modules state for their switch's current rating.
  {
    kind: 'module',
    name: 'Points-triggered transistor unit',
    notes: 'Keeps the points as a trigger; they carry only a small current. Remove the condenser. No stall shut-off: it cannot tell a stopped engine from closed points.',
    moduleType: 'transistor-points',
    supplyMinV: 8,
    supplyMaxV: 16,
    earthPolarities: ['negative', 'positive'],
    minCoilResistanceOhm: 1.2,
    maxCurrentA: 8,
    currentLimitA: null,
    switchSaturationV: 1.8,
    primaryClampV: 400,
    fixedDutyFraction: null,
    maxDutyFraction: null,
    stallShutOff: false,
    maxSparkRateHz: 500,
    tachOutput: false,
    needsSuppressedLeads: false,
    cd: null,
  },
  {
    kind: 'module',
    name: 'Breakerless unit, fixed duty, negative earth only',
    notes: 'Magnetic pickup under the rotor replaces the points. Negative earth only. Wants suppressed leads.',
    moduleType: 'breakerless-fixed-duty',
    supplyMinV: 9,
    supplyMaxV: 16,
    earthPolarities: ['negative'],
    minCoilResistanceOhm: 3.0,
    maxCurrentA: 5,
    currentLimitA: null,
    switchSaturationV: 1.5,
    primaryClampV: 400,
    fixedDutyFraction: 0.6,
    maxDutyFraction: null,
    stallShutOff: true,
    maxSparkRateHz: 400,
    tachOutput: false,
    needsSuppressedLeads: true,
    cd: null,
  },
  {
    kind: 'module',
    name: 'Breakerless unit, current-limited',
    notes: 'Optical trigger; limits coil current and stretches dwell to reach it. Works with either earth.',
    moduleType: 'breakerless-current-limited',
    supplyMinV: 8,
    supplyMaxV: 16,
    earthPolarities: ['negative', 'positive'],
    minCoilResistanceOhm: 0.6,
    maxCurrentA: 8,
    currentLimitA: 6.5,
    switchSaturationV: 1.8,
    primaryClampV: 450,
    fixedDutyFraction: null,
    maxDutyFraction: 0.75,
    stallShutOff: true,
    maxSparkRateHz: 600,
    tachOutput: true,
    needsSuppressedLeads: true,
    cd: null,
  },
  {
    kind: 'module',
    name: 'Six-volt breakerless unit, current-limited',
    notes: 'Runs from 4.5 V upwards, so it keeps firing on a 6 V battery while cranking.',
    moduleType: 'breakerless-current-limited',
    supplyMinV: 4.5,
    supplyMaxV: 9,
    earthPolarities: ['negative', 'positive'],
    minCoilResistanceOhm: 1.0,
    maxCurrentA: 5,
    currentLimitA: 4.5,
    switchSaturationV: 1.2,
    primaryClampV: 350,
    fixedDutyFraction: null,
    maxDutyFraction: 0.7,
    stallShutOff: true,
    maxSparkRateHz: 300,
    tachOutput: false,
    needsSuppressedLeads: false,
    cd: null,
  },
  {
    kind: 'module',
    name: 'Capacitive-discharge unit, 1 uF at 400 V, multi-spark',
    notes: '1 uF at 400 V stores 80 mJ per spark. Fires several sparks per event below 3000 rpm. Use its own tach output.',
    moduleType: 'capacitive-discharge',
    supplyMinV: 8,
    supplyMaxV: 16,
    earthPolarities: ['negative', 'positive'],
    minCoilResistanceOhm: 0.4,
    maxCurrentA: 4,
    currentLimitA: null,
    switchSaturationV: 1.0,
    primaryClampV: null,
    fixedDutyFraction: null,
    maxDutyFraction: null,
    stallShutOff: true,
    maxSparkRateHz: 700,
    tachOutput: true,
    needsSuppressedLeads: true,
    cd: { capacitorUf: 1, chargeVoltageV: 400, chargerPowerW: 40, multiSparkBelowRpm: 3000 },
  },
  {
    kind: 'module',
    name: 'Capacitive-discharge unit, 0.8 uF at 350 V, single spark',
    notes: 'A smaller single-spark unit. Negative earth only.',
    moduleType: 'capacitive-discharge',
    supplyMinV: 9,
    supplyMaxV: 16,
    earthPolarities: ['negative'],
    minCoilResistanceOhm: 0.4,
    maxCurrentA: 3,
    currentLimitA: null,
    switchSaturationV: 1.0,
    primaryClampV: null,
    fixedDutyFraction: null,
    maxDutyFraction: null,
    stallShutOff: true,
    maxSparkRateHz: 500,
    tachOutput: true,
    needsSuppressedLeads: true,
    cd: { capacitorUf: 0.8, chargeVoltageV: 350, chargerPowerW: 25, multiSparkBelowRpm: null },
  },
];

const tachs: PartInput[] = [
  // Tachometers of the four sensing kinds; which works with which ignition is common practice
  // (see the table in the checker design notes).
  { kind: 'tach', name: 'Current-sensing tachometer (coil feed loops through it)', notes: 'The coil supply passes through the instrument.', senses: 'coil-supply-current' },
  { kind: 'tach', name: 'Pulse tachometer on coil negative', notes: 'Counts voltage pulses at the coil negative terminal.', senses: 'coil-negative-pulses' },
  { kind: 'tach', name: 'Tachometer for a module tach output', notes: 'Needs a module with a tach output terminal.', senses: 'module-output' },
  { kind: 'tach', name: 'Cable-driven tachometer', notes: 'Driven from the distributor drive; no electrical connection.', senses: 'cable' },
];

const leads: PartInput[] = [
  // HT leads, resistance per lead of about 0.5 m: copper core near zero, carbon-string suppression
  // around 10 to 15 kohm, spiral-wound a few hundred ohm (from memory).
  { kind: 'leads', name: 'Copper-core HT leads', notes: 'Unsuppressed; radio interference likely.', core: 'copper', resistancePerLeadOhm: 0.05 },
  { kind: 'leads', name: 'Carbon-core suppression leads', notes: 'Carbon string core; resistance rises as they age.', core: 'carbon', resistancePerLeadOhm: 12000 },
  { kind: 'leads', name: 'Spiral-wound suppression leads', notes: 'Wire wound on a ferrite-loaded core.', core: 'spiral', resistancePerLeadOhm: 500 },
];

const plugs: PartInput[] = [
  // Plugs: a built-in suppression resistor of about 5 kohm; usual gaps 0.5 to 1.1 mm (common practice).
  { kind: 'plug', name: '14 mm plug, non-resistor', notes: 'Short reach, for the older engines.', resistor: false, resistorOhm: 0, gapMinMm: 0.5, gapMaxMm: 0.9 },
  { kind: 'plug', name: '14 mm plug, 5 kohm resistor', notes: 'Suppressed; suits electronic ignition.', resistor: true, resistorOhm: 5000, gapMinMm: 0.6, gapMaxMm: 1.1 },
  { kind: 'plug', name: '18 mm plug, non-resistor', notes: 'Long-reach plug for the flat twin.', resistor: false, resistorOhm: 0, gapMinMm: 0.4, gapMaxMm: 0.7 },
];

export const demoParts: readonly PartInput[] = [...coils, ...ballasts, ...modules, ...tachs, ...leads, ...plugs];
