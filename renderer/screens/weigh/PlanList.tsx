/** The engine's plans: tick up to three to weigh beside the ignition fitted now, or open one to change it. */
import type { ReactNode } from 'react';
import type { Part, Plan } from '../../../db/schema.js';
import { statusWords } from './words.js';

export const MAX_TICKED = 3;

type Props = {
  plans: readonly Plan[];
  parts: readonly Part[];
  ticked: readonly number[];
  onTick: (id: number, on: boolean) => void;
  onEdit: (plan: Plan) => void;
  onDelete: (plan: Plan) => void;
  onNew: () => void;
  onOpenSheet: (plan: Plan) => void;
  editingId: number | null | 'new';
};

const partName = (parts: readonly Part[], id: number | null, none: string): string => (id === null ? none : (parts.find((p) => p.id === id)?.name ?? `part no. ${id}`));

export function PlanList({ plans, parts, ticked, onTick, onEdit, onDelete, onNew, onOpenSheet, editingId }: Props): ReactNode {
  const full = ticked.length >= MAX_TICKED;
  return (
    <section className="panel plans-panel" aria-labelledby="plans-title">
      <div className="panel-head">
        <h2 id="plans-title">Plans for this engine</h2>
        <button type="button" className="link" onClick={() => document.getElementById('shelf-title')?.scrollIntoView({ block: 'start' })}>
          See the best from the shelf
        </button>
        <button type="button" onClick={onNew} disabled={editingId === 'new'}>
          Make a new plan
        </button>
      </div>
      {plans.length === 0 ? (
        <p className="quiet">No plans yet. Make one, or take one from the best of the shelf below.</p>
      ) : (
        <>
          <p className="hint" id="tick-hint">
            Tick up to {MAX_TICKED} plans to weigh them beside the ignition fitted now.
            {full ? ' Untick one to choose another.' : ''}
          </p>
          <ul className="plan-rows" data-testid="plan-list">
            {plans.map((p) => {
              const on = ticked.includes(p.id);
              return (
                <li key={p.id} className={on ? 'ticked' : undefined} data-testid={`plan-row-${p.id}`}>
                  <label className="plan-tick">
                    <input type="checkbox" checked={on} disabled={!on && full} aria-describedby="tick-hint" onChange={(e) => onTick(p.id, e.target.checked)} />
                    <span className="plan-name">{p.name}</span>
                  </label>
                  <span className="plan-parts">
                    {partName(parts, p.moduleId, 'points kept')} · {partName(parts, p.coilId, 'coil kept')} · {partName(parts, p.ballastId, 'no ballast')}
                  </span>
                  <span className="plan-status">{statusWords[p.status]}</span>
                  <button type="button" className="link" onClick={() => onOpenSheet(p)} aria-label={`Open its wiring sheet: ${p.name}`}>
                    Open its wiring sheet
                  </button>
                  <button type="button" className="small" onClick={() => onEdit(p)} disabled={editingId === p.id} aria-label={`Change the plan ${p.name}`}>
                    Change
                  </button>
                  <button type="button" className="small danger" onClick={() => onDelete(p)} aria-label={`Delete the plan ${p.name}`}>
                    Delete
                  </button>
                </li>
              );
            })}
          </ul>
        </>
      )}
    </section>
  );
}
