/**
 * A status line that never relies on colour alone: each kind has a word and an icon shape
 * (circle-i, tick, triangle-!) as well as its colour.
 */
import type { ReactNode } from 'react';

export type NoticeKind = 'info' | 'done' | 'problem';
const words: Record<NoticeKind, string> = { info: 'Note', done: 'Done', problem: 'Problem' };
const icons: Record<NoticeKind, string> = { info: 'i', done: '✓', problem: '!' };

export function Notice({ kind, children, onDismiss, testId }: { kind: NoticeKind; children: ReactNode; onDismiss?: () => void; testId?: string }): ReactNode {
  return (
    <div className={`notice notice-${kind}`} role={kind === 'problem' ? 'alert' : 'status'} data-testid={testId}>
      <span className={`notice-icon icon-${kind}`} aria-hidden="true">
        {icons[kind]}
      </span>
      <span className="notice-text">
        <strong>{words[kind]}:</strong> {children}
      </span>
      {onDismiss ? (
        <button type="button" className="small" onClick={onDismiss} aria-label={`Dismiss this ${words[kind].toLowerCase()}`}>
          Dismiss
        </button>
      ) : null}
    </div>
  );
}
