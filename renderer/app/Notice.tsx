/**
 * A note pinned to the screen like a job tag: a stub on the left with a word and a mark, the
 * message, and its buttons. Never colour alone: each kind has its own word and its own mark, drawn
 * from the bench: a contact closed (sorted), a contact open (a snag), a meter needle (worth knowing).
 */
import { useEffect, useRef, type ReactNode } from 'react';

export type NoticeKind = 'info' | 'done' | 'problem';
export const noticeWords: Record<NoticeKind, string> = { info: 'Worth knowing', done: 'Sorted', problem: 'Snag' };

/** The mark on a note's stub: the contact closed, lifted open, or a meter's needle. */
export function NoticeMark({ kind }: { kind: NoticeKind }): ReactNode {
  return (
    <svg className={`tag-mark tag-mark-${kind}`} viewBox="0 0 28 16" width={28} height={16} aria-hidden="true" focusable="false">
      {kind === 'done' ? (
        <>
          <circle cx={4} cy={11} r={2.6} fill="currentColor" />
          <circle cx={24} cy={11} r={2.6} fill="currentColor" />
          <line x1={4} y1={11} x2={24} y2={11} stroke="currentColor" strokeWidth={2.6} strokeLinecap="round" />
        </>
      ) : null}
      {kind === 'problem' ? (
        <>
          <circle cx={4} cy={12} r={2.6} fill="currentColor" />
          <circle cx={24} cy={12} r={2.6} fill="none" stroke="currentColor" strokeWidth={1.6} />
          <line x1={4} y1={12} x2={19} y2={2.5} stroke="currentColor" strokeWidth={2.6} strokeLinecap="round" />
        </>
      ) : null}
      {kind === 'info' ? (
        <>
          <path d="M3 14 A11 11 0 0 1 25 14" fill="none" stroke="currentColor" strokeWidth={1.8} />
          <line x1={14} y1={14} x2={19.5} y2={5.5} stroke="currentColor" strokeWidth={2.2} strokeLinecap="round" />
          <circle cx={14} cy={14} r={1.8} fill="currentColor" />
        </>
      ) : null}
    </svg>
  );
}

type Props = {
  kind: NoticeKind;
  children: ReactNode;
  /** Takes the note away ("Put away"). */
  onDismiss?: () => void;
  /** One more thing to do about it, drawn as a button on the note (for example "Undo"). */
  action?: { label: string; onClick: () => void; testId?: string };
  testId?: string;
  /** Focus the note when it appears, so the person (and a screen reader) lands on it. */
  takeFocus?: boolean;
  className?: string;
};

export function Notice({ kind, children, onDismiss, action, testId, takeFocus, className }: Props): ReactNode {
  const ref = useRef<HTMLDivElement>(null);
  useEffect(() => {
    if (takeFocus) ref.current?.focus({ preventScroll: false });
  }, [takeFocus]);
  return (
    <div
      ref={ref}
      className={`tag notice tag-${kind}${className ? ` ${className}` : ''}`}
      role={kind === 'problem' ? 'alert' : 'status'}
      data-testid={testId}
      tabIndex={takeFocus ? -1 : undefined}
    >
      <span className="tag-stub">
        <NoticeMark kind={kind} />
        <span className="tag-word">{noticeWords[kind]}</span>
        <span className="visually-hidden">: </span>
      </span>
      <span className="tag-body">{children}</span>
      {action || onDismiss ? (
        <span className="tag-buttons">
          {action ? (
            <button type="button" className="small tag-action" onClick={action.onClick} data-testid={action.testId}>
              {action.label}
            </button>
          ) : null}
          {onDismiss ? (
            <button type="button" className="small tag-away" onClick={onDismiss} aria-label={`Put away this note: ${noticeWords[kind].toLowerCase()}`}>
              Put away
            </button>
          ) : null}
        </span>
      ) : null}
    </div>
  );
}
