/** One card per setup: its verdict, how many checks came out which way, what to do, the margin and the gap. */
import { memo, type ReactNode } from 'react';
import type { ShownSetup } from '../../../electron/ipc/channels.js';
import { styleFor } from '../../charts/palette.js';
import { useGapUnit } from '../../app/units.js';
import { SetupFigures } from './SetupFigures.js';
import { VerdictBadge, VerdictKey } from './Verdict.js';
import { figureName, figureText, gapWithUnit, number, rpmText, verdictWords } from './words.js';

export const SetupCards = memo(function SetupCards({ setups, margin }: { setups: readonly ShownSetup[]; margin: number }): ReactNode {
  const [unit] = useGapUnit();
  return (
    <>
      <ul className="setup-cards" data-testid="setup-cards">
        {setups.map((s, i) => {
          const style = styleFor(i);
          return (
            <li key={`${s.kind}-${s.planId ?? i}`} className={`setup-card card-${s.verdict}`} data-testid={`setup-card-${i}`}>
              <div className="card-head">
                <svg className="swatch" viewBox="0 0 36 12" aria-hidden="true">
                  <line x1={1} x2={35} y1={6} y2={6} stroke={style.stroke} strokeWidth={style.width} strokeDasharray={style.dash || undefined} />
                </svg>
                <span className="card-kind">{s.kind === 'existing' ? 'Fitted now' : 'Plan'}</span>
              </div>
              <h3 className="card-name">{s.kind === 'existing' ? 'The ignition fitted now' : s.name}</h3>
              <VerdictBadge verdict={s.verdict} large testId={`verdict-${i}`} />
              <p className="card-counts">
                {(['fail', 'caution', 'pass'] as const)
                  .filter((v) => s.counts[v] > 0)
                  .map((v) => `${s.counts[v]} ${verdictWords[v].toLowerCase()}`)
                  .join(' · ')}
              </p>
              {(['fail', 'caution'] as const).map((v) => {
                const titles = s.rules.filter((r) => r.verdict === v).map((r) => r.title);
                return titles.length > 0 ? (
                  <p key={v} className={`card-line card-look look-${v}`}>
                    <strong>{verdictWords[v]}:</strong> {titles.join(', ')}
                  </p>
                ) : null;
              })}
              <p className="card-line">
                {s.belowMarginFromRpm === null
                  ? `Keeps the ${number(margin, 2)} × voltage margin from idle to beyond redline.`
                  : `Falls below the ${number(margin, 2)} × voltage margin from ${rpmText(s.belowMarginFromRpm)}.`}
              </p>
              <p className="card-line spark-line" data-testid={`spark-line-${i}`}>
                Spark at idle: {number(s.keyPoints.idle.sparkEnergyMj, 2)} mJ delivered over {number(s.keyPoints.idle.sparkDurationMs, 2)} ms ({number(s.keyPoints.idle.energyMj, 1)} mJ stored); at redline {number(s.keyPoints.redline.sparkEnergyMj, 2)} mJ over {number(s.keyPoints.redline.sparkDurationMs, 2)} ms.
              </p>
              <p className="card-line">
                Plug gap {gapWithUnit(s.plugGapMm, unit)}; largest that keeps the margin: {s.suggestedGapMm === null ? 'none found' : gapWithUnit(s.suggestedGapMm, unit)}.
              </p>
              {s.actions.length > 0 ? (
                <div className="card-actions" data-testid={`actions-${i}`}>
                  <p className="card-line">
                    <strong>What to do, in this order:</strong>
                  </p>
                  <ol className="card-action-list">
                    {s.actions.map((a) => (
                      <li key={a}>{a}</li>
                    ))}
                  </ol>
                </div>
              ) : null}
              <SetupFigures setup={s} index={i} />
              {s.measured.length > 0 ? (
                <p className="card-line measured-line">
                  <span className="measured-tag">Measured</span>{' '}
                  {s.measured.map((f) => `${figureName(f.name, f.unit)} ${figureText(f.value, f.unit, unit)}`).join('; ')}
                </p>
              ) : null}
            </li>
          );
        })}
      </ul>
      <VerdictKey />
    </>
  );
});
