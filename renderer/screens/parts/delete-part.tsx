/**
 * Deleting a part: one dialog. Who uses the part (plans, engines' existing setups) is read from the
 * store when the dialog opens, so a part in use is named with its users at once and nothing is
 * offered that the store would refuse; a free part is asked about once. The delete can be undone
 * from the note that follows, and from the recently removed list until the app is closed.
 */
import type { ReactNode } from 'react';
import { call } from '../../app/bridge.js';
import { useDeleteSteps, type DeleteTarget } from '../../app/delete-steps.js';
import { Confirm, Dialog } from '../../app/Dialog.js';
import { useAnnounceRemoval } from '../../app/removal.js';

type Later = { step: 'free' } | { step: 'refused'; message: string; inUse: boolean; stale: boolean };

/** `onStale`: the part changed or went since it was shown; called when the refusal is closed, to reload. */
export function useDeletePart(onDone: (target: DeleteTarget) => void, onStale?: () => void) {
  const { target, stage, setStage, busy, setBusy, close: closeSteps, ask: open } = useDeleteSteps<Later>();
  const announce = useAnnounceRemoval();
  const close = (): void => {
    if (stage.step === 'refused' && stage.stale) onStale?.();
    closeSteps();
  };

  const refused = (message: string, code: string): Later => ({ step: 'refused', message, inUse: code === 'IN_USE', stale: code === 'STALE' || code === 'NOT_FOUND' });

  const ask = (t: DeleteTarget): void => {
    open(t);
    void call('parts.usedBy', { id: t.id }).then((r) => {
      if (!r.ok) return setStage(refused(r.error.message, r.error.code));
      if (r.value.usedBy.length === 0) return setStage({ step: 'free' });
      setStage({ step: 'refused', inUse: true, stale: false, message: `"${t.name}" is used by ${r.value.usedBy.join(' and ')}. Take it out of those first, then delete it.` });
    });
  };

  const send = async (): Promise<void> => {
    if (!target) return;
    setBusy(true);
    const r = await call('parts.delete', { id: target.id, expectedUpdatedAt: target.updatedAt });
    setBusy(false);
    if (r.ok) {
      closeSteps();
      onDone(target);
      announce({ text: `${target.name} was taken off the shelf.`, undoToken: r.value.undoToken });
      return;
    }
    setStage(refused(r.error.message, r.error.code));
  };

  const dialog: ReactNode =
    target && stage.step === 'free' ? (
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
        <p>No plan and no engine uses it. It is taken off the shelf; you can undo this from the note that follows, or under Records, Recently removed, until you close the app.</p>
      </Confirm>
    ) : target && stage.step === 'refused' ? (
      <Dialog
        title={stage.inUse ? `${target.name} is in use` : `${target.name} was not deleted`}
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
