/**
 * Recently removed: every engine, part, plan and reading deleted since the app was opened, newest
 * first, each with a button that puts it back (with what went with it). The list lives only as long
 * as the app runs; after that, backups are the way back.
 */
import { useCallback, useEffect, useState, type ReactNode } from 'react';
import type { RemovedSummary } from '../../../electron/ipc/channels.js';
import { call } from '../../app/bridge.js';
import { Notice } from '../../app/Notice.js';

const kindWords: Record<RemovedSummary['kind'], string> = { engine: 'Engine', part: 'Part', plan: 'Plan', reading: 'Reading' };
const when = (iso: string): string => new Date(iso).toLocaleTimeString(undefined, { timeStyle: 'short' });

function withIt(r: RemovedSummary): string {
  const bits: string[] = [];
  if (r.plans > 0) bits.push(r.plans === 1 ? '1 plan' : `${r.plans} plans`);
  if (r.readings > 0) bits.push(r.readings === 1 ? '1 reading' : `${r.readings} readings`);
  return bits.length > 0 ? bits.join(', ') : '—';
}

export function RemovedSection({ onRestored, version }: { onRestored: () => void; version: number }): ReactNode {
  const [list, setList] = useState<RemovedSummary[] | null>(null);
  const [message, setMessage] = useState<{ kind: 'done' | 'problem'; text: string } | null>(null);
  const [busy, setBusy] = useState(false);

  const load = useCallback(async () => {
    const r = await call('removed.list', {});
    if (r.ok) setList(r.value.removed);
    else setMessage({ kind: 'problem', text: r.error.message });
  }, []);
  useEffect(() => {
    void load();
  }, [load, version]);

  async function putBack(item: RemovedSummary): Promise<void> {
    setBusy(true);
    const r = await call('removed.restore', { token: item.token });
    setBusy(false);
    if (r.ok) {
      setMessage({ kind: 'done', text: `${r.value.label} is back, as it was.` });
      onRestored();
    } else setMessage({ kind: 'problem', text: r.error.message });
    await load();
  }

  return (
    <section aria-labelledby="removed-title" className="records-part" data-testid="removed-section">
      <h2 id="removed-title">Recently removed</h2>
      <p className="quiet">What was deleted since the app was opened. Putting a record back gives it its old number and brings back what went with it. This list empties when the app is closed.</p>
      {message ? (
        <Notice kind={message.kind} onDismiss={() => setMessage(null)} testId="removed-message">
          {message.text}
        </Notice>
      ) : null}
      {list === null ? (
        <p>Reading the list…</p>
      ) : list.length === 0 ? (
        <p className="empty">Nothing has been deleted since the app was opened.</p>
      ) : (
        <table className="list" aria-label="Recently removed" data-testid="removed-list">
          <thead>
            <tr>
              <th scope="col">What</th>
              <th scope="col">Name</th>
              <th scope="col">Went with it</th>
              <th scope="col">Deleted at</th>
              <th scope="col">
                <span className="visually-hidden">Actions</span>
              </th>
            </tr>
          </thead>
          <tbody>
            {list.map((r) => (
              <tr key={r.token}>
                <td>{kindWords[r.kind]}</td>
                <th scope="row">{r.label}</th>
                <td>{withIt(r)}</td>
                <td>{when(r.removedAt)}</td>
                <td>
                  <button type="button" className="small" disabled={busy} onClick={() => void putBack(r)} aria-label={`Put back ${r.label}`}>
                    Put back
                  </button>
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      )}
    </section>
  );
}
