/**
 * A modal dialog on the native <dialog> element: showModal() makes the page behind it inert,
 * Escape closes it (reported as the "cancel" choice), Tab is kept inside it, and it is named by
 * its title. Focus goes back where it was when it closes.
 */
import { useEffect, useId, useRef, type ReactNode } from 'react';

type Props = {
  title: string;
  children: ReactNode;
  onCancel: () => void;
  actions: ReactNode;
  testId?: string;
};

const focusable = 'button:not([disabled]), [href], input:not([disabled]), select:not([disabled]), textarea:not([disabled]), [tabindex]:not([tabindex="-1"])';

export function Dialog({ title, children, onCancel, actions, testId }: Props): ReactNode {
  const ref = useRef<HTMLDialogElement>(null);
  const titleId = useId();
  const bodyId = useId();
  const cancelRef = useRef(onCancel);
  cancelRef.current = onCancel;

  useEffect(() => {
    const dialog = ref.current;
    if (!dialog) return;
    const before = document.activeElement as HTMLElement | null;
    if (!dialog.open) dialog.showModal();
    // The first button is the safe choice, so Enter on an untouched dialog never destroys anything.
    dialog.querySelector<HTMLElement>('[data-autofocus]')?.focus();
    const onCancelEvent = (e: Event): void => {
      e.preventDefault();
      cancelRef.current();
    };
    const onKey = (e: KeyboardEvent): void => {
      if (e.key !== 'Tab') return;
      const items = [...dialog.querySelectorAll<HTMLElement>(focusable)];
      if (items.length === 0) return;
      const first = items[0]!;
      const last = items[items.length - 1]!;
      if (e.shiftKey && document.activeElement === first) {
        e.preventDefault();
        last.focus();
      } else if (!e.shiftKey && document.activeElement === last) {
        e.preventDefault();
        first.focus();
      }
    };
    dialog.addEventListener('cancel', onCancelEvent);
    dialog.addEventListener('keydown', onKey);
    return () => {
      dialog.removeEventListener('cancel', onCancelEvent);
      dialog.removeEventListener('keydown', onKey);
      if (dialog.open) dialog.close();
      before?.focus?.();
    };
  }, []);

  return (
    <dialog ref={ref} className="dialog" aria-labelledby={titleId} aria-describedby={bodyId} data-testid={testId}>
      <h2 id={titleId}>{title}</h2>
      <div id={bodyId} className="dialog-body">
        {children}
      </div>
      <div className="dialog-actions">{actions}</div>
    </dialog>
  );
}

/** A yes/no question. `danger` marks the confirming button as the destructive one (in words too). */
export function Confirm(props: {
  title: string;
  children: ReactNode;
  confirmLabel: string;
  cancelLabel?: string;
  danger?: boolean;
  busy?: boolean;
  onConfirm: () => void;
  onCancel: () => void;
  testId?: string;
}): ReactNode {
  const { title, children, confirmLabel, cancelLabel = 'Cancel', danger, busy, onConfirm, onCancel, testId } = props;
  return (
    <Dialog
      title={title}
      onCancel={onCancel}
      testId={testId}
      actions={
        <>
          <button type="button" data-autofocus onClick={onCancel} disabled={busy}>
            {cancelLabel}
          </button>
          <button type="button" className={danger ? 'danger' : 'primary'} onClick={onConfirm} disabled={busy}>
            {confirmLabel}
          </button>
        </>
      }
    >
      {children}
    </Dialog>
  );
}
