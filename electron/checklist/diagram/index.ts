/** The plan's wiring diagram as a plain model: parts in fixed slots, wires along lanes, notes. */
import type { SheetContext } from '../context.js';
import type { Diagram } from '../types.js';
import { HEIGHT, WIDTH } from './layout.js';
import { diagramNotes } from './notes.js';
import { diagramParts } from './parts.js';
import { diagramWires } from './wires.js';

export function buildDiagram(ctx: SheetContext): Diagram {
  const parts = diagramParts(ctx);
  return { width: WIDTH, height: HEIGHT, parts, wires: diagramWires(ctx, parts), notes: diagramNotes(ctx) };
}
