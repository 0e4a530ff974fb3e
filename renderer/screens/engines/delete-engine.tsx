/**
 * Deleting an engine, asking first. If the store answers IN_USE (plans are made for it), ask a
 * second time, saying how many plans would go with it, and only then send deletePlansToo.
 */
import type { ReactNode } from 'react';
import { call } from '../../app/bridge.js';
import { useDeleteSteps } from '../../app/delete-steps.js';
import { Confirm } from '../../app/Dialog.js';

/** `onProblem` gets the store's code too: STALE means the engine changed since it was shown (reload it). */
export function useDeleteEngine(onDone: (id: number, plansDeleted: number) => void, onProblem: (message: string, code: string) => void) {
  const { target, stage, setStage, busy, setBusy, close, ask } = useDeleteSteps<{ step: 'plans'; count: number }>();

  const send = async (deletePlansToo: boolean): Promise<void> => {
    if (!target) return;
    setBusy(true);
    const r = await call('engines.delete', { id: target.id, deletePlansToo, expectedUpdatedAt: target.updatedAt });
    if (!r.ok && r.error.code === 'IN_USE' && !deletePlansToo) {
      const plans = await call('plans.list', { engineId: target.id });
      setBusy(false);
      setStage({ step: 'plans', count: plans.ok ? plans.value.length : Number.NaN });
      return;
    }
    setBusy(false);
    const id = target.id;
    close();
    if (r.ok) onDone(id, r.value.plansDeleted);
    else onProblem(r.error.message, r.error.code);
  };

  const dialog: ReactNode =
    target && stage.step === 'ask' ? (
      <Confirm
        title={`Delete ${target.name}?`}
        confirmLabel="Delete the engine"
        cancelLabel="Keep it"
        danger
        busy={busy}
        onConfirm={() => void send(false)}
        onCancel={close}
        testId="delete-dialog"
      >
        <p>The engine and everything recorded about it are removed from this workshop. This cannot be undone.</p>
      </Confirm>
    ) : target && stage.step === 'plans' ? (
      <Confirm
        title={`${target.name} has conversion plans`}
        confirmLabel={Number.isFinite(stage.count) ? `Delete the engine and its ${stage.count === 1 ? 'plan' : `${stage.count} plans`}` : 'Delete the engine and its plans'}
        cancelLabel="Keep it"
        danger
        busy={busy}
        onConfirm={() => void send(true)}
        onCancel={close}
        testId="delete-plans-dialog"
      >
        <p>
          {Number.isFinite(stage.count)
            ? `There ${stage.count === 1 ? 'is 1 conversion plan' : `are ${stage.count} conversion plans`} for this engine.`
            : 'There are conversion plans for this engine.'}{' '}
          Deleting the engine deletes {stage.count === 1 ? 'that plan' : 'those plans'} too, with the readings taken for {stage.count === 1 ? 'it' : 'them'}. This cannot be undone.
        </p>
      </Confirm>
    ) : null;

  return { ask, dialog };
}
