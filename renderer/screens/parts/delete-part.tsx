/**
 * Deleting a part, asking first. A part that a plan or an engine's fitted ignition still names is
 * refused by the store (IN_USE) with a sentence saying who uses it; that sentence is shown in a
 * second dialog, and nothing is removed.
 */
import type { ReactNode } from 'react';
import { call } from '../../app/bridge.js';
import { useDeleteSteps, type DeleteTarget } from '../../app/delete-steps.js';
import { Confirm, Dialog } from '../../app/Dialog.js';

/** `onStale`: the part changed or went since it was shown; called when the refusal is closed, to reload. */
export function useDeletePart(onDone: (target: DeleteTarget) => void, onStale?: () => void) {
  const { target, stage, setStage, busy, setBusy, close: closeSteps, ask } = useDeleteSteps<{ step: 'refused'; message: string; inUse: boolean; stale: boolean }>();
  const close = (): void => {
    if (stage.step === 'refused' && stage.stale) onStale?.();
    closeSteps();
  };

  const send = async (): Promise<void> => {
    if (!target) return;
    setBusy(true);
    const r = await call('parts.delete', { id: target.id, expectedUpdatedAt: target.updatedAt });
    setBusy(false);
    if (r.ok) {
      close();
      return onDone(target);
    }
    setStage({ step: 'refused', message: r.error.message, inUse: r.error.code === 'IN_USE', stale: r.error.code === 'STALE' || r.error.code === 'NOT_FOUND' });
  };

  const dialog: ReactNode =
    target && stage.step === 'ask' ? (
      <Confirm
        title={`Delete ${target.name}?`}
        confirmLabel="Delete the part"
        cancelLabel="Keep it"
        danger
        busy={busy}
        onConfirm={() => void send()}
        onCancel={close}
        testId="delete-part-dialog"
      >
        <p>The part is taken off the shelf in this workshop. This cannot be undone.</p>
      </Confirm>
    ) : target && stage.step === 'refused' ? (
      <Dialog
        title={stage.inUse ? `${target.name} is still in use` : `${target.name} was not deleted`}
        onCancel={close}
        testId="delete-part-refused"
        actions={
          <button type="button" data-autofocus onClick={close}>
            {stage.stale && onStale ? 'Close and reload the list' : 'Close'}
          </button>
        }
      >
        <p data-testid="delete-part-refusal">{stage.message}</p>
        <p>Nothing was deleted; the part is still on the shelf.</p>
      </Dialog>
    ) : null;

  return { ask, dialog };
}
