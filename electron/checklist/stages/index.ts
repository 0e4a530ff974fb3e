/** The stages in their order; the magneto stage only when the car has a magneto today. */
import type { SheetContext } from '../context.js';
import type { SheetStage } from '../types.js';
import { beforeStage } from './before.js';
import { crankingStage } from './cranking.js';
import { finishStage } from './finish.js';
import { fitStage } from './fit.js';
import { magnetoStage } from './magneto.js';
import { measureStage } from './measure.js';
import { runningStage } from './running.js';
import { staticStage } from './static.js';

export function buildStages(ctx: SheetContext): SheetStage[] {
  const magneto = magnetoStage(ctx);
  return [
    ...(magneto ? [magneto] : []),
    beforeStage(ctx),
    measureStage(ctx),
    fitStage(ctx),
    staticStage(ctx),
    crankingStage(ctx),
    runningStage(ctx),
    finishStage(ctx),
  ];
}
