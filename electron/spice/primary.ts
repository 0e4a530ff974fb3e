/**
 * The battery-fed primary circuit shared by the inductive decks: battery, harness, ballast,
 * coil winding, the switch (points or transistor) and whatever sits across the switch.
 *
 * Node names follow the DIN 72552 terminals where there is one: `bat` (30, battery positive),
 * `t15` (ignition switch output), `coil15` (coil positive, after any ballast), `t1` (coil
 * negative, to the switch), `ht` (terminal 4, the coil tower). Earth is node 0.
 */
import type { PrimarySide } from './circuit.js';
import { switchOutputCapacitanceF } from './circuit.js';
import { DeckWriter, n, t } from './deck-writer.js';
import { withUnit as u } from './spice-number.js';

/** On-resistance of the ideal switch element; it is subtracted from the contact resistance. */
export const switchOnOhm = 1e-3;

/** Knee voltage of the current limiter, V: small beside every other drop in the primary. */
export const limiterKneeV = 0.01;

/** Timing of the switch: closed at `closeS`, opened at `breakS`. */
export interface SwitchTiming {
  closeS: number;
  breakS: number;
}

/** Edges of the control waveform: fast next to every time constant in the circuit. */
export const edgeS = 10e-9;

/** A control voltage that is 0 (switch open) until `closeS`, 1 until `breakS`, then 0 again. */
export function controlPwl(s: SwitchTiming): string {
  return `PWL(0 0 ${t(s.closeS)} 0 ${t(s.closeS + edgeS)} 1 ${t(s.breakS)} 1 ${t(s.breakS + edgeS)} 0)`;
}

/**
 * Write the primary from the battery to the switch. The winding's resistance and inductance are
 * drawn as two elements inside the coil, with a 0 V source between them that serves as an
 * ammeter for the energy integral.
 */
export function writePrimary(d: DeckWriter, p: PrimarySide, timing: SwitchTiming, withCondenser: boolean): void {
  d.comment('--- Primary circuit ---');
  d.element(`Battery at this operating point, ${u(p.supplyV, 'V')} (terminal 30)`, 'Vbat', ['bat', '0'], `DC ${n(p.supplyV)}`);
  let node = 'bat';
  if (p.harnessResistanceOhm > 0) {
    d.element(`Feed wiring and ignition switch, ${u(p.harnessResistanceOhm, 'ohm')}`, 'Rharness', [node, 't15'], p.harnessResistanceOhm);
    node = 't15';
  } else {
    d.comment('Feed wiring: no resistance given, battery wired straight to terminal 15');
  }
  if (p.ballastResistanceOhm > 0) {
    d.element(`Ballast at its working temperature, ${u(p.ballastResistanceOhm, 'ohm')}`, 'Rballast', [node, 'coil15'], p.ballastResistanceOhm);
    node = 'coil15';
  } else {
    d.comment('No ballast in circuit (none fitted, or bypassed)');
  }
  d.element(`Coil primary winding resistance at its working temperature, ${u(p.coilResistanceOhm, 'ohm')}`, 'Rcoil', [node, 'cw'], p.coilResistanceOhm);
  d.element('Ammeter in the primary (0 V source; i(Vsense) is the coil current, A)', 'Vsense', ['cw', 'lw'], 'DC 0');
  d.element(`Coil primary inductance, ${u(p.primaryInductanceH, 'H')} (from terminal 15 side to terminal 1)`, 'L1', ['lw', 't1'], p.primaryInductanceH);
  writeSwitch(d, p, timing);
  if (withCondenser) writeAcrossSwitch(d, p);
}

function writeSwitch(d: DeckWriter, p: PrimarySide, timing: SwitchTiming): void {
  d.comment('--- Switch: closes at the start of the dwell, opens at the break ---');
  d.element(
    `Switch control: 0 = open, 1 = closed; closes at ${u(timing.closeS, 's')}, opens at ${u(timing.breakS, 's')}`,
    'Vctl',
    ['ctl', '0'],
    controlPwl(timing),
  );
  const contactOhm = Math.max(p.contactResistanceOhm - switchOnOhm, 0);
  d.element(`Switch (points contacts or module transistor), on ${u(switchOnOhm, 'ohm')}, off 100 Mohm`, 'S1', ['t1', 'sx', 'ctl', '0'], 'SWMOD');
  d.raw('.model SWMOD SW(Ron=1m Roff=100Meg Vt=0.5 Vh=0.1)');
  let node = 'sx';
  if (p.currentLimitA !== null) {
    // A current-limited module: its transistor saturates until the coil current reaches the
    // limit, then leaves saturation and holds the limit, dissipating the difference. A JFET with
    // its gate tied to its source behaves exactly so: resistive (about 5 mV / I_limit) at low
    // drain voltage, a constant Beta * Vto^2 above a knee of |Vto| = 10 mV. ngspice handles it
    // robustly next to the clamp diode at the break, where a behavioural source did not converge.
    const beta = p.currentLimitA / (limiterKneeV * limiterKneeV);
    d.element(
      `Current limit of the module transistor, ${u(p.currentLimitA, 'A')} (JFET, gate to source: saturates at Beta * Vto^2)`,
      'Jlim',
      ['sx', 'sl', 'sl'],
      'NJLIM',
    );
    d.raw(`.model NJLIM NJF(Vto=-${n(limiterKneeV)} Beta=${n(beta)} Lambda=0)`);
    node = 'sl';
  }
  if (contactOhm > 0) {
    d.element(`Contact or on-state resistance of the switch, ${u(contactOhm, 'ohm')}`, 'Rcontact', [node, 'sy'], contactOhm);
    node = 'sy';
  }
  if (p.switchDropV > 0) {
    d.element(`Saturation voltage of the transistor switch, ${u(p.switchDropV, 'V')}`, 'Vsat', [node, '0'], `DC ${n(p.switchDropV)}`);
  } else {
    d.element('Switch earthed directly (no saturation voltage)', 'Vearth', [node, '0'], 'DC 0');
  }
}

function writeAcrossSwitch(d: DeckWriter, p: PrimarySide): void {
  if (p.condenserF !== null) {
    d.element(`Condenser across the points, ${u(p.condenserF, 'F')}`, 'Ccond', ['t1', '0'], p.condenserF);
  } else {
    d.element(
      `No condenser: output capacitance of the switching transistor, ${u(switchOutputCapacitanceF, 'F')} (from memory)`,
      'Cswitch',
      ['t1', '0'],
      switchOutputCapacitanceF,
    );
  }
  if (p.primaryClampV !== null) {
    d.element(`Module clamp across the switch (zener), ${u(p.primaryClampV, 'V')}`, 'Dclamp', ['0', 't1'], 'DCLAMP');
    d.raw(`.model DCLAMP D(BV=${n(p.primaryClampV)} IBV=10m Rs=0.1)`);
  }
}
