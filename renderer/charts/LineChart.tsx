/**
 * A small vector line chart: several lines over one shared x column, an optional shaded band,
 * ticks on both axes and a legend in words. Pointing at the chart, or focusing it and using the
 * arrow keys, reads every line's value at that x into a text line below (announced politely to
 * screen readers). Everything is SVG attributes and classes, so it prints sharp and the CSP holds.
 */
import { useId, useMemo, useRef, useState, type KeyboardEvent, type PointerEvent, type ReactNode } from 'react';
import { numberText } from '../app/number-text.js';
import { Marker } from './Marker.js';
import type { MarkerShape } from './palette.js';
import { bandFill, requiredStyle } from './palette.js';
import { bandPath, linearScale, linePath, markerIndices, maxOf, nearestIndex, niceTicks, tickDecimals } from './scale.js';

export type LineStyle = { stroke: string; dash: string; width: number; marker?: MarkerShape; dashWords?: string };

export type ChartLine = {
  id: string;
  label: string;
  y: readonly number[];
  style: LineStyle;
  /** Points before this index are drawn as lone marks, not joined (the cranking point). */
  lineFrom?: number;
};

export type ChartBand = { label: string; lower: readonly number[]; upper: readonly number[]; from?: number };

type Props = {
  title: string;
  description: string;
  x: readonly number[];
  xLabel: string;
  xUnit: string;
  yLabel: string;
  yUnit: string;
  lines: readonly ChartLine[];
  band?: ChartBand;
  /** Decimals in the read-out values. */
  digits?: number;
  testId?: string;
};

const W = 520;
const H = 300;
const M = { left: 54, right: 14, top: 14, bottom: 44 };


export function LineChart({ title, description, x, xLabel, xUnit, yLabel, yUnit, lines, band, digits = 1, testId }: Props): ReactNode {
  const [index, setIndex] = useState<number | null>(null);
  const svgRef = useRef<SVGSVGElement>(null);
  const titleId = useId();
  const descId = useId();
  const readId = useId();

  const geom = useMemo(() => {
    const xt = niceTicks(x[0] ?? 0, x[x.length - 1] ?? 1, 7);
    const top = maxOf([...lines.map((l) => l.y), ...(band ? [band.upper] : [])]);
    const yt = niceTicks(0, top > 0 ? top * 1.04 : 1, 6);
    // The x axis runs exactly over the data; ticks outside it are dropped.
    const x0 = x[0] ?? 0;
    const x1 = x[x.length - 1] ?? 1;
    const sx = linearScale(x0, x1, M.left, W - M.right);
    const sy = linearScale(0, yt.max, H - M.bottom, M.top);
    return { xt: { ...xt, values: xt.values.filter((v) => v >= x0 - 1e-9 && v <= x1 + 1e-9) }, yt, sx, sy };
  }, [x, lines, band]);
  const { xt, yt, sx, sy } = geom;

  const pick = (clientX: number): void => {
    const svg = svgRef.current;
    if (!svg || x.length === 0) return;
    const rect = svg.getBoundingClientRect();
    if (rect.width <= 0) return;
    const vx = ((clientX - rect.left) * W) / rect.width;
    setIndex(nearestIndex(x, sx.invert(vx)));
  };
  const onPointerMove = (e: PointerEvent<SVGSVGElement>): void => pick(e.clientX);
  const onKeyDown = (e: KeyboardEvent<SVGSVGElement>): void => {
    const last = x.length - 1;
    const at = index ?? 0;
    const step = e.shiftKey ? 10 : 1;
    let next: number | null = null;
    if (e.key === 'ArrowRight' || e.key === 'ArrowUp') next = Math.min(last, at + (index === null ? 0 : step));
    else if (e.key === 'ArrowLeft' || e.key === 'ArrowDown') next = Math.max(0, at - (index === null ? 0 : step));
    else if (e.key === 'Home') next = 0;
    else if (e.key === 'End') next = last;
    else if (e.key === 'Escape') return setIndex(null);
    if (next !== null) {
      e.preventDefault();
      setIndex(next);
    }
  };

  const xi = index !== null ? x[index] : undefined;
  const readout =
    index === null || xi === undefined
      ? 'Point at the chart, or focus it and use the arrow keys, to read the values at one engine speed.'
      : `At ${numberText(xi, 0)} ${xUnit}: ${[
          ...lines.map((l) => `${l.label} ${numberText(l.y[index] ?? NaN, digits)} ${yUnit}`),
          ...(band ? [`${band.label} ${numberText(band.lower[index] ?? NaN, digits)} to ${numberText(band.upper[index] ?? NaN, digits)} ${yUnit}`] : []),
        ].join('; ')}.`;

  return (
    <figure className="chart" data-testid={testId}>
      <figcaption>
        <span className="chart-title" id={titleId}>
          {title}
        </span>
        <span className="chart-desc" id={descId}>
          {description}
        </span>
      </figcaption>
      <svg
        ref={svgRef}
        viewBox={`0 0 ${W} ${H}`}
        className="chart-svg"
        role="group"
        tabIndex={0}
        aria-labelledby={titleId}
        aria-describedby={`${descId} ${readId}`}
        onPointerMove={onPointerMove}
        onPointerDown={onPointerMove}
        onPointerLeave={() => setIndex(null)}
        onKeyDown={onKeyDown}
        onBlur={() => setIndex(null)}
      >
        <rect x={M.left} y={M.top} width={W - M.left - M.right} height={H - M.top - M.bottom} fill="#ffffff" stroke="#9aa3ab" strokeWidth={1} />
        {yt.values.map((v) => (
          <g key={`y${v}`}>
            <line x1={M.left} x2={W - M.right} y1={sy.map(v)} y2={sy.map(v)} stroke="#e3e6e8" strokeWidth={1} />
            <text x={M.left - 6} y={sy.map(v) + 4} textAnchor="end" className="tick">
              {numberText(v, tickDecimals(yt.step))}
            </text>
          </g>
        ))}
        {xt.values.map((v) => (
          <g key={`x${v}`}>
            <line x1={sx.map(v)} x2={sx.map(v)} y1={H - M.bottom} y2={H - M.bottom + 5} stroke="#6b747c" strokeWidth={1} />
            <text x={sx.map(v)} y={H - M.bottom + 18} textAnchor="middle" className="tick">
              {numberText(v, tickDecimals(xt.step))}
            </text>
          </g>
        ))}
        <text x={(M.left + W - M.right) / 2} y={H - 6} textAnchor="middle" className="axis-label">
          {xLabel} ({xUnit})
        </text>
        <text x={14} y={(M.top + H - M.bottom) / 2} textAnchor="middle" transform={`rotate(-90 14 ${(M.top + H - M.bottom) / 2})`} className="axis-label">
          {yLabel} ({yUnit})
        </text>
        {band ? <path d={bandPath(x, band.lower, band.upper, sx, sy, band.from ?? 0)} fill={bandFill} stroke="none" data-testid="margin-band" /> : null}
        {lines.map((l) => {
          const from = l.lineFrom ?? 0;
          const marks = l.style.marker ? markerIndices(x.length, 8, from, lines.indexOf(l) * 2) : [];
          return (
            <g key={l.id} data-series={l.id} aria-hidden="true">
              <path d={linePath(x, l.y, sx, sy, from)} fill="none" stroke={l.style.stroke} strokeWidth={l.style.width} strokeDasharray={l.style.dash || undefined} strokeLinejoin="round" />
              {l.style.marker
                ? [...Array.from({ length: from }, (_, i) => i), ...marks].map((i) =>
                    Number.isFinite(l.y[i] ?? NaN) ? <Marker key={i} shape={l.style.marker!} x={sx.map(x[i]!)} y={sy.map(l.y[i]!)} stroke={l.style.stroke} /> : null,
                  )
                : null}
            </g>
          );
        })}
        {index !== null && xi !== undefined ? (
          <g aria-hidden="true" className="chart-cursor">
            <line x1={sx.map(xi)} x2={sx.map(xi)} y1={M.top} y2={H - M.bottom} stroke="#d48a00" strokeWidth={1.5} />
            {lines.map((l) =>
              Number.isFinite(l.y[index] ?? NaN) ? (
                <Marker key={l.id} shape={l.style.marker ?? 'circle'} x={sx.map(xi)} y={sy.map(l.y[index]!)} size={5} stroke={l.style.stroke} fill={l.style.stroke} />
              ) : null,
            )}
          </g>
        ) : null}
        {/* Takes the pointer over the whole plot so hovering anywhere reads the nearest speed. */}
        <rect x={M.left} y={M.top} width={W - M.left - M.right} height={H - M.top - M.bottom} fill="transparent" stroke="none" />
      </svg>
      <ul className="legend">
        {lines.map((l) => (
          <li key={l.id}>
            <LegendSwatch style={l.style} />
            <span>{l.label}</span>
            {l.style.dashWords ? <span className="visually-hidden"> ({l.style.dashWords})</span> : null}
          </li>
        ))}
        {band ? (
          <li>
            <svg className="swatch" viewBox="0 0 36 12" aria-hidden="true">
              <rect x={0} y={1} width={36} height={10} fill={bandFill} stroke={requiredStyle.stroke} strokeWidth={0.6} />
            </svg>
            <span>{band.label}</span>
          </li>
        ) : null}
      </ul>
      <p className="chart-readout" id={readId} aria-live="polite" data-testid={testId ? `${testId}-readout` : undefined}>
        {readout}
      </p>
    </figure>
  );
}

function LegendSwatch({ style }: { style: LineStyle }): ReactNode {
  return (
    <svg className="swatch" viewBox="0 0 36 12" aria-hidden="true">
      <line x1={1} x2={35} y1={6} y2={6} stroke={style.stroke} strokeWidth={style.width} strokeDasharray={style.dash || undefined} />
      {style.marker ? <Marker shape={style.marker} x={18} y={6} size={3.4} stroke={style.stroke} /> : null}
    </svg>
  );
}
