/**
 * The four decks the exporter writes, each for one setup at one operating point:
 *
 * - charge: the primary charging through the switch for the dwell time, opened at the break.
 *   Measures the current at the break and the stored energy (both as 1/2 L i^2 and as the
 *   integral of the power into L1, an independent check of the same number).
 * - break: the same charge, then the break with the condenser (or transistor capacitance) across
 *   the switch and the coupled secondary. Measures the first secondary peak.
 * - fouled: as break, with a fouled plug's shunt resistance across the secondary.
 * - cd: a capacitor charged to its working voltage switched into the primary by a thyristor,
 *   with the coupled secondary. Measures the first secondary peak.
 *
 * The switch starts open, so ngspice's DC operating point has an uncharged coil and the charge
 * happens inside the run (a DC operating point with the switch closed would start the coil
 * fully charged, whatever the dwell). For the inductive decks this is preferred over `.ic` with
 * `uic`, which skips the operating point and leaves the condenser's charge from the battery to be
 * guessed. The capacitive-discharge deck is the opposite case: its starting state (capacitor
 * charged, everything else at rest) is known exactly and the charger is off during the firing,
 * so it sets the capacitor's IC= and runs with `uic`.
 */
import type { DeckOptions, Scenario, SpiceCircuit } from './circuit.js';
import { circuitProblems, defaultCouplingK, defaultFouledShuntOhm } from './circuit.js';
import { DeckWriter, n, t } from './deck-writer.js';
import { withUnit as u } from './spice-number.js';
import { edgeS, writePrimary } from './primary.js';
import { writeSecondary } from './secondary.js';
import { cdTransferHalfPeriodS, closeAtS, maxStepS, secondaryHalfPeriodS } from './timing.js';

/** Names of the `.meas` results each deck prints as `name = value` (SI units, per the suffix). */
export const measureNames = {
  charge: ['ibreak_a', 'ecoil_j', 'einteg_j'],
  break: ['ibreak_a', 'ecoil_j', 'vpeak_v', 'vopp_v', 'vprim_v'],
  fouled: ['ibreak_a', 'ecoil_j', 'vpeak_v', 'vopp_v'],
  cd: ['vcap_v', 'ecap_j', 'vpeak_v', 'vopp_v'],
} as const satisfies Record<Scenario, readonly string[]>;

export interface SpiceDeck {
  scenario: Scenario;
  text: string;
  /** The `.meas` names this deck prints. */
  measures: readonly string[];
  /** When the break (or the thyristor firing) happens in the run, s. */
  eventS: number;
  /** The largest timestep allowed, s. */
  maxStepS: number;
}

export class DeckError extends Error {
  readonly code = 'INVALID_CIRCUIT';
  constructor(readonly problems: string[]) {
    super(`The circuit cannot be simulated: ${problems.join(' ')}`);
  }
}

/** Numerical settings: state them in the deck so a reader knows what the numbers are worth. */
function writeNumerics(d: DeckWriter, stepS: number, stopS: number, useInitialConditions = false): void {
  d.blank();
  d.comment('--- Numerics ---');
  d.comment(`Relative tolerance 1e-4 (ngspice default 1e-3), absolute current 1 pA, voltage 1 uV;`);
  d.comment(`trapezoidal integration; largest step ${u(stepS, 's')}, run to ${u(stopS, 's')}.`);
  d.raw('.options reltol=1e-4 abstol=1e-12 vntol=1e-6');
  d.raw(`.tran ${t(stepS)} ${t(stopS)} 0 ${t(stepS)}${useInitialConditions ? ' uic' : ''}`);
}

function writeControl(d: DeckWriter): string {
  d.blank();
  d.comment('--- Batch run: ngspice -b deck.cir prints each measurement as "name = value" ---');
  d.raw('.control');
  d.raw('run');
  d.raw('quit 0');
  d.raw('.endc');
  d.raw('.end');
  return d.text();
}

function header(d: DeckWriter, what: string): void {
  d.comment(what);
  d.comment('Written by the conversion checker. Units: V, A, ohm, H, F, s, J.');
  d.blank();
}

function inductiveDeck(c: SpiceCircuit, scenario: 'charge' | 'break' | 'fouled', opts: DeckOptions): SpiceDeck {
  const k = couplingOf(c, opts);
  const step = maxStepS(c, scenario, k, opts.timestepRefinement ?? 1);
  const breakS = closeAtS + c.primary.dwellS;
  const d = new DeckWriter(`${c.title} - ${scenario === 'charge' ? 'primary charge' : scenario === 'break' ? 'break with coupled secondary' : 'fouled plug'}`);
  header(
    d,
    scenario === 'charge'
      ? 'The coil charges through the switch for the dwell, then the switch opens (the break).'
      : scenario === 'break'
        ? 'The coil charges for the dwell; at the break its energy rings into the secondary.'
        : 'As the break, with a fouled plug: a shunt resistance across the secondary.',
  );
  writePrimary(d, c.primary, { closeS: closeAtS, breakS }, true);
  const shunt = scenario === 'fouled' ? (opts.fouledShuntOhm ?? defaultFouledShuntOhm) : null;
  if (scenario !== 'charge') writeSecondary(d, c.secondary, c.primary.primaryInductanceH, k, shunt);

  const half = scenario === 'charge' ? 0 : secondaryHalfPeriodS(c);
  const stop = scenario === 'charge' ? breakS + 20 * edgeS + 2 * step : breakS + 1.2 * half;
  writeNumerics(d, step, stop);
  d.blank();
  d.comment('--- Measurements ---');
  d.comment(`Current in the primary at the break (t = ${u(breakS, 's')}), A`);
  d.raw(`.meas tran ibreak_a FIND i(L1) AT=${t(breakS)}`);
  d.comment('Energy stored in the primary at the break, 1/2 Lp i^2, J');
  d.raw(`.meas tran ecoil_j PARAM='0.5 * ${n(c.primary.primaryInductanceH)} * ibreak_a * ibreak_a'`);
  if (scenario === 'charge') {
    d.comment('The same energy as the integral of the power into L1 over the dwell, J');
    d.raw(`.meas tran einteg_j INTEG par('(v(lw) - v(t1)) * i(Vsense)') FROM=0 TO=${t(breakS)}`);
  } else {
    const to = breakS + half;
    d.comment('First secondary peak after the break (the tower swings negative with this winding sense), V');
    d.raw(`.meas tran vpeak_v MIN v(ht) FROM=${t(breakS)} TO=${t(to)}`);
    d.comment('Largest swing of the opposite sign in the same window (should be small), V');
    d.raw(`.meas tran vopp_v MAX v(ht) FROM=${t(breakS)} TO=${t(to)}`);
    if (scenario === 'break') {
      d.comment('Peak voltage across the switch (what the points or transistor must stand off), V');
      d.raw(`.meas tran vprim_v MAX v(t1) FROM=${t(breakS)} TO=${t(to)}`);
    }
  }
  return { scenario, text: writeControl(d), measures: measureNames[scenario], eventS: breakS, maxStepS: step };
}

function cdDeck(c: SpiceCircuit, opts: DeckOptions): SpiceDeck {
  const cd = c.cd!;
  const k = couplingOf(c, opts);
  const step = maxStepS(c, 'cd', k, opts.timestepRefinement ?? 1);
  const half = cdTransferHalfPeriodS(c, k);
  const fireS = closeAtS;
  const d = new DeckWriter(`${c.title} - capacitive discharge`);
  header(d, 'A capacitor charged to its working voltage is switched into the coil primary by a thyristor.');
  d.comment('The module\'s charger has filled the capacitor and stopped when the thyristor fires, so the');
  d.comment('run starts from that state: the capacitor at its charge voltage (IC=), every other node at');
  d.comment('0 V and no current anywhere (`uic` skips the DC operating point, which would see no charger).');
  d.blank();
  d.comment('--- Discharge loop: capacitor, thyristor, coil primary ---');
  d.element(
    `Discharge capacitor, ${u(cd.capacitorF, 'F')}, charged to ${u(cd.chargeVoltageV, 'V')} (plate ca positive)`,
    'Ccd',
    ['ca', 'coil15'],
    `${n(cd.capacitorF)} IC=${n(cd.chargeVoltageV)}`,
  );
  d.element(`Thyristor gate: fires at ${u(fireS, 's')}`, 'Vctl', ['ctl', '0'], `PWL(0 0 ${t(fireS)} 0 ${t(fireS + edgeS)} 1)`);
  // A plain switch, not switch plus diode: the thyristor only conducts one way, but the first
  // transfer (the peak measured) is over before the current would reverse, and a diode next to an
  // open switch made ngspice's first steps stall with some coils.
  d.element('Thyristor, as a switch: on 1 mohm once fired', 'Sscr', ['ca', '0', 'ctl', '0'], 'SWMOD');
  d.raw('.model SWMOD SW(Ron=1m Roff=100Meg Vt=0.5 Vh=0.1)');
  d.element(`Coil primary winding resistance, ${u(c.primary.coilResistanceOhm, 'ohm')}`, 'Rcoil', ['coil15', 'cw'], c.primary.coilResistanceOhm);
  d.element('Ammeter in the primary (0 V source), A', 'Vsense', ['cw', 'lw'], 'DC 0');
  d.element(`Coil primary inductance, ${u(c.primary.primaryInductanceH, 'H')}; terminal 1 to earth`, 'L1', ['lw', '0'], c.primary.primaryInductanceH);
  writeSecondary(d, c.secondary, c.primary.primaryInductanceH, k, null);

  const stop = fireS + 2.5 * half;
  writeNumerics(d, step, stop, true);
  d.blank();
  d.comment('--- Measurements ---');
  d.comment('Capacitor voltage just before the firing (coil15 is at 0 V until then), V');
  d.raw(`.meas tran vcap_v FIND v(ca) AT=${t(fireS)}`);
  d.comment('Energy in the capacitor at the firing, 1/2 C V^2, J');
  d.raw(`.meas tran ecap_j PARAM='0.5 * ${n(cd.capacitorF)} * vcap_v * vcap_v'`);
  d.comment(`First secondary peak (fast transfer, half period about ${u(half, 's')}), V`);
  d.raw(`.meas tran vpeak_v MIN v(ht) FROM=${t(fireS)} TO=${t(fireS + 2 * half)}`);
  d.raw(`.meas tran vopp_v MAX v(ht) FROM=${t(fireS)} TO=${t(fireS + 2 * half)}`);
  return { scenario: 'cd', text: writeControl(d), measures: measureNames.cd, eventS: fireS, maxStepS: step };
}

/** The coupling drawn: the option, else the circuit's own (the engine's resolved condition), else the default. */
function couplingOf(c: SpiceCircuit, opts: DeckOptions): number {
  return opts.couplingK ?? c.couplingK ?? defaultCouplingK;
}

/** Write the deck for one scenario; refuses a circuit with impossible values. */
export function buildDeck(c: SpiceCircuit, scenario: Scenario, opts: DeckOptions = {}): SpiceDeck {
  const problems = circuitProblems(c, scenario);
  const k = couplingOf(c, opts);
  if (!(k > 0 && k < 1)) problems.push('couplingK: must be between 0 and 1 (exclusive).');
  if (opts.fouledShuntOhm !== undefined && !(opts.fouledShuntOhm > 0 && Number.isFinite(opts.fouledShuntOhm))) {
    problems.push('fouledShuntOhm: must be more than zero.');
  }
  if (problems.length > 0) throw new DeckError(problems);
  return scenario === 'cd' ? cdDeck(c, opts) : inductiveDeck(c, scenario, opts);
}
