/**
 * The coil's secondary: L2 = n^2 * Lp magnetically coupled to the primary, its winding
 * resistance, and the capacitance of coil, lead and plug lumped at the tower (terminal 4).
 * The low end of the secondary goes to earth; in a real coil it is joined to terminal 1 or 15,
 * which adds the primary voltage (a few hundred volts, about 1 % of the secondary) to the peak.
 */
import type { SecondarySide } from './circuit.js';
import { DeckWriter, n } from './deck-writer.js';
import { withUnit as u } from './spice-number.js';

export function secondaryInductanceH(primaryInductanceH: number, turnsRatio: number): number {
  return turnsRatio * turnsRatio * primaryInductanceH;
}

export function writeSecondary(d: DeckWriter, s: SecondarySide, primaryInductanceH: number, couplingK: number, fouledShuntOhm: number | null): void {
  const l2 = secondaryInductanceH(primaryInductanceH, s.turnsRatio);
  d.comment('--- Secondary circuit ---');
  const low = s.secondaryResistanceOhm > 0 ? 's2' : '0';
  d.element(`Coil secondary inductance, n^2 * Lp = ${String(s.turnsRatio)}^2 * ${u(primaryInductanceH, 'H')} = ${u(l2, 'H')}`, 'L2', ['ht', low], l2);
  if (s.secondaryResistanceOhm > 0) {
    d.element(`Secondary winding resistance, ${u(s.secondaryResistanceOhm, 'ohm')}`, 'Rsec', ['s2', '0'], s.secondaryResistanceOhm);
  }
  d.element(
    `Magnetic coupling of primary and secondary, k = ${couplingK} (dots at the terminal-15 end of L1 and the tower end of L2)`,
    'K1',
    ['L1', 'L2'],
    String(couplingK),
  );
  d.element(`Coil, lead and plug capacitance at the tower, ${u(s.secondaryCapacitanceF, 'F')}`, 'Cht', ['ht', '0'], s.secondaryCapacitanceF);
  if (fouledShuntOhm !== null) {
    d.element(`Fouled plug: carbon track across the gap, ${u(fouledShuntOhm, 'ohm')}`, 'Rfoul', ['ht', '0'], fouledShuntOhm);
  }
}
