/**
 * Coil polarity. The spark should leave the plug's centre electrode negative: the hot centre
 * electrode emits electrons readily and breakdown needs roughly 10 % less voltage (club technical
 * literature, from memory). That is set by which coil primary terminal goes to the supply side,
 * and so depends on the car's earth polarity: a coil wired for the other earth (a common slip on
 * positive-earth cars, whose coils are marked for negative earth) fires the centre positive.
 */
import { REVERSED_POLARITY_FACTOR } from '../breakdown.js';
import { fig, fmt, result, type FailTest, type Rule } from './context.js';

export const coilPolarity: Rule = (ctx) => {
  const { setup, engine, worstRatio, margin } = ctx;
  const id = 'coil-polarity';
  const title = 'Coil polarity';
  const neg = engine.earthPolarity === 'negative';
  const howTo = neg
    ? 'On negative earth, the coil terminal marked + (SW, 15) goes to the ignition feed and the one marked - (CB, 1) to the points or module.'
    : 'On positive earth, the coil terminal marked - (CB, 1) goes to the ignition feed and the one marked + (SW, 15) to the points or module (the reverse of the markings for negative earth).';
  const extraPct = (REVERSED_POLARITY_FACTOR - 1) * 100;
  const figures = [fig('worst reserve ratio', worstRatio, '')];
  if (setup.coilWiring === 'reversed') {
    figures.push(fig('extra voltage the plug needs', extraPct, '%'));
    const why = `With the coil wired for the other earth the plug's centre electrode fires positive and needs about ${fmt(extraPct, 0)} % more voltage, eating into the reserve.`;
    return result(id, title, worstRatio < margin ? 'fail' : 'caution', figures, `${why} The worst reserve ratio with this wiring is ${fmt(worstRatio, 2)}.`, `Swap the two low-tension leads on the coil. ${howTo}`);
  }
  return result(id, title, 'pass', figures, 'Wired for this earth polarity, the plug centre electrode fires negative, which needs the least voltage.', howTo);
};

/** Wired the wrong way round and short of the margin because of it. */
export const coilPolarityFails: FailTest = (ctx) => ctx.setup.coilWiring === 'reversed' && ctx.worstRatio < ctx.margin;
