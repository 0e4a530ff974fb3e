/**
 * Coil polarity. The spark should leave the plug's centre electrode negative: the hot centre
 * electrode emits electrons readily and breakdown needs roughly 10 % less voltage (club technical
 * literature, from memory). That is set by which coil primary terminal goes to the switch, and so
 * depends on the car's earth polarity.
 */
import { fig, fmt, result, type FailTest, type Rule } from './context.js';

export const coilPolarity: Rule = (ctx) => {
  const { setup, engine, worstRatio, margin } = ctx;
  const id = 'coil-polarity';
  const title = 'Coil polarity';
  const neg = engine.earthPolarity === 'negative';
  const howTo = neg
    ? 'On negative earth, the coil terminal marked + (15) goes to the ignition feed and the one marked - (1) to the points or module.'
    : 'On positive earth, the coil terminal marked - goes to the ignition feed and the one marked + to the points or module (the reverse of the markings for negative earth).';
  const figures = [fig('worst reserve ratio', worstRatio, '')];
  if (setup.coilWiring === 'reversed') {
    const why = 'With the coil the wrong way round the centre electrode fires positive and needs about 10 % more voltage, eating into the reserve.';
    return result(id, title, worstRatio < margin ? 'fail' : 'caution', figures, `${why} The worst reserve ratio with this wiring is ${fmt(worstRatio, 2)}.`, `Swap the two primary leads on the coil. ${howTo}`);
  }
  return result(id, title, 'pass', figures, 'Wired for this earth polarity, the plug centre electrode fires negative, which needs the least voltage.', howTo);
};

/** Wired the wrong way round and short of the margin because of it. */
export const coilPolarityFails: FailTest = (ctx) => ctx.setup.coilWiring === 'reversed' && ctx.worstRatio < ctx.margin;
