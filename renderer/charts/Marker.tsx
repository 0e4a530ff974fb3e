/** A small marker shape at (x, y), drawn with attributes only (no inline style: the CSP forbids it). */
import type { ReactNode } from 'react';
import type { MarkerShape } from './palette.js';

export function Marker({ shape, x, y, size = 4, stroke, fill = '#ffffff', strokeWidth = 1.6 }: {
  shape: MarkerShape;
  x: number;
  y: number;
  size?: number;
  stroke: string;
  fill?: string;
  strokeWidth?: number;
}): ReactNode {
  const s = size;
  const common = { stroke, fill, strokeWidth };
  switch (shape) {
    case 'circle':
      return <circle cx={x} cy={y} r={s} {...common} />;
    case 'square':
      return <rect x={x - s} y={y - s} width={2 * s} height={2 * s} {...common} />;
    case 'triangle':
      return <polygon points={`${x},${y - s * 1.2} ${x + s * 1.1},${y + s * 0.8} ${x - s * 1.1},${y + s * 0.8}`} {...common} />;
    case 'diamond':
      return <polygon points={`${x},${y - s * 1.3} ${x + s * 1.1},${y} ${x},${y + s * 1.3} ${x - s * 1.1},${y}`} {...common} />;
  }
}
