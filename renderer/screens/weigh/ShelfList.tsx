/**
 * "Best from the shelf": every module, coil and ballast in the parts bin tried on this engine,
 * the best few listed with their verdict and reserve, each one click from becoming a plan.
 */
import { useEffect, useState, type ReactNode } from 'react';
import { call } from '../../app/bridge.js';
import type { SearchAnswer, ShelfSuggestion } from '../../../electron/ipc/channels.js';
import { kindWords } from '../parts/labels.js';
import { VerdictBadge } from './Verdict.js';
import { number, ratioText, rpmText, verdictWords } from './words.js';

type Props = {
  answer: SearchAnswer | null;
  problem: string | null;
  busy: boolean;
  onMakePlan: (s: ShelfSuggestion) => void;
};

export function ShelfList({ answer, problem, busy, onMakePlan }: Props): ReactNode {
  return (
    <section className="panel shelf" aria-labelledby="shelf-title" data-testid="shelf">
      <h2 id="shelf-title">Best from the shelf</h2>
      {problem ? <p className="field-error">{problem}</p> : null}
      {busy && !answer ? <SearchRunning /> : null}
      {answer ? (
        <>
          <p className="quiet">
            Tried {answer.evaluated} combinations of module, coil and ballast from the parts bin on {answer.engineName}, with the rev counter, leads and plugs as fitted now;{' '}
            {answer.withoutFail === 0 ? 'none passes every check.' : `${answer.withoutFail} pass every check without a “not like this”.`}
          </p>
          {answer.leftOut.length > 0 ? (
            <div className="shelf-left-out" data-testid="shelf-left-out">
              <p>
                Left out because every one you have is fitted to another engine (a plan there is marked wired or done):
              </p>
              <ul>
                {answer.leftOut.map((p) => (
                  <li key={p.partId} data-testid={`left-out-${p.partId}`}>
                    <strong>{p.partName}</strong> ({kindWord(p.kind)}): {p.reason}
                  </li>
                ))}
              </ul>
            </div>
          ) : null}
          {answer.suggestions.length === 0 ? (
            <p className="empty">The shelf has no module and coil to combine. Add them under Parts on the shelf.</p>
          ) : (
            <ol className="shelf-list" data-testid="shelf-list">
              {answer.suggestions.map((s) => (
                <li key={s.rank} className="shelf-item" data-testid={`shelf-item-${s.rank}`}>
                  <div className="shelf-main">
                    <span className="shelf-rank" aria-hidden="true">
                      {s.rank}
                    </span>
                    <div className="shelf-text">
                      <p className="shelf-parts">
                        <strong>{s.moduleName}</strong> with {s.coilName}
                        {s.ballastName ? `, through ${s.ballastName}${s.crankingBypass ? ', with a cranking bypass' : ', no cranking bypass'}` : ', no ballast'}
                      </p>
                      <p className="shelf-figures">
                        Lowest reserve {ratioText(s.setup.worstReserveRatio)} at {rpmText(s.setup.worstReserveRpm)} · {number(s.setup.keyPoints.redline.energyMj, 1)} mJ at redline
                        {s.setup.belowMarginFromRpm !== null ? ` · below the margin from ${rpmText(s.setup.belowMarginFromRpm)}` : ''}
                      </p>
                      {s.setup.verdict !== 'pass' ? (
                        <p className="shelf-figures">
                          Look at: {s.setup.rules.filter((r) => r.verdict !== 'pass').map((r) => `${r.title} (${verdictWords[r.verdict].toLowerCase()})`).join(', ')}
                        </p>
                      ) : null}
                    </div>
                    <VerdictBadge verdict={s.setup.verdict} />
                    <button type="button" className="small" onClick={() => onMakePlan(s)} aria-label={`Make this a plan: suggestion ${s.rank}, ${s.planName}`}>
                      Make this a plan
                    </button>
                  </div>
                </li>
              ))}
            </ol>
          )}
          {answer.rejectedByRule.length > 0 ? (
            <details className="rejected">
              <summary>What ruled the other combinations out</summary>
              <ul>
                {answer.rejectedByRule.map((r) => (
                  <li key={r.id}>
                    {r.title}: {r.count} {r.count === 1 ? 'combination' : 'combinations'}
                  </li>
                ))}
              </ul>
            </details>
          ) : null}
        </>
      ) : null}
    </section>
  );
}

const kindWord = (kind: string): string => (kind in kindWords ? kindWords[kind as keyof typeof kindWords].one : kind);

/**
 * While the search runs (in a worker thread, so the rest of the app answers): how far it has got
 * and how long it has run, asked once a second, and a way to stop it (the search then answers that it was stopped).
 */
function SearchRunning(): ReactNode {
  const [seen, setSeen] = useState({ seconds: 0, percent: 0 });
  const [stopping, setStopping] = useState(false);
  useEffect(() => {
    const timer = setInterval(() => {
      void call('check.progress', {}).then((r) => {
        if (r.ok && r.value.running > 0) setSeen({ seconds: Math.round(r.value.elapsedMs / 1000), percent: Math.floor(r.value.share * 100) });
      });
    }, 1000);
    return () => clearInterval(timer);
  }, []);
  return (
    <p className="quiet" data-testid="search-running">
      Trying every combination in the parts bin…{seen.seconds > 0 ? ` ${seen.percent} % done, ${seen.seconds} s so far.` : ''}{' '}
      <button
        type="button"
        className="small"
        disabled={stopping}
        onClick={() => {
          setStopping(true);
          void call('check.cancel', {});
        }}
      >
        Stop the search
      </button>
    </p>
  );
}
