/**
 * Deleting a plan: one question, with how many readings go with it (read from the store when the
 * question opens). The note that follows offers Undo, and the recently removed list keeps it until
 * the app is closed.
 */
import type { ReactNode } from 'react';
import type { Plan } from '../../../db/schema.js';
import { call } from '../../app/bridge.js';
import { useDeleteSteps } from '../../app/delete-steps.js';
import { Confirm } from '../../app/Dialog.js';
import type { Removal } from '../../app/removal.js';

export function useDeletePlan(onDone: (id: number, removal: Removal) => void, onProblem: (message: string, code: string) => void) {
  const { target, stage, setStage, busy, setBusy, close, ask: open } = useDeleteSteps<{ step: 'counted'; readings: number }>();

  const ask = (p: Plan): void => {
    open({ id: p.id, name: p.name, updatedAt: p.updatedAt });
    void call('readings.list', { planId: p.id }).then((r) => {
      if (r.ok) setStage({ step: 'counted', readings: r.value.length });
      else {
        close();
        onProblem(r.error.message, r.error.code);
      }
    });
  };

  const send = async (): Promise<void> => {
    if (!target) return;
    setBusy(true);
    const r = await call('plans.delete', { id: target.id, expectedUpdatedAt: target.updatedAt });
    setBusy(false);
    const { id, name } = target;
    close();
    if (!r.ok) return onProblem(r.error.message, r.error.code);
    const n = r.value.readingsDeleted;
    onDone(id, { text: `The plan ${name} was deleted${n > 0 ? `, with ${n === 1 ? 'its reading' : `its ${n} readings`}` : ''}.`, undoToken: r.value.undoToken });
  };

  const dialog: ReactNode =
    target && stage.step === 'counted' ? (
      <Confirm
        title={`Delete the plan ${target.name}?`}
        confirmLabel={stage.readings > 0 ? `Delete the plan and ${stage.readings === 1 ? 'its reading' : `its ${stage.readings} readings`}` : 'Delete the plan'}
        cancelLabel="Keep it"
        danger
        busy={busy}
        onConfirm={() => void send()}
        onCancel={close}
        testId="delete-plan-dialog"
      >
        <p data-testid="delete-plan-counts">
          {stage.readings > 0
            ? `The ${stage.readings === 1 ? 'reading' : `${stage.readings} readings`} taken for it and its ticked steps go with it.`
            : 'No readings were taken for it; its ticked steps, if any, go with it.'}{' '}
          The parts stay on the shelf.
        </p>
        <p>You can undo this from the note that follows, or under Records, Recently removed, until you close the app.</p>
      </Confirm>
    ) : null;

  return { ask, dialog };
}
