/** The engines in this workshop, with the facts a restorer picks one by, and add/open/delete. */
import type { ReactNode } from 'react';
import { ActionsHead, ListProblem, RowActions, useListScreen } from '../../app/list-screen.js';
import type { Navigate } from '../../app/routes.js';
import { useDeleteEngine } from './delete-engine.js';
import { earthWords } from './labels.js';
import { FirstSteps } from './FirstSteps.js';

export function EngineList({ navigate, version, onDeleted }: { navigate: Navigate; version: number; onDeleted: (id: number) => void }): ReactNode {
  const { items: engines, setItems: setEngines, problem, setProblem, reload } = useListScreen('engines.list', {}, version);

  const del = useDeleteEngine(
    (id) => {
      onDeleted(id);
      // Take the row away at once; the reload below then brings the plan counts up to date.
      // The note with its Undo comes from the delete itself (see delete-engine.tsx).
      setEngines((list) => list?.filter((e) => e.id !== id) ?? list);
      reload();
    },
    (message, code) => {
      setProblem(message);
      // Changed elsewhere since the list was read: show the list as it is now.
      if (code === 'STALE' || code === 'NOT_FOUND') reload();
    },
  );

  return (
    <section className="screen" aria-labelledby="engines-title">
      <div className="screen-head">
        <h1 id="engines-title" tabIndex={-1}>
          Engines
        </h1>
        <button type="button" className="primary" onClick={() => navigate({ to: 'new-engine' })}>
          Add an engine
        </button>
      </div>
      <ListProblem problem={problem} onDismiss={() => setProblem(null)} />
      <FirstSteps engines={engines} navigate={navigate} />
      {engines === null && !problem ? <p className="quiet">Reading the workshop…</p> : null}
      {engines && engines.length === 0 ? (
        <p className="empty">No engines yet. Add one, or load the demo workshop to look around first.</p>
      ) : null}
      {engines && engines.length > 0 ? (
        <table className="list" aria-label="Engines in this workshop" data-testid="engine-list">
          <thead>
            <tr>
              <th scope="col">Name</th>
              <th scope="col">Year and model</th>
              <th scope="col" className="num">Cylinders</th>
              <th scope="col" className="num">System</th>
              <th scope="col">Earth</th>
              <th scope="col" className="num">Plans</th>
              <ActionsHead />
            </tr>
          </thead>
          <tbody>
            {engines.map((e) => (
              <tr key={e.id} data-testid={`engine-row-${e.id}`}>
                <th scope="row">
                  <button type="button" className="link" onClick={() => navigate({ to: 'engine', id: e.id })}>
                    {e.name}
                  </button>
                </th>
                <td>{[e.yearText, e.modelText].filter((s) => s.trim() !== '').join(', ') || '—'}</td>
                <td className="num">{e.cylinders}</td>
                <td className="num">{e.systemVoltageV} V</td>
                <td>{earthWords(e.earthPolarity)}</td>
                <td className="num">{e.planCount}</td>
                <RowActions name={e.name} onEdit={() => navigate({ to: 'engine', id: e.id })} onDelete={() => del.ask({ id: e.id, name: e.name, updatedAt: e.updatedAt })} />
              </tr>
            ))}
          </tbody>
        </table>
      ) : null}
      {del.dialog}
    </section>
  );
}
