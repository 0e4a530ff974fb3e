/** The sentences printed under the drawing: the earth in words, what comes off, what to watch. */
import type { SheetContext } from '../context.js';
import { POSITIVE_EARTH_SENTENCE } from '../words.js';

export function diagramNotes(ctx: SheetContext): string[] {
  const notes: string[] = [];
  notes.push(
    ctx.positiveEarth
      ? `Positive earth. ${POSITIVE_EARTH_SENTENCE} 30 and 15 are the negative side; follow the module maker's positive-earth wiring.`
      : 'Negative earth: 31 (earth) is battery negative; 30 and 15 are positive.',
  );
  if (ctx.six) notes.push('6 V system: every voltage on this sheet is for a 6 V battery.');
  if (ctx.existing.switching === 'magneto') notes.push('The magneto comes off; this drawing shows the battery ignition that replaces it.');
  if (ctx.keepsCondenser) notes.push('The condenser stays across the points, its body earthed on the base plate.');
  else if (ctx.keepsPoints) notes.push('Condenser removed: the points only trigger the module, which switches the coil.');
  else notes.push('Points and condenser removed: the pickup in the distributor triggers the module.');
  if (ctx.removesBallast && ctx.existing.ballast) notes.push(`${ctx.existing.ballast.ballastType === 'harness-wire' ? 'Resistive feed wire' : 'Ballast'} removed: coil 15 is fed straight from 15.`);
  if (ctx.removesBypass) notes.push('Cranking bypass wire removed from the starter solenoid.');
  if (ctx.bypass) notes.push("Cranking bypass: the starter solenoid's ignition terminal feeds coil 15 past the ballast, only while cranking.");
  if (ctx.moduleAfterBallast) notes.push('The plan feeds the module after the ballast (15a); most module makers want it on 15.');
  if (ctx.tach) {
    if (ctx.tachRoute === 'cable') notes.push('The tachometer is cable-driven: no wiring.');
    else if (ctx.tachRoute === 'coil-feed') notes.push('The coil feed loops through the tachometer, which senses its current.');
    if (ctx.tachAdaptor) notes.push('The tachometer reads through an adaptor made for this module (the checker\'s tach rule asks for it).');
  }
  notes.push(`Plugs top to bottom in the firing order ${ctx.firingOrder.join('-')}; take the cap's segment positions and the rotor's turning direction from the service data.`);
  notes.push("Terminal numbers are DIN 72552; the module's own terminals are in words: its maker's instructions come first.");
  return notes;
}
