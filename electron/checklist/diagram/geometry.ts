/**
 * Drawing primitives: a part box with pins, and a wire along given corners. A pin sits PIN units
 * outside its box edge, so two wires can reach one terminal from different sides without running
 * along the box.
 */
import type { DiagramPart, DiagramPartKind, DiagramTerminal, DiagramWire, WireStyle } from '../types.js';

export const PIN = 8;

export type Side = 'left' | 'right' | 'top' | 'bottom';

/** A pin: its id, its printed label, the side of the box and the distance along that side. */
export type PinSpec = readonly [id: string, label: string, side: Side, along: number];

export interface Box {
  x: number;
  y: number;
  width: number;
  height: number;
}

export function pinAt(box: Box, side: Side, along: number): { x: number; y: number } {
  switch (side) {
    case 'left':
      return { x: box.x - PIN, y: box.y + along };
    case 'right':
      return { x: box.x + box.width + PIN, y: box.y + along };
    case 'top':
      return { x: box.x + along, y: box.y - PIN };
    case 'bottom':
      return { x: box.x + along, y: box.y + box.height + PIN };
  }
}

export function makePart(id: string, kind: DiagramPartKind, label: string, box: Box, pins: readonly PinSpec[]): DiagramPart {
  const terminals: DiagramTerminal[] = pins.map(([tid, tlabel, side, along]) => ({ id: tid, label: tlabel, ...pinAt(box, side, along) }));
  return { id, kind, label, x: box.x, y: box.y, width: box.width, height: box.height, terminals };
}

/** Finds a terminal's coordinates; a missing one is a bug in the layout, so it throws. */
export function terminalOf(parts: readonly DiagramPart[], ref: string): { x: number; y: number } {
  const [pid, tid] = ref.split('.');
  const t = parts.find((p) => p.id === pid)?.terminals.find((x) => x.id === tid);
  if (!t) throw new Error(`diagram: no terminal ${ref}`);
  return { x: t.x, y: t.y };
}

/** A wire from terminal to terminal through the given corners (each leg horizontal or vertical). */
export function makeWire(parts: readonly DiagramPart[], id: string, from: string, to: string, style: WireStyle, corners: ReadonlyArray<readonly [number, number]>, label = ''): DiagramWire {
  const a = terminalOf(parts, from);
  const b = terminalOf(parts, to);
  const path = [a, ...corners.map(([x, y]) => ({ x, y })), b];
  // Drop repeated points so every leg has a length.
  const clean = path.filter((p, i) => i === 0 || p.x !== path[i - 1]!.x || p.y !== path[i - 1]!.y);
  return { id, from, to, style, path: clean, label };
}
