/** Taking a magneto out of service, when that is what the car has today: its own first stage. */
import type { SheetContext } from '../context.js';
import { doStep, sentences } from '../step.js';
import type { SheetStage } from '../types.js';

export function magnetoStage(ctx: SheetContext): SheetStage | null {
  if (ctx.existing.switching !== 'magneto') return null;
  const w = ctx.words;
  return {
    id: 'magneto',
    title: 'Take the magneto out of service',
    intro: 'Engine stopped and cold. A magneto makes its own spark whenever the engine turns, ignition switch or not, so it comes out of the circuit first.',
    steps: [
      doStep('magneto', 'cut-out-wire', 'Magneto cut-out wire', "Find the magneto's cut-out (kill) wire, note where it runs, then disconnect and label it; a magneto with its cut-out wire off can fire when the engine is turned.", ['magneto cut-out wire']),
      doStep('magneto', 'remove', 'Remove the magneto', sentences(
        'Take the magneto off and fit the battery-ignition distributor this plan needs',
        ctx.pickup ? '(with the pickup for the module).' : '(with points).',
        'Set its drive and static timing as the service data says.',
      ), ['magneto drive']),
      doStep('magneto', 'battery-feed', 'Battery and switched feed', sentences(
        'A battery ignition needs a charged battery and a fused, switched feed from the ignition switch: 30 in, 15 out.',
        'Fit them if the car has none.',
        ctx.positiveEarth && 'On this car 31 (earth) is battery positive: it is positive earth.',
      ), [w.t30, w.t15]),
    ],
  };
}
