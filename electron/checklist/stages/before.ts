/** Before you start: note and label today's wiring, photograph it, take the battery earth lead off first. */
import type { SheetContext } from '../context.js';
import { doStep, sentences } from '../step.js';
import type { SheetStage } from '../types.js';
import { POSITIVE_EARTH_SENTENCE } from '../words.js';

export function beforeStage(ctx: SheetContext): SheetStage {
  const w = ctx.words;
  const today = ctx.existing;
  const parts = [
    today.ballast ? 'the ballast (15 and 15a)' : null,
    today.crankingBypass && today.ballast ? 'the cranking bypass wire at the starter solenoid' : null,
    today.condenserF !== null ? 'the condenser' : null,
    today.tach && today.tach.senses !== 'cable' ? 'the tachometer wire' : null,
  ].filter((x): x is string => x !== null);
  return {
    id: 'before',
    title: 'Before you start',
    intro: 'Engine stopped and cold, ignition off, key out.',
    steps: [
      doStep('before', 'note-and-label', "Note and label today's wiring", sentences(
        'Write down which wire goes to which terminal and put a numbered label on each before you take anything off',
        parts.length ? `(coil 15 and 1, ${parts.join(', ')}).` : '(coil 15 and 1).',
      ), [w.coil15, w.coil1]),
      doStep('before', 'photograph', 'Photograph it', 'Photograph the coil, the distributor and everything wired to them from two sides, so you can put it back as it was.', []),
      doStep('before', 'battery-off', 'Battery earth lead off first', sentences(
        'Disconnect the battery earth lead (31) first and keep it away from the post; it goes back on last.',
        ctx.positiveEarth && `${POSITIVE_EARTH_SENTENCE} The earth lead is the one on the positive post.`,
      ), [w.t31]),
    ],
  };
}
