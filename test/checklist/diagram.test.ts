/**
 * The wiring diagram of every kind of plan, checked as geometry: wires end on real terminals and
 * start and end at their coordinates, run only horizontally or vertically, stay out of the part
 * boxes and inside the drawing; parts do not overlap; the DIN 72552 numbers are on the joints
 * (30, 31, 15, 15a, 1, 4); a plug per cylinder, top to bottom in the engine's firing order.
 */
import { createElement } from 'react';
import { renderToStaticMarkup } from 'react-dom/server';
import { describe, expect, it } from 'vitest';
import { buildSheet } from '../../electron/checklist/index.js';
import { diagramSvg } from '../../electron/cli/sheet-html.js';
import { WiringDiagram } from '../../renderer/diagram/WiringDiagram.js';
import { wireStyleOrder, wireStyles } from '../../renderer/sheet/format.js';
import type { Diagram, DiagramPart } from '../../electron/checklist/types.js';
import { allCases } from './demo-sheets.js';

const cases = allCases();

type Pt = { x: number; y: number };

function terminal(d: Diagram, ref: string): Pt | undefined {
  const [pid, tid] = ref.split('.');
  return d.parts.find((p) => p.id === pid)?.terminals.find((t) => t.id === tid);
}

/** True when the segment a-b (horizontal or vertical) has a point strictly inside the box. */
function crossesBox(a: Pt, b: Pt, p: DiagramPart): boolean {
  const x0 = p.x, x1 = p.x + p.width, y0 = p.y, y1 = p.y + p.height;
  if (a.y === b.y) {
    const lo = Math.min(a.x, b.x), hi = Math.max(a.x, b.x);
    return a.y > y0 && a.y < y1 && hi > x0 && lo < x1;
  }
  const lo = Math.min(a.y, b.y), hi = Math.max(a.y, b.y);
  return a.x > x0 && a.x < x1 && hi > y0 && lo < y1;
}

const overlaps = (p: DiagramPart, q: DiagramPart): boolean => p.x < q.x + q.width && q.x < p.x + p.width && p.y < q.y + q.height && q.y < p.y + p.height;

describe('the wiring diagram', () => {
  for (const c of cases) {
    describe(c.label, () => {
      const d = c.sheet.diagram;
      const labels = d.parts.flatMap((p) => p.terminals.map((t) => t.label));
      it('has a coordinate box of about a page width (1000 x 620)', () => {
        expect(d.width).toBe(1000);
        expect(d.height).toBe(620);
      });
      it('keeps every part, terminal and wire inside the box', () => {
        for (const p of d.parts) {
          expect(p.x >= 0 && p.y >= 0 && p.x + p.width <= d.width && p.y + p.height <= d.height, p.id).toBe(true);
          for (const t of p.terminals) expect(t.x >= 0 && t.y >= 0 && t.x <= d.width && t.y <= d.height, `${p.id}.${t.id}`).toBe(true);
        }
        for (const w of d.wires) for (const pt of w.path) expect(pt.x >= 0 && pt.y >= 0 && pt.x <= d.width && pt.y <= d.height, w.id).toBe(true);
      });
      it('has parts that do not overlap, with unique ids and labelled terminals', () => {
        expect(new Set(d.parts.map((p) => p.id)).size).toBe(d.parts.length);
        for (let i = 0; i < d.parts.length; i++) for (let j = i + 1; j < d.parts.length; j++) expect(overlaps(d.parts[i]!, d.parts[j]!), `${d.parts[i]!.id} / ${d.parts[j]!.id}`).toBe(false);
        for (const l of labels) expect(l.trim().length).toBeGreaterThan(0);
      });
      it('has wires from terminal to terminal, horizontal and vertical legs only, clear of every part box', () => {
        expect(new Set(d.wires.map((w) => w.id)).size).toBe(d.wires.length);
        for (const w of d.wires) {
          const a = terminal(d, w.from);
          const b = terminal(d, w.to);
          expect(a, `${w.id} from ${w.from}`).toBeDefined();
          expect(b, `${w.id} to ${w.to}`).toBeDefined();
          expect(w.path[0]).toEqual({ x: a!.x, y: a!.y });
          expect(w.path[w.path.length - 1]).toEqual({ x: b!.x, y: b!.y });
          expect(w.path.length).toBeGreaterThanOrEqual(2);
          for (let i = 1; i < w.path.length; i++) {
            const p = w.path[i - 1]!, q = w.path[i]!;
            expect(p.x === q.x || p.y === q.y, `${w.id} leg ${i} is diagonal`).toBe(true);
            expect(p.x === q.x && p.y === q.y, `${w.id} leg ${i} has no length`).toBe(false);
            for (const part of d.parts) expect(crossesBox(p, q, part), `${w.id} leg ${i} passes through ${part.id}`).toBe(false);
          }
        }
      });
      it('has no two wires running along the same line (they may only cross)', () => {
        const legs = d.wires.flatMap((w) => w.path.slice(1).map((q, i) => ({ id: w.id, a: w.path[i]!, b: q })));
        for (let i = 0; i < legs.length; i++) {
          for (let j = i + 1; j < legs.length; j++) {
            const s = legs[i]!, t = legs[j]!;
            if (s.id === t.id) continue;
            const sameH = s.a.y === s.b.y && t.a.y === t.b.y && s.a.y === t.a.y && Math.min(Math.max(s.a.x, s.b.x), Math.max(t.a.x, t.b.x)) > Math.max(Math.min(s.a.x, s.b.x), Math.min(t.a.x, t.b.x));
            const sameV = s.a.x === s.b.x && t.a.x === t.b.x && s.a.x === t.a.x && Math.min(Math.max(s.a.y, s.b.y), Math.max(t.a.y, t.b.y)) > Math.max(Math.min(s.a.y, s.b.y), Math.min(t.a.y, t.b.y));
            expect(sameH || sameV, `${s.id} runs along ${t.id}`).toBe(false);
          }
        }
      });
      it('prints the DIN 72552 numbers 30, 31, 15, 1, 4 (and 15a with a ballast) on the joints', () => {
        for (const n of ['30', '31', '15', '1', '4']) expect(labels.some((l) => l === n || l.startsWith(`${n} `)), n).toBe(true);
        expect(labels.some((l) => l === '15a' || l.startsWith('15a ')), '15a').toBe(c.input.setup.ballast !== null);
      });
      it('draws one plug per cylinder, top to bottom in the firing order, each on its own lead from the cap', () => {
        const plugs = d.parts.filter((p) => p.kind === 'plug').sort((p, q) => p.y - q.y);
        const order = c.engine.firingOrder.split('-').map(Number);
        expect(plugs.map((p) => p.label)).toEqual(order.map((n) => `Cyl ${n}`));
        for (const n of order) expect(d.wires.some((w) => w.from === `distributor.cyl-${n}` && w.to === `plug-${n}.in` && w.style === 'high-tension')).toBe(true);
        expect(d.wires.some((w) => w.from === 'coil.4' && w.to === 'distributor.centre')).toBe(true);
      });
      it('shows the parts this plan has and none it does not', () => {
        const kinds = new Set(d.parts.map((p) => p.kind));
        const s = c.input.setup;
        const module = s.module !== null;
        expect(kinds.has('module')).toBe(module);
        expect(kinds.has('ballast')).toBe(s.ballast !== null);
        expect(kinds.has('condenser')).toBe(!module);
        expect(kinds.has('pickup')).toBe(s.switching === 'breakerless-fixed-duty' || s.switching === 'breakerless-current-limited');
        expect(kinds.has('starter-solenoid')).toBe(s.ballast !== null && s.crankingBypass);
        expect(kinds.has('tach-adaptor')).toBe(c.sheet.stages.some((st) => st.steps.some((x) => x.key === 'fit.tach-adaptor')));
        const bypass = d.wires.find((w) => w.id === 'bypass');
        if (kinds.has('starter-solenoid')) {
          expect(bypass?.style).toBe('cranking');
          expect(bypass?.label).toBe('only while cranking');
          expect(bypass?.to).toBe('coil.15');
        } else expect(bypass).toBeUndefined();
        if (module) {
          expect(d.wires.some((w) => w.from === 'module.output' && w.to === 'coil.1')).toBe(true);
          expect(d.wires.some((w) => w.to === 'module.supply')).toBe(true);
          expect(d.wires.some((w) => w.from === 'module.earth' && w.style === 'earth')).toBe(true);
          expect(d.notes.join(' ')).toMatch(/removed/);
        } else expect(d.wires.some((w) => w.from === 'points.lt' && w.to === 'coil.1')).toBe(true);
      });
      it('says the earth polarity in words under the drawing', () => {
        expect(d.notes[0]).toMatch(c.engine.earthPolarity === 'positive' ? /^Positive earth/ : /^Negative earth/);
      });
      it('is the same drawing every time', () => {
        expect(buildSheet(c.input).diagram).toEqual(d);
      });
    });
  }

  it('handles up to 16 cylinders inside the box (a made-up firing order on the white car)', () => {
    const c = cases.find((x) => x.engine.cylinders === 8)!;
    const order = Array.from({ length: 16 }, (_, i) => i + 1);
    const sheet = buildSheet({ ...c.input, engine: { ...c.input.engine, cylinders: 16 }, about: { ...c.input.about, firingOrder: order.join('-') } });
    const plugs = sheet.diagram.parts.filter((p) => p.kind === 'plug');
    expect(plugs.length).toBe(16);
    for (const p of sheet.diagram.parts) expect(p.y + p.height).toBeLessThanOrEqual(620);
    for (let i = 0; i < plugs.length; i++) for (let j = i + 1; j < plugs.length; j++) expect(overlaps(plugs[i]!, plugs[j]!)).toBe(false);
  });
});

/**
 * Black and white: the drawing must read on a monochrome printer and to a colour-blind eye, so the
 * kinds of wire are told apart by line alone and nothing is drawn in a colour or a grey.
 *
 * Told apart: two styles differ in being hollow, or in their dash pattern (solid, or a different
 * number of dash entries, or a first dash at least sqrt 2 longer), or else in width by at least a
 * factor of sqrt 2: the step between neighbouring line widths in ISO 128-20's series (0.25, 0.35,
 * 0.5, 0.7, 1 mm; from memory), the smallest difference a drawing standard relies on.
 *
 * Colours: SVG 1.1, chapter 11 "Painting", paints with `fill` and `stroke` (and `color`,
 * `stop-color`, `flood-color`, `lighting-color`); CSS colour keywords: black = #000000,
 * white = #ffffff. Only those two, `none` and `currentColor` may appear, with no opacity (a
 * half-opaque black prints grey) and no style attribute or element that could set another.
 */
describe('the wiring diagram in black and white', () => {
  const SQRT2 = Math.SQRT2;
  const dashes = (d: string): number[] => d.trim().split(/[\s,]+/).filter(Boolean).map(Number);
  function apart(a: (typeof wireStyles)[keyof typeof wireStyles], b: (typeof wireStyles)[keyof typeof wireStyles]): string | null {
    if (a.hollow !== b.hollow) return 'hollow';
    const da = dashes(a.dash);
    const db = dashes(b.dash);
    if ((da.length === 0) !== (db.length === 0)) return 'solid against dashed';
    if (da.length !== db.length) return 'dash pattern';
    if (da.length > 0 && Math.max(da[0]!, db[0]!) / Math.min(da[0]!, db[0]!) >= SQRT2) return 'dash length';
    if (Math.max(a.width, b.width) / Math.min(a.width, b.width) >= SQRT2) return 'width';
    return null;
  }

  it('has a style for every kind of wire, each told apart from every other by line alone', () => {
    expect([...wireStyleOrder].sort()).toEqual(Object.keys(wireStyles).sort());
    for (const [i, x] of wireStyleOrder.entries()) {
      const sx = wireStyles[x];
      expect(sx.width, x).toBeGreaterThan(0);
      for (const n of dashes(sx.dash)) expect(n, `${x} dash`).toBeGreaterThan(0);
      for (const y of wireStyleOrder.slice(i + 1)) {
        const sy = wireStyles[y];
        // Never the same line twice, whatever the rule above says.
        expect(`${sx.width}|${dashes(sx.dash).join(' ')}|${sx.hollow}`, `${x} against ${y}`).not.toBe(`${sy.width}|${dashes(sy.dash).join(' ')}|${sy.hollow}`);
        expect(apart(sx, sy), `${x} against ${y}: ${sx.width}/${sx.dash || 'solid'}/${sx.hollow} and ${sy.width}/${sy.dash || 'solid'}/${sy.hollow}`).not.toBeNull();
      }
      // The legend names each line differently too.
      for (const y of wireStyleOrder.slice(i + 1)) expect(sx.line, `${x} against ${y}`).not.toBe(wireStyles[y].line);
    }
  });

  const allowed = new Set(['none', 'currentcolor', 'black', 'white', '#000', '#000000', '#fff', '#ffffff']);
  function paintProblems(markup: string): string[] {
    const out: string[] = [];
    for (const m of markup.matchAll(/\s(fill|stroke|color|stop-color|flood-color|lighting-color)="([^"]*)"/gi)) {
      if (!allowed.has(m[2]!.trim().toLowerCase())) out.push(`${m[1]}="${m[2]}"`);
    }
    for (const m of markup.matchAll(/\s((?:fill-|stroke-)?opacity)="([^"]*)"/gi)) if (Number(m[2]) !== 1) out.push(`${m[1]}="${m[2]}"`);
    if (/\sstyle="/i.test(markup)) out.push('a style attribute');
    if (/<style/i.test(markup)) out.push('a style element');
    if (/<(linearGradient|radialGradient|pattern|filter|image)\b/i.test(markup)) out.push('a gradient, pattern, filter or image');
    return out;
  }

  for (const c of cases) {
    it(`draws only in black and white, with each wire in its own style: ${c.label}`, () => {
      const figure = renderToStaticMarkup(createElement(WiringDiagram, { diagram: c.sheet.diagram }));
      const svg = diagramSvg(c.sheet.diagram);
      expect(figure).toContain(svg);
      expect(paintProblems(figure)).toEqual([]);
      expect(paintProblems(svg)).toEqual([]);
      // Something is drawn in black at all (the check above would pass on an empty drawing).
      expect(svg).toMatch(/stroke="#000000"/);
      // Each wire's line carries its style's width and dashes; a hollow wire is a black line with a narrower white core.
      for (const w of c.sheet.diagram.wires) {
        const s = wireStyles[w.style];
        const group = new RegExp(`<g class="diagram-wire wire-${w.style}" data-wire="${w.id}"[^>]*>([\\s\\S]*?)</g>`).exec(svg);
        expect(group, w.id).not.toBeNull();
        const lines = [...group![1]!.matchAll(/<polyline[^>]*>/g)].map((m) => m[0]);
        const attr = (tag: string, name: string): string | null => new RegExp(`\\s${name}="([^"]*)"`).exec(tag)?.[1] ?? null;
        expect(attr(lines[0]!, 'stroke'), w.id).toBe('#000000');
        expect(Number(attr(lines[0]!, 'stroke-width')), w.id).toBe(s.width);
        expect(attr(lines[0]!, 'stroke-dasharray'), w.id).toBe(s.dash === '' ? null : s.dash);
        if (s.hollow) {
          expect(lines.length, w.id).toBe(2);
          expect(attr(lines[1]!, 'stroke'), w.id).toBe('#ffffff');
          const core = Number(attr(lines[1]!, 'stroke-width'));
          // Two black edges of at least 1 unit each either side of a visible white core.
          expect(core, w.id).toBeGreaterThanOrEqual(1);
          expect((s.width - core) / 2, w.id).toBeGreaterThanOrEqual(1);
        } else expect(lines.length, w.id).toBe(1);
      }
    });
  }
});
