/**
 * The figures the checker works out for one setup that a restorer would otherwise derive by hand:
 * time for a current-limited module to reach its limit, CD recharge time and the rpm where its
 * energy starts to fall, the coupling's effect on a CD peak, the coil's secondary ceiling. The
 * figures tied to one of the four key speeds (cylinder pressure and temperature at the spark,
 * ballast temperature) go into the key-points table instead (`perSpeedFigure`). Always shown, never
 * folded, so the print carries them too.
 */
import type { ReactNode } from 'react';
import type { ShownFigure, ShownSetup } from '../../../electron/ipc/channels.js';
import { useGapUnit } from '../../app/units.js';
import { figureName, figureText } from './words.js';

/** The key speeds as the report's figure names spell them. */
export type SpeedKey = 'cranking' | 'idle' | 'mid' | 'redline';
const speedName: Record<SpeedKey, string> = { cranking: 'cranking', idle: 'idle', mid: 'mid-range', redline: 'redline' };

/** The per-speed figures, by what they are; each name ends ", <speed>" (the pressure adds " (<rpm> rpm)"). */
export const perSpeedKinds = [
  { key: 'pressure', prefix: 'cylinder pressure at the spark', label: 'Cylinder pressure at the spark' },
  { key: 'temperature', prefix: 'cylinder temperature at the spark', label: 'Cylinder temperature at the spark' },
  { key: 'ballast', prefix: 'ballast temperature', label: 'Ballast temperature' },
] as const;
export type PerSpeedKind = (typeof perSpeedKinds)[number]['key'];

function speedOf(f: ShownFigure): { kind: PerSpeedKind; speed: string } | null {
  for (const k of perSpeedKinds) {
    if (!f.name.startsWith(`${k.prefix}, `)) continue;
    const rest = f.name.slice(k.prefix.length + 2).replace(/\s*\(\d+ rpm\)$/, '');
    return { kind: k.key, speed: rest };
  }
  return null;
}

/** The setup's figure of `kind` at a key speed, or null when the report has none (no ballast, say). */
export function perSpeedFigure(setup: ShownSetup, kind: PerSpeedKind, speed: SpeedKey): ShownFigure | null {
  for (const f of setup.setupFigures) {
    const s = speedOf(f);
    if (s && s.kind === kind && s.speed === speedName[speed]) return f;
  }
  return null;
}

/** The setup's figures not tied to a key speed. */
export function generalFigures(setup: ShownSetup): ShownFigure[] {
  return setup.setupFigures.filter((f) => speedOf(f) === null);
}

/** A figure name as a sentence start. */
const capital = (s: string): string => (s.length > 0 ? s[0]!.toUpperCase() + s.slice(1) : s);

export function SetupFigures({ setup, index }: { setup: ShownSetup; index: number }): ReactNode {
  const [unit] = useGapUnit();
  const shown = generalFigures(setup);
  if (shown.length === 0) return null;
  return (
    <div className="card-figures" data-testid={`setup-figures-${index}`}>
      <p className="card-line">
        <strong>Worked out for this setup:</strong>
      </p>
      {/* The action list's look (app.css): a compact list in the card's type size. */}
      <ul className="card-action-list figure-list">
        {shown.map((f) => (
          <li key={f.name}>
            {capital(figureName(f.name, f.unit))}
            {f.name.includes(':') ? ' ' : ': '}
            <span className="num">{f.unit === '' && Number.isInteger(f.value) ? String(f.value) : figureText(f.value, f.unit, unit)}</span>
          </li>
        ))}
      </ul>
    </div>
  );
}
