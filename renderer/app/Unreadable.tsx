/**
 * Records the store could not read (a file edited by hand, another tool's import): the lists leave
 * them out, so this says how many there are, shows each with the store's reason, and removes one
 * after asking. Shown above every screen while there are any; read again when the lists change.
 */
import { useEffect, useState, type ReactNode } from 'react';
import type { ResponseOf } from '../../electron/ipc/channels.js';
import { call } from './bridge.js';
import { Confirm } from './Dialog.js';
import { Notice } from './Notice.js';

type Row = ResponseOf<'store.unreadable'>['rows'][number];

const KIND: Record<Row['table'], string> = { engines: 'Engine', parts: 'Part', plans: 'Plan', readings: 'Reading' };

async function remove(row: Row) {
  const at = { id: row.id, expectedUpdatedAt: row.updatedAt };
  switch (row.table) {
    case 'engines':
      return call('engines.delete', { ...at, deletePlansToo: true });
    case 'parts':
      return call('parts.delete', at);
    case 'plans':
      return call('plans.delete', at);
    case 'readings':
      return call('readings.delete', at);
  }
}

export function Unreadable({ version, onChanged }: { version: number; onChanged: () => void }): ReactNode {
  const [rows, setRows] = useState<Row[]>([]);
  const [open, setOpen] = useState(false);
  const [asking, setAsking] = useState<Row | null>(null);
  const [busy, setBusy] = useState(false);
  const [problem, setProblem] = useState<string | null>(null);
  const [reads, setReads] = useState(0);

  useEffect(() => {
    let live = true;
    void call('store.unreadable', {}).then((r) => {
      if (live && r.ok) setRows(r.value.rows);
    });
    return () => {
      live = false;
    };
  }, [version, reads]);

  if (rows.length === 0 && !problem) return null;

  const confirm = async (row: Row): Promise<void> => {
    setBusy(true);
    const r = await remove(row);
    setBusy(false);
    setAsking(null);
    setProblem(r.ok ? null : r.error.message);
    setReads((n) => n + 1);
    if (r.ok) onChanged();
  };

  const count = rows.length;
  return (
    <div data-testid="unreadable">
      {count > 0 ? (
        <Notice kind="problem">
          {count === 1 ? '1 record could not be read' : `${count} records could not be read`} and {count === 1 ? 'is' : 'are'} left out of the lists.{' '}
          <button type="button" className="small" onClick={() => setOpen((o) => !o)} aria-expanded={open} data-testid="unreadable-toggle">
            {open ? 'Hide them' : 'Show them'}
          </button>
        </Notice>
      ) : null}
      {problem ? <Notice kind="problem" onDismiss={() => setProblem(null)}>{problem}</Notice> : null}
      {open && count > 0 ? (
        <ul className="unreadable-list" aria-label="Records that could not be read">
          {rows.map((row) => (
            <li key={`${row.table}-${row.id}`} data-testid={`unreadable-${row.table}-${row.id}`}>
              <strong>
                {KIND[row.table]} {row.label ? `“${row.label}”` : ''} (no. {row.id})
              </strong>
              : {row.message}{' '}
              <button type="button" className="small danger" onClick={() => setAsking(row)}>
                Remove it
              </button>
            </li>
          ))}
        </ul>
      ) : null}
      {asking ? (
        <Confirm
          title={`Remove the unreadable ${KIND[asking.table].toLowerCase()}?`}
          confirmLabel="Remove it"
          cancelLabel="Keep it"
          danger
          busy={busy}
          onConfirm={() => void confirm(asking)}
          onCancel={() => setAsking(null)}
          testId="unreadable-remove-dialog"
        >
          <p>
            {KIND[asking.table]} no. {asking.id} cannot be read, so it cannot be opened or repaired here.
            {asking.table === 'engines' ? ' Its plans and their readings are removed with it.' : ''}
            {asking.table === 'plans' ? ' Its readings are removed with it.' : ''} A backup taken before it was damaged still holds it.
          </p>
        </Confirm>
      ) : null}
    </div>
  );
}
