/**
 * The pieces at the top of an editor: the "Unsaved changes" badge, the status line after a save,
 * and the whole screen shown instead when the record cannot be opened.
 */
import type { ReactNode } from 'react';
import { fieldId } from './fields.js';
import type { Messages, SaveStatus } from './form-save.js';
import { Notice } from './Notice.js';

export function UnsavedBadge({ testId }: { testId: string }): ReactNode {
  return (
    <span className="badge" data-testid={testId}>
      <span aria-hidden="true">●</span> Unsaved changes
    </span>
  );
}

/**
 * The status line; a refused save lists every message, each a button to its field. A save refused
 * because the record changed elsewhere offers to reload the saved version (`onReload`).
 */
export function EditorStatus({ status, summary, onDismiss, onReload }: { status: SaveStatus; summary: Messages; onDismiss: () => void; onReload?: () => void }): ReactNode {
  return (
    <Notice kind={status.kind} onDismiss={onDismiss} testId="editor-status">
      {status.text}
      {status.stale && onReload ? (
        <>
          {' '}
          <button type="button" onClick={onReload} data-testid="reload-record">
            Reload the saved version
          </button>
        </>
      ) : null}
      {Object.keys(summary).length > 0 ? (
        <ul className="error-summary">
          {Object.entries(summary).map(([path, message]) => (
            <li key={path}>
              <button type="button" className="link" onClick={() => document.getElementById(fieldId(path))?.focus()}>
                {message}
              </button>
            </li>
          ))}
        </ul>
      ) : null}
    </Notice>
  );
}

/** In place of the editor when the record could not be read: the store's sentence and a way back. */
export function CannotOpen({ title, titleId, problem, back, backLabel }: { title: string; titleId: string; problem: string; back: () => void; backLabel: string }): ReactNode {
  return (
    <section className="screen" aria-labelledby={titleId}>
      <h1 id={titleId} tabIndex={-1}>
        {title}
      </h1>
      <Notice kind="problem">{problem}</Notice>
      <button type="button" onClick={back}>
        {backLabel}
      </button>
    </section>
  );
}
