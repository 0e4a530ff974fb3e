/**
 * A step's live tick box. It shows what was asked for at once; "Saving…" while the store has not
 * answered; and when the save failed, the box keeps the state asked for with the store's sentence
 * beside it (ticking again tries again).
 */
import type { ReactNode } from 'react';
import { NoticeMark } from '../../app/Notice.js';

export type TickState = { want: boolean; saving: boolean; error: string | null };

/** The failed save's sentence, shown in the step's body (the tick column is narrow). */
export function TickError({ stepKey, pending }: { stepKey: string; pending: TickState | undefined }): ReactNode {
  if (!pending?.error) return null;
  return (
    <p className="field-error tick-error" id={tickErrorId(stepKey)} role="alert" data-testid={`tick-error-${stepKey}`}>
      <NoticeMark kind="problem" />The tick was not saved ({pending.want ? 'ticked' : 'unticked'} here, not in the workshop): {pending.error} Tick the box again to retry.
    </p>
  );
}

const tickErrorId = (key: string): string => `tick-error-${key.replace(/[^a-zA-Z0-9_-]/g, '-')}`;

export function TickBox({ stepKey, title, saved, pending, onChange }: { stepKey: string; title: string; saved: boolean; pending: TickState | undefined; onChange: (on: boolean) => void }): ReactNode {
  const checked = pending ? pending.want : saved;
  const errorId = tickErrorId(stepKey);
  return (
    <span className={`live-tick${pending?.error ? ' has-error' : ''}`}>
      <input
        type="checkbox"
        className="tick-input"
        checked={checked}
        aria-label={`Done: ${title}`}
        aria-describedby={pending?.error ? errorId : undefined}
        aria-invalid={pending?.error ? true : undefined}
        data-testid={`tick-${stepKey}`}
        onChange={(e) => onChange(e.target.checked)}
      />
      {pending?.saving ? <span className="tick-status">Saving…</span> : null}
    </span>
  );
}
