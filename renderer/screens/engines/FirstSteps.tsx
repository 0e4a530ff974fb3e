/**
 * The first-run path on the engines screen: a run of four terminals joined by a wire, each a step
 * with a link to its screen, ticked off when the store shows it done (first-steps.ts), and gone
 * for good once the person puts it away (the `firstRunHidden` setting, kept in the store).
 */
import { useEffect, useState, type ReactNode } from 'react';
import { call } from '../../app/bridge.js';
import type { Navigate } from '../../app/routes.js';
import { saveSettings, useSettings } from '../../app/settings.js';
import { firstSteps, ownPlans, type Evidence } from './first-steps.js';

/** At most this many of the person's plans are asked about ticks (each answer builds a sheet). */
const SHEETS_ASKED = 3;

async function gather(engines: readonly { name: string }[]): Promise<Evidence | null> {
  const [parts, plans] = await Promise.all([call('parts.list', {}), call('plans.list', {})]);
  if (!parts.ok || !plans.ok) return null;
  const mine = ownPlans(plans.value);
  let plansWorked = 0;
  for (const p of mine.slice(0, SHEETS_ASKED)) {
    if (p.status === 'wired' || p.status === 'done') {
      plansWorked++;
      continue;
    }
    const readings = await call('readings.list', { planId: p.id });
    if (readings.ok && readings.value.length > 0) {
      plansWorked++;
      continue;
    }
    const sheet = await call('sheet.get', { planId: p.id });
    if (sheet.ok && sheet.value.ticked.length > 0) plansWorked++;
  }
  return { engines, parts: parts.value, plans: plans.value, plansWorked };
}

export function FirstSteps({ engines, navigate }: { engines: readonly { id: number; name: string }[] | null; navigate: Navigate }): ReactNode {
  const hidden = useSettings().firstRunHidden;
  const [evidence, setEvidence] = useState<Evidence | null>(null);

  useEffect(() => {
    if (hidden || engines === null) return;
    let live = true;
    void gather(engines).then((e) => {
      if (live && e) setEvidence(e);
    });
    return () => {
      live = false;
    };
  }, [hidden, engines]);

  if (hidden || evidence === null) return null;
  const steps = firstSteps(evidence);
  const ticked = steps.filter((s) => s.done).length;
  return (
    <section className="first-steps" aria-labelledby="first-steps-title" data-testid="first-steps">
      <div className="first-steps-head">
        <h2 id="first-steps-title">From points to a wiring sheet: four steps</h2>
        <span className="first-steps-count" data-testid="first-steps-count">
          {ticked} of {steps.length} ticked off
        </span>
        <button type="button" className="small" onClick={() => void saveSettings({ firstRunHidden: true })} data-testid="first-steps-away">
          I know my way: put this away
        </button>
      </div>
      <p className="first-steps-note quiet">Each step is ticked off from what the workshop holds; the demo's own engines, parts and plans do not count.</p>
      <ol className="first-steps-run">
        {steps.map((s, i) => (
          <li key={s.id} className={s.done ? 'step-done' : 'step-todo'} data-testid={`first-step-${s.id}`} data-done={s.done ? 'yes' : 'no'}>
            <span className="run-terminal" aria-hidden="true">
              {s.done ? (
                <svg viewBox="0 0 20 20" width={20} height={20} focusable="false">
                  <path d="M4.5 10.5 L8.5 14.5 L15.5 5.5" fill="none" stroke="currentColor" strokeWidth={2.8} strokeLinecap="round" strokeLinejoin="round" />
                </svg>
              ) : (
                i + 1
              )}
            </span>
            <span className="run-state">{s.done ? 'Ticked off' : 'Still to do'}</span>
            <h3 className="run-title">{s.title}</h3>
            <p className="run-what">{s.done ? s.doneWords : s.what}</p>
            <button type="button" className="link" onClick={() => navigate(s.route)}>
              {s.link}
            </button>
          </li>
        ))}
      </ol>
    </section>
  );
}
