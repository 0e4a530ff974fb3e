/**
 * The four speeds a restorer asks about (cranking, idle, mid-range, redline), setups side by side:
 * the energy stored and the energy the spark delivers with how long it lasts (what compares kinds
 * fairly, Heywood 1988, ch. 9), the voltages, and the cylinder state and ballast temperature there.
 */
import { memo, type ReactNode } from 'react';
import type { ShownPoint, ShownSetup } from '../../../electron/ipc/channels.js';
import { useGapUnit } from '../../app/units.js';
import { perSpeedFigure, perSpeedKinds, type SpeedKey } from './SetupFigures.js';
import { figureText, number, ratioText, rpmText } from './words.js';

const speeds = [
  { key: 'cranking', label: 'Cranking' },
  { key: 'idle', label: 'Idle' },
  { key: 'mid', label: 'Mid-range' },
  { key: 'redline', label: 'Redline' },
] as const;

const rows: Array<{ label: string; text: (p: ShownPoint) => string }> = [
  { label: 'Energy stored per spark', text: (p) => `${number(p.energyMj, 1)} mJ` },
  { label: 'Energy the spark delivers', text: (p) => `${number(p.sparkEnergyMj, 2)} mJ` },
  { label: 'Spark lasts', text: (p) => `${number(p.sparkDurationMs, 2)} ms` },
  { label: 'Voltage available', text: (p) => `${number(p.availableKv, 1)} kV` },
  { label: 'Voltage the plug needs', text: (p) => `${number(p.requiredKv, 1)} kV` },
  { label: 'Reserve (available ÷ needed)', text: (p) => ratioText(p.reserveRatio) },
  // A capacitive-discharge unit does not charge the coil with current, so there is nothing to show.
  { label: 'Coil current when it fires', text: (p) => (p.currentA > 0 ? `${number(p.currentA, 2)} A` : '— (none: capacitor)') },
];

export const KeyPointsTable = memo(function KeyPointsTable({ setups, margin }: { setups: readonly ShownSetup[]; margin: number }): ReactNode {
  const [unit] = useGapUnit();
  const first = setups[0];
  if (!first) return null;
  return (
    <table className="list keypoints" aria-label="Figures at cranking, idle, mid-range and redline" data-testid="key-points">
      <thead>
        <tr>
          <th scope="col">At this speed</th>
          {setups.map((s, i) => (
            <th scope="col" key={i} className="num">
              {s.kind === 'existing' ? 'Fitted now' : s.name}
            </th>
          ))}
        </tr>
      </thead>
      {speeds.map((sp) => (
        <tbody key={sp.key}>
          <tr className="speed-row">
            <th scope="rowgroup" colSpan={setups.length + 1}>
              {sp.label}, {rpmText(first.keyPoints[sp.key].rpm)}
              {sp.key === 'cranking' ? ' (on the cranking supply)' : ''}
            </th>
          </tr>
          {setups.some((s) => s.keyPoints[sp.key].noSparkReason !== null) ? (
            <tr className="no-spark-row">
              <th scope="row">Spark</th>
              {setups.map((s, i) => {
                const why = s.keyPoints[sp.key].noSparkReason;
                return (
                  <td key={i} className={why ? 'no-spark' : undefined} data-testid={why ? `no-spark-${sp.key}-${i}` : undefined}>
                    {why ?? 'Sparks'}
                  </td>
                );
              })}
            </tr>
          ) : null}
          {rows.map((r) => (
            <tr key={r.label}>
              <th scope="row">{r.label}</th>
              {setups.map((s, i) => {
                const p = s.keyPoints[sp.key];
                const short = r.label.startsWith('Reserve') && p.reserveRatio < margin;
                return (
                  <td key={i} className={`num${short ? ' short' : ''}`}>
                    {r.text(p)}
                    {short ? <span className="short-tag"> (below {number(margin, 2)})</span> : null}
                  </td>
                );
              })}
            </tr>
          ))}
          {perSpeedKinds.map((k) => {
            const figs = setups.map((s) => perSpeedFigure(s, k.key, sp.key as SpeedKey));
            if (figs.every((f) => f === null)) return null;
            return (
              <tr key={k.key} data-testid={`speed-figure-${k.key}-${sp.key}`}>
                <th scope="row">{k.label}</th>
                {figs.map((f, i) => (
                  <td key={i} className="num">
                    {f ? figureText(f.value, f.unit, unit) : '— (none)'}
                  </td>
                ))}
              </tr>
            );
          })}
        </tbody>
      ))}
    </table>
  );
});
