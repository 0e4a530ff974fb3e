/** Finish: tidy the wiring, enter the readings, sign off. */
import type { SheetContext } from '../context.js';
import { doStep } from '../step.js';
import type { SheetStage } from '../types.js';

export function finishStage(_ctx: SheetContext): SheetStage {
  return {
    id: 'finish',
    title: 'Finish',
    intro: 'Engine stopped, ignition off.',
    steps: [
      doStep('finish', 'tidy', 'Tidy the wiring', 'Tie every new wire clear of the exhaust, the fan and moving parts; check each fuse and terminal once more.', []),
      doStep('finish', 'readings', 'Enter the readings', 'Enter every reading in the app: measured coil, ballast and lead values then replace the catalogue figures in the next check.', []),
      doStep('finish', 'sign-off', 'Sign off', 'Sign and date the sheet when every step is ticked and every reading is in its band.', []),
    ],
  };
}
