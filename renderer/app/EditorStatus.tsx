/**
 * The pieces of an editor: the "Typed, not saved yet" label, the note after a save,
 * and the whole screen shown instead when the record cannot be opened.
 */
import type { ReactNode } from 'react';
import { fieldId } from './fields.js';
import type { Messages, SaveStatus } from './form-save.js';
import { Notice } from './Notice.js';
import { problemLines, type ProblemLine } from './problem-lines.js';

export function UnsavedBadge({ testId }: { testId: string }): ReactNode {
  return (
    <span className="badge" data-testid={testId}>
      Typed, not saved yet
    </span>
  );
}

/** Lines in the order their fields stand in the form (read after the fields are drawn); lines without a field last. */
function inFormOrder(lines: ProblemLine[]): ProblemLine[] {
  const at = (l: ProblemLine): Element | null => (typeof document === 'undefined' ? null : document.getElementById(fieldId(l.path)));
  return lines
    .map((l, i) => ({ l, i, el: at(l) }))
    .sort((a, b) => {
      if (a.el && b.el) return a.el === b.el ? a.i - b.i : a.el.compareDocumentPosition(b.el) & Node.DOCUMENT_POSITION_FOLLOWING ? -1 : 1;
      if (a.el || b.el) return a.el ? -1 : 1;
      return a.i - b.i;
    })
    .map((x) => x.l);
}

/**
 * The list of things to fix, as a punch list on the note: a number, the field as the form labels
 * it (unit included) and what is wrong; each line takes you to its field.
 */
export function FixList({ messages, nameOf }: { messages: Messages; nameOf?: (path: string) => string | undefined }): ReactNode {
  const lines = inFormOrder(problemLines(messages, nameOf ?? (() => undefined)));
  if (lines.length === 0) return null;
  return (
    <div className="fix-list" data-testid="fix-list">
      <p className="fix-head">
        <strong>Needs fixing before saving</strong> <span className="fix-count">{lines.length === 1 ? '1 thing' : `${lines.length} things`}</span>
      </p>
      <ol className="fix-lines">
        {lines.map((l, i) => (
          <li key={l.path}>
            <button type="button" className="fix-line" onClick={() => document.getElementById(fieldId(l.path))?.focus()} data-path={l.path}>
              <span className="fix-no" aria-hidden="true">
                {i + 1}
              </span>
              <span className="fix-words">
                {l.name ? <span className="fix-name">{l.name}: </span> : null}
                <span className="fix-what">{l.text}</span>
              </span>
              <span className="fix-go" aria-hidden="true">
                go to it
              </span>
            </button>
          </li>
        ))}
      </ol>
    </div>
  );
}

/**
 * The note after a save. A refused save lists every thing to fix, each a button to its field; a
 * save refused because the record changed elsewhere offers to reload the saved version
 * (`onReload`). `takeFocus` moves focus to the note (after a save, where the person is looking).
 */
export function EditorStatus({ status, summary, onDismiss, onReload, nameOf, takeFocus, className }: {
  status: SaveStatus;
  summary: Messages;
  onDismiss: () => void;
  onReload?: () => void;
  nameOf?: (path: string) => string | undefined;
  takeFocus?: boolean;
  className?: string;
}): ReactNode {
  return (
    <Notice
      kind={status.kind}
      onDismiss={onDismiss}
      testId="editor-status"
      takeFocus={takeFocus}
      className={className}
      action={status.stale && onReload ? { label: 'Reload the saved version', onClick: onReload, testId: 'reload-record' } : undefined}
    >
      {status.text}
      <FixList messages={summary} nameOf={nameOf} />
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
