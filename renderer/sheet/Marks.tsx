/**
 * The sheet's small marks, drawn as SVG so they print without "background graphics": a reading's
 * place against its band (low: a wedge pointing down; high: pointing up; in range: a ring) and the
 * caution mark (a triangle with "!"). Each always travels with words; the shape is the second
 * channel and the colour (set by the class on screen) the third.
 */
import type { ReactNode } from 'react';
import type { Band } from './model.js';

export function BandMark({ band }: { band: Band }): ReactNode {
  return (
    <svg className={`band-mark mark-${band}`} viewBox="0 0 16 16" width={16} height={16} aria-hidden="true" focusable="false">
      {band === 'low' ? <polygon points="1,2 15,2 15,7 8,15 1,7" fill="currentColor" /> : null}
      {band === 'high' ? <polygon points="8,1 15,9 15,14 1,14 1,9" fill="currentColor" /> : null}
      {band === 'in' ? <circle cx={8} cy={8} r={5.5} fill="none" stroke="currentColor" strokeWidth={3} /> : null}
    </svg>
  );
}

export function CautionMark(): ReactNode {
  return (
    <svg className="caution-mark" viewBox="0 0 20 18" width={20} height={18} aria-hidden="true" focusable="false">
      <polygon points="10,1 19,17 1,17" fill="currentColor" />
      <text x={10} y={15} textAnchor="middle" fontSize={11} fontWeight={700} fill="#ffffff" fontFamily="DejaVu Sans, Arial, sans-serif">
        !
      </text>
    </svg>
  );
}

/** The verdict's shape as the weighing screen draws it (circle, triangle, octagon), in outline so it prints. */
export function VerdictMark({ verdict }: { verdict: 'pass' | 'caution' | 'fail' }): ReactNode {
  return (
    <svg className={`verdict-mark mark-${verdict}`} viewBox="0 0 20 20" width={20} height={20} aria-hidden="true" focusable="false">
      {verdict === 'pass' ? (
        <>
          <circle cx={10} cy={10} r={8.5} fill="none" stroke="currentColor" strokeWidth={2.2} />
          <polyline points="5.5,10.5 8.8,13.6 14.5,6.8" fill="none" stroke="currentColor" strokeWidth={2.4} />
        </>
      ) : null}
      {verdict === 'caution' ? (
        <>
          <polygon points="10,1.5 18.8,18 1.2,18" fill="none" stroke="currentColor" strokeWidth={2.2} strokeLinejoin="round" />
          <line x1={10} y1={7} x2={10} y2={12.5} stroke="currentColor" strokeWidth={2.4} />
          <circle cx={10} cy={15.2} r={1.3} fill="currentColor" />
        </>
      ) : null}
      {verdict === 'fail' ? (
        <>
          <polygon points="6,1.2 14,1.2 18.8,6 18.8,14 14,18.8 6,18.8 1.2,14 1.2,6" fill="none" stroke="currentColor" strokeWidth={2.2} />
          <path d="M6.5 6.5 L13.5 13.5 M13.5 6.5 L6.5 13.5" stroke="currentColor" strokeWidth={2.4} />
        </>
      ) : null}
    </svg>
  );
}
