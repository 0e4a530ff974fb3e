/**
 * What the list screens (engines, parts) share: the list read from the store again whenever the
 * app's data version moves or after a delete, a late answer from a screen already left dropped,
 * the problem line, and each row's Edit and Delete buttons. (What a delete did is said by the note
 * with its Undo, app/removal.tsx.)
 */
import { useEffect, useState, type ReactNode } from 'react';
import type { ChannelName, RequestOf, ResponseOf } from '../../electron/ipc/channels.js';
import { call } from './bridge.js';
import { Notice } from './Notice.js';

export function useListScreen<C extends ChannelName>(channel: C, request: RequestOf<C>, version: number) {
  const [items, setItems] = useState<ResponseOf<C> | null>(null);
  const [problem, setProblem] = useState<string | null>(null);
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

  return { items, setItems, problem, setProblem, reload: () => setReloads((n) => n + 1) };
}

export function ListProblem({ problem, onDismiss }: { problem: string | null; onDismiss: () => void }): ReactNode {
  return problem ? (
    <Notice kind="problem" onDismiss={onDismiss}>
      {problem}
    </Notice>
  ) : null;
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
