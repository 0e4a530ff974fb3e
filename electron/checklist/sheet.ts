/** The whole sheet: header, the cautions first (all of them, in order), the stages, the diagram. */
import { ignitionCautions } from '../safety/cautions.js';
import { sheetContext } from './context.js';
import { buildDiagram } from './diagram/index.js';
import { buildHeader } from './header.js';
import { buildStages } from './stages/index.js';
import type { Sheet, SheetInput } from './types.js';

export function buildSheet(input: SheetInput): Sheet {
  const ctx = sheetContext(input);
  return {
    header: buildHeader(ctx),
    cautions: ignitionCautions.map((c) => ({ id: c.id, text: c.text })),
    stages: buildStages(ctx),
    diagram: buildDiagram(ctx),
  };
}
