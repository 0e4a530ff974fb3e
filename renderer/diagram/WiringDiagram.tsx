/**
 * The plan's wiring drawn from the Diagram model as one SVG: a box per part with its label,
 * a dot per terminal with its number, and each wire as a polyline whose weight and dash say what
 * it carries, so the drawing reads on a black-and-white page (legend below it). Pure: props in,
 * markup out; presentation attributes only (the CSP forbids inline styles), so the same drawing
 * shows on screen, in the print and in the command line's HTML.
 */
import type { ReactNode } from 'react';
import { wireStyleOrder, wireStyles } from '../sheet/format.js';
import type { Diagram, DiagramPart, DiagramTerminal, DiagramWire, WireStyle } from '../sheet/model.js';

const INK = '#000000';
const PART_FONT = 13;
const TERMINAL_FONT = 11;

/** Splits a label into lines that fit `width` at `fontSize` (about 0.56 em a character). */
export function wrapLabel(label: string, width: number, fontSize = PART_FONT): string[] {
  const perLine = Math.max(6, Math.floor((width - 10) / (fontSize * 0.56)));
  const lines: string[] = [];
  let line = '';
  for (const word of label.split(/\s+/).filter(Boolean)) {
    const next = line ? `${line} ${word}` : word;
    if (next.length > perLine && line) {
      lines.push(line);
      line = word;
    } else line = next;
  }
  if (line) lines.push(line);
  return lines;
}

type Box = { x1: number; y1: number; x2: number; y2: number };
type Placed = { x: number; y: number; anchor: 'start' | 'middle' | 'end' };
const CHAR_W = 6.9; // DejaVu Sans bold at 11 px, an average character

function textBox(at: Placed, text: string): Box {
  const w = text.length * CHAR_W;
  const x1 = at.anchor === 'start' ? at.x : at.anchor === 'end' ? at.x - w : at.x - w / 2;
  return { x1, y1: at.y - TERMINAL_FONT + 1, x2: x1 + w, y2: at.y + 2 };
}
const overlap = (a: Box, b: Box): number => Math.max(0, Math.min(a.x2, b.x2) - Math.max(a.x1, b.x1)) * Math.max(0, Math.min(a.y2, b.y2) - Math.max(a.y1, b.y1));

/** Which side of its box a terminal stands on (the builder puts terminals just outside the box). */
function sideOf(t: DiagramTerminal, p: DiagramPart): 'left' | 'right' | 'top' | 'bottom' {
  const d = { left: p.x - t.x, right: t.x - (p.x + p.width), top: p.y - t.y, bottom: t.y - (p.y + p.height) };
  return (Object.entries(d) as Array<[keyof typeof d, number]>).sort((a, b) => b[1] - a[1])[0]![0];
}

/** Places for a terminal's label, best first: outside beside the dot, then inside the box near it. */
function candidates(t: DiagramTerminal, p: DiagramPart): Placed[] {
  switch (sideOf(t, p)) {
    case 'right':
      return [{ x: t.x + 5, y: t.y - 5, anchor: 'start' }, { x: t.x + 5, y: t.y + 14, anchor: 'start' }, { x: p.x + p.width - 5, y: t.y + 4, anchor: 'end' }];
    case 'left':
      return [{ x: t.x - 5, y: t.y - 5, anchor: 'end' }, { x: t.x - 5, y: t.y + 14, anchor: 'end' }, { x: p.x + 5, y: t.y + 4, anchor: 'start' }];
    case 'top':
      return [{ x: t.x + 6, y: t.y - 3, anchor: 'start' }, { x: t.x - 6, y: t.y - 3, anchor: 'end' }, { x: t.x, y: p.y + 14, anchor: 'middle' }];
    case 'bottom':
      return [{ x: t.x + 6, y: t.y + 11, anchor: 'start' }, { x: t.x - 6, y: t.y + 11, anchor: 'end' }, { x: t.x, y: p.y + p.height - 5, anchor: 'middle' }];
  }
}

/** The font size at which a part's words fit its box (13 px down to 9 px), wrapped in lines. */
function partFont(p: DiagramPart): { size: number; lines: string[] } {
  for (let size = PART_FONT; size >= 9; size--) {
    const lines = wrapLabel(p.label, p.width, size);
    const widest = Math.max(...lines.map((l) => l.length)) * size * 0.6;
    if (widest <= p.width - 6 && lines.length * (size + 2) <= Math.max(p.height, 30)) return { size, lines };
  }
  return { size: 9, lines: wrapLabel(p.label, p.width, 9) };
}

function partLabelBox(p: DiagramPart): Box {
  const { size, lines } = partFont(p);
  const w = Math.max(...lines.map((l) => l.length)) * size * 0.6;
  const h = lines.length * (size + 2);
  const top = p.kind === 'earth' ? p.y + 34 - size : p.y + p.height / 2 - h / 2;
  return { x1: p.x + p.width / 2 - w / 2, y1: top, x2: p.x + p.width / 2 + w / 2, y2: top + h };
}

/**
 * Every terminal label's place, chosen greedily so that it covers no other label, no part's
 * words, no box (outside places) and no wire. A label that only repeats its part's own words is
 * left off (the dot stays).
 */
export function placeLabels(d: Diagram): { terminals: Map<string, Placed | null>; wires: Map<string, Placed> } {
  const taken: Box[] = d.parts.map(partLabelBox);
  const boxes = d.parts.filter((p) => p.kind !== 'earth').map((p) => ({ id: p.id, box: { x1: p.x, y1: p.y, x2: p.x + p.width, y2: p.y + p.height } }));
  const wires: Box[] = d.wires.flatMap((w) =>
    w.path.slice(1).map((b, i) => {
      const a = w.path[i]!;
      return { x1: Math.min(a.x, b.x) - 1.5, y1: Math.min(a.y, b.y) - 1.5, x2: Math.max(a.x, b.x) + 1.5, y2: Math.max(a.y, b.y) + 1.5 };
    }),
  );
  const out = new Map<string, Placed | null>();
  for (const p of d.parts) {
    for (const t of p.terminals) {
      const key = `${p.id}.${t.id}`;
      if (t.label.trim().toLowerCase() === p.label.trim().toLowerCase()) {
        out.set(key, null);
        continue;
      }
      let best: { at: Placed; cost: number } | null = null;
      for (const [i, at] of candidates(t, p).entries()) {
        const b = textBox(at, t.label);
        const base = i * 0.5;
        let cost = base;
        for (const o of taken) cost += overlap(b, o);
        for (const o of wires) cost += overlap(b, o);
        for (const o of boxes) if (!(i === 2 && o.id === p.id)) cost += overlap(b, o.box);
        if (b.x1 < 0 || b.x2 > d.width || b.y1 < 0 || b.y2 > d.height) cost += 1000;
        if (!best || cost < best.cost) best = { at, cost };
        if (cost === base) break;
      }
      out.set(key, best!.at);
      taken.push(textBox(best!.at, t.label));
    }
  }
  // The words beside a wire: by the middle of its longest run, on whichever side is clear.
  const wireOut = new Map<string, Placed>();
  const terminalWords = new Map<string, string>(d.parts.flatMap((p) => p.terminals.map((t): [string, string] => [`${p.id}.${t.id}`, t.label.trim().toLowerCase()])));
  for (const w of d.wires) {
    // Words that only repeat an end's terminal label are left off.
    const said = w.label.trim().toLowerCase();
    if (said === terminalWords.get(w.from) || said === terminalWords.get(w.to)) continue;
    const spot = w.label ? labelSpot(w) : null;
    if (!spot) continue;
    const tries: Placed[] = spot.vertical
      ? [{ x: spot.x + 7, y: spot.y + 4, anchor: 'start' }, { x: spot.x - 7, y: spot.y + 4, anchor: 'end' }]
      : [{ x: spot.x, y: spot.y - 6, anchor: 'middle' }, { x: spot.x, y: spot.y + 15, anchor: 'middle' }];
    let best: { at: Placed; cost: number } | null = null;
    for (const at of tries) {
      const b = textBox(at, w.label);
      let cost = 0;
      for (const o of taken) cost += overlap(b, o);
      for (const o of boxes) cost += overlap(b, o.box);
      if (!best || cost < best.cost) best = { at, cost };
    }
    wireOut.set(w.id, best!.at);
    taken.push(textBox(best!.at, w.label));
  }
  return { terminals: out, wires: wireOut };
}

/** The short lead from the box's edge out to the terminal's dot. */
function stub(t: DiagramTerminal, p: DiagramPart): { x1: number; y1: number; x2: number; y2: number } {
  switch (sideOf(t, p)) {
    case 'right':
      return { x1: p.x + p.width, y1: t.y, x2: t.x, y2: t.y };
    case 'left':
      return { x1: p.x, y1: t.y, x2: t.x, y2: t.y };
    case 'top':
      return { x1: t.x, y1: p.y, x2: t.x, y2: t.y };
    case 'bottom':
      return { x1: t.x, y1: p.y + p.height, x2: t.x, y2: t.y };
  }
}

/** The earth symbol: a stem and three bars, narrowing. */
function EarthSymbol({ p }: { p: DiagramPart }): ReactNode {
  const cx = p.x + p.width / 2;
  const top = p.y + 2;
  const w = Math.min(p.width, 28);
  return (
    <g data-kind="earth">
      <line x1={cx} y1={p.y} x2={cx} y2={top + 8} stroke={INK} strokeWidth={1.8} />
      <line x1={cx - w / 2} y1={top + 8} x2={cx + w / 2} y2={top + 8} stroke={INK} strokeWidth={2} />
      <line x1={cx - w / 3} y1={top + 13} x2={cx + w / 3} y2={top + 13} stroke={INK} strokeWidth={2} />
      <line x1={cx - w / 6} y1={top + 18} x2={cx + w / 6} y2={top + 18} stroke={INK} strokeWidth={2} />
    </g>
  );
}

function Part({ p, labels }: { p: DiagramPart; labels: Map<string, Placed | null> }): ReactNode {
  const { size, lines } = partFont(p);
  const lineHeight = size + 2;
  const earth = p.kind === 'earth';
  const firstY = earth ? p.y + 34 : p.y + p.height / 2 - ((lines.length - 1) * lineHeight) / 2 + size * 0.35;
  return (
    <g className={`diagram-part part-${p.kind}`} data-part={p.id}>
      {earth ? <EarthSymbol p={p} /> : <rect x={p.x} y={p.y} width={p.width} height={p.height} rx={4} fill="#ffffff" stroke={INK} strokeWidth={1.6} />}
      <text className="part-label" x={p.x + p.width / 2} y={firstY} textAnchor="middle" fontSize={size} fill={INK}>
        {lines.map((l, i) => (
          <tspan key={i} x={p.x + p.width / 2} dy={i === 0 ? 0 : lineHeight}>
            {l}
          </tspan>
        ))}
      </text>
      {p.terminals.map((t) => {
        const at = labels.get(`${p.id}.${t.id}`);
        const s = stub(t, p);
        return (
          <g key={t.id} className="diagram-terminal" data-terminal={`${p.id}.${t.id}`}>
            {earth ? null : <line x1={s.x1} y1={s.y1} x2={s.x2} y2={s.y2} stroke={INK} strokeWidth={1.6} />}
            <circle cx={t.x} cy={t.y} r={3.4} fill={INK} />
            {at ? (
              <text x={at.x} y={at.y} textAnchor={at.anchor} fontSize={TERMINAL_FONT} fontWeight={700} fill={INK} className="terminal-label">
                {t.label}
              </text>
            ) : null}
          </g>
        );
      })}
    </g>
  );
}

const points = (w: DiagramWire): string => w.path.map((pt) => `${pt.x},${pt.y}`).join(' ');

/** The middle of the wire's longest straight run: where its words go. */
function labelSpot(w: DiagramWire): { x: number; y: number; vertical: boolean } | null {
  let best: { x: number; y: number; vertical: boolean; len: number } | null = null;
  for (let i = 1; i < w.path.length; i++) {
    const a = w.path[i - 1]!;
    const b = w.path[i]!;
    const len = Math.hypot(b.x - a.x, b.y - a.y);
    if (!best || len > best.len) best = { x: (a.x + b.x) / 2, y: (a.y + b.y) / 2, vertical: Math.abs(b.x - a.x) < Math.abs(b.y - a.y), len };
  }
  return best;
}

/** One wire: its line (a hollow double line for high tension) and its words. */
function Wire({ w, at }: { w: DiagramWire; at: Placed | undefined }): ReactNode {
  const s = wireStyles[w.style] ?? wireStyles.signal;
  return (
    <g className={`diagram-wire wire-${w.style}`} data-wire={w.id} data-style={w.style}>
      <polyline points={points(w)} fill="none" stroke={INK} strokeWidth={s.width} strokeDasharray={s.dash || undefined} strokeLinejoin="round" strokeLinecap={s.dash ? 'butt' : 'round'} className="wire-line" />
      {s.hollow ? <polyline points={points(w)} fill="none" stroke="#ffffff" strokeWidth={s.width - 2.6} strokeLinejoin="round" className="wire-core" /> : null}
      {at && w.label ? (
        <text x={at.x} y={at.y} textAnchor={at.anchor} fontSize={11} fontStyle="italic" fill={INK} paintOrder="stroke" stroke="#ffffff" strokeWidth={3} className="wire-label">
          {w.label}
        </text>
      ) : null}
    </g>
  );
}

/** A short sample of a wire style for the legend. */
export function WireSample({ style }: { style: WireStyle }): ReactNode {
  const s = wireStyles[style];
  return (
    <svg className="wire-sample" viewBox="0 0 48 12" width={48} height={12} aria-hidden="true" focusable="false">
      <line x1={2} y1={6} x2={46} y2={6} stroke={INK} strokeWidth={s.width} strokeDasharray={s.dash || undefined} className={`wire-line wire-${style}`} />
      {s.hollow ? <line x1={2} y1={6} x2={46} y2={6} stroke="#ffffff" strokeWidth={s.width - 2.6} /> : null}
    </svg>
  );
}

export function WiringDiagram({ diagram, title = 'Wiring diagram for this plan', idPrefix = 'wd' }: { diagram: Diagram; title?: string; idPrefix?: string }): ReactNode {
  const used = wireStyleOrder.filter((s) => diagram.wires.some((w) => w.style === s));
  const labels = placeLabels(diagram);
  const titleId = `${idPrefix}-title`;
  const descId = `${idPrefix}-desc`;
  return (
    <figure className="wiring-diagram" data-testid="wiring-diagram">
      <svg className="diagram-svg" viewBox={`0 0 ${diagram.width} ${diagram.height}`} role="img" aria-labelledby={`${titleId} ${descId}`} xmlns="http://www.w3.org/2000/svg" fontFamily="DejaVu Sans, Arial, sans-serif">
        <title id={titleId}>{title}</title>
        <desc id={descId}>
          {diagram.parts.map((p) => p.label).join('; ')}. {diagram.wires.length} wires; the legend below says what each kind of line carries.
        </desc>
        <g className="diagram-wires">
          {diagram.wires.map((w) => (
            <Wire key={w.id} w={w} at={labels.wires.get(w.id)} />
          ))}
        </g>
        <g className="diagram-parts">
          {diagram.parts.map((p) => (
            <Part key={p.id} p={p} labels={labels.terminals} />
          ))}
        </g>
      </svg>
      <figcaption>
        {used.length > 0 ? (
          <ul className="diagram-legend" aria-label="What each kind of line carries">
            {used.map((s) => (
              <li key={s}>
                <WireSample style={s} />
                <span>
                  {wireStyles[s].words} <span className="legend-line">({wireStyles[s].line})</span>
                </span>
              </li>
            ))}
          </ul>
        ) : null}
        {diagram.notes.length > 0 ? (
          <ul className="diagram-notes">
            {diagram.notes.map((n, i) => (
              <li key={i}>{n}</li>
            ))}
          </ul>
        ) : null}
      </figcaption>
    </figure>
  );
}
