/**
 * The parts on the shelf, grouped by kind, with each kind's key figures in workshop units and
 * add/edit/delete. A filter shows one kind at a time; it is remembered for this window.
 */
import { useState, type ReactNode } from 'react';
import { partKinds, type Part, type PartKind } from '../../../db/schema.js';
import { ListProblem, useListScreen } from '../../app/list-screen.js';
import type { Navigate } from '../../app/routes.js';
import { useGapUnit } from '../../app/units.js';
import { useDeletePart } from './delete-part.js';
import { KindTable } from './kind-tables.js';
import { kindWords } from './labels.js';
import { loadShown, saveShown, type Shown } from './shown-kinds.js';

type Props = { navigate: Navigate; version: number };

export function PartsList({ navigate, version }: Props): ReactNode {
  const [unit] = useGapUnit();
  const { items: parts, setItems: setParts, problem, setProblem, reload } = useListScreen('parts.list', {}, version);
  const [shown, setShownState] = useState<Shown>(loadShown);

  const del = useDeletePart(
    (target) => {
      // The note with its Undo comes from the delete itself (see delete-part.tsx).
      setParts((list) => list?.filter((p) => p.id !== target.id) ?? list);
      reload();
    },
    reload,
  );

  const setShown = (v: Shown): void => {
    setShownState(v);
    saveShown(v);
  };
  const byKind = (k: PartKind): Part[] => (parts ?? []).filter((p) => p.kind === k);
  const kinds = shown === 'all' ? partKinds : [shown];
  const edit = (p: Part): void => navigate({ to: 'parts', part: { id: p.id } });
  const add = (k: PartKind): void => navigate({ to: 'parts', part: { newKind: k } });

  return (
    <section className="screen parts-screen" aria-labelledby="parts-title">
      <div className="screen-head">
        <h1 id="parts-title" tabIndex={-1}>
          Parts on the shelf
        </h1>
        <button type="button" className="primary" onClick={() => add(shown === 'all' ? 'coil' : shown)}>
          Add a part
        </button>
      </div>
      <ListProblem problem={problem} onDismiss={() => setProblem(null)} />
      <fieldset className="kind-filter">
        <legend>Show</legend>
        <label>
          <input type="radio" name="parts-shown" value="all" checked={shown === 'all'} onChange={() => setShown('all')} /> Every kind
          {parts ? <span className="count"> ({parts.length})</span> : null}
        </label>
        {partKinds.map((k) => (
          <label key={k}>
            <input type="radio" name="parts-shown" value={k} checked={shown === k} onChange={() => setShown(k)} /> {kindWords[k].many}
            {parts ? <span className="count"> ({byKind(k).length})</span> : null}
          </label>
        ))}
      </fieldset>
      {parts === null && !problem ? <p className="quiet">Reading the shelf…</p> : null}
      {parts
        ? kinds.map((k) => {
            const list = byKind(k);
            return (
              <section key={k} className="kind-section" aria-labelledby={`kind-${k}`} data-testid={`kind-${k}`}>
                <div className="kind-head">
                  <h2 id={`kind-${k}`}>
                    {kindWords[k].many} <span className="count">({list.length})</span>
                  </h2>
                  <button type="button" onClick={() => add(k)}>
                    {kindWords[k].add}
                  </button>
                </div>
                {list.length === 0 ? (
                  <p className="empty">No {kindWords[k].many.toLowerCase()} on the shelf yet.</p>
                ) : (
                  <KindTable kind={k} parts={list} unit={unit} onEdit={edit} onDelete={(p) => del.ask({ id: p.id, name: p.name, updatedAt: p.updatedAt })} />
                )}
              </section>
            );
          })
        : null}
      {del.dialog}
    </section>
  );
}
