/**
 * What the list screens (engines, parts) share: the list read from the store again whenever the
 * app's data version moves or after a delete, a late answer from a screen already left dropped,
 * the problem and "done" lines, and each row's Edit and Delete buttons.
 */
import { useEffect, useState, type ReactNode } from 'react';
import type { ChannelName, RequestOf, ResponseOf } from '../../electron/ipc/channels.js';
import { call } from './bridge.js';
import { Notice } from './Notice.js';

export function useListScreen<C extends ChannelName>(channel: C, request: RequestOf<C>, version: number) {
  const [items, setItems] = useState<ResponseOf<C> | null>(null);
  const [problem, setProblem] = useState<string | null>(null);
  const [done, setDone] = useState<string | null>(null);
  const [reloads, setReloads] = useState(0);

  useEffect(() => {
    let live = true;
    void call(channel, request).then((r) => {
      if (!live) return;
      if (r.ok) {
        setItems(r.value);
        setProblem(null);
      } else setProblem(r.error.message);
    });
    return () => {
      live = false;
    };
  }, [version, reloads]);

  return { items, setItems, problem, setProblem, done, setDone, reload: () => setReloads((n) => n + 1) };
}

export function ListNotices({ problem, done, onDismissProblem, onDismissDone, doneTestId }: {
  problem: string | null;
  done: string | null;
  onDismissProblem: () => void;
  onDismissDone: () => void;
  doneTestId?: string;
}): ReactNode {
  return (
    <>
      {problem ? (
        <Notice kind="problem" onDismiss={onDismissProblem}>
          {problem}
        </Notice>
      ) : null}
      {done ? (
        <Notice kind="done" onDismiss={onDismissDone} testId={doneTestId}>
          {done}
        </Notice>
      ) : null}
    </>
  );
}

/** The head of the buttons' column: named for a screen reader, empty on screen. */
export function ActionsHead(): ReactNode {
  return (
    <th scope="col">
      <span className="visually-hidden">Actions</span>
    </th>
  );
}

/** A row's Edit and Delete buttons, each labelled with the row's name for a screen reader. */
export function RowActions({ name, onEdit, onDelete }: { name: string; onEdit: () => void; onDelete: () => void }): ReactNode {
  return (
    <td className="actions">
      <button type="button" className="small" onClick={onEdit} aria-label={`Edit ${name}`}>
        Edit
      </button>
      <button type="button" className="small danger" onClick={onDelete} aria-label={`Delete ${name}`}>
        Delete
      </button>
    </td>
  );
}
