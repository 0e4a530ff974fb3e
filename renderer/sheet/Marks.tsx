/**
 * The sheet's small marks, drawn as SVG so they print without "background graphics": a reading's
 * place against its band (low: a wedge pointing down; high: pointing up; in range: a ring) and the
 * caution mark (a triangle with "!"), and the verdict's spark-gap mark. Each always travels with
 * words; the shape is the second channel and the colour the third.
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

/**
 * The verdict colours, chosen to differ in lightness (so they stay apart in grey and for red-green
 * colour blindness): a mid blue, a light ochre, a deep crimson. Carried by the mark itself, so the
 * screen, the command line's HTML and the print all show the same.
 */
export const verdictColours = { pass: '#2a7fc0', caution: '#e0a000', fail: '#6b1020' } as const;
const electrode = '#3a434b';

/**
 * The verdict as a spark plug's gap seen from the side: the centre electrode above, the earth
 * strap below, and what happens between them. Fine: a full spark jumps the gap (a solid bolt with
 * rays). Take care: a thin broken spark that barely makes it. Not like this: no spark, the gap
 * crossed out. Drawn as filled SVG shapes so it prints without background graphics.
 */
export function VerdictMark({ verdict, size = 22 }: { verdict: 'pass' | 'caution' | 'fail'; size?: number }): ReactNode {
  const c = verdictColours[verdict];
  return (
    <svg className={`verdict-mark mark-${verdict}`} viewBox="0 0 24 24" width={size} height={size} aria-hidden="true" focusable="false" data-mark={verdict}>
      {/* insulator nose and centre electrode */}
      <polygon points="7.5,0 16.5,0 14.8,2.4 9.2,2.4" fill={electrode} />
      <rect x={10.3} y={2.4} width={3.4} height={3.8} fill={electrode} />
      {/* earth strap, bent in under the centre electrode */}
      <path d="M3.2 24 V20.3 H15" fill="none" stroke={electrode} strokeWidth={2.4} strokeLinejoin="round" />
      {verdict === 'pass' ? (
        <>
          <polygon points="15.2,6.4 7.6,13.4 11.6,13.4 8.6,19.2 17.2,11.4 13.2,11.4 16.8,6.4" fill={c} />
          <path d="M18.6 8.6 L22.6 6.8 M19 14.2 L23 15.6 M5.6 8.8 L1.6 7 M5.2 14.6 L1.2 16" stroke={c} strokeWidth={1.9} strokeLinecap="round" />
        </>
      ) : null}
      {verdict === 'caution' ? (
        <polyline points="12,6.6 9,11.2 14.2,13.2 11,18.8" fill="none" stroke={c} strokeWidth={2.4} strokeDasharray="3 2.2" strokeLinecap="round" strokeLinejoin="round" />
      ) : null}
      {verdict === 'fail' ? <path d="M7.4 8.6 L16.6 17.8 M16.6 8.6 L7.4 17.8" stroke={c} strokeWidth={3} strokeLinecap="round" /> : null}
    </svg>
  );
}
