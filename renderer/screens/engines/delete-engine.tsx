/**
 * Deleting an engine: one question, asked with what goes with it (how many plans and readings,
 * read from the store when the question opens). The delete can be undone from the note that
 * follows, and from the recently removed list until the app is closed.
 */
import type { ReactNode } from 'react';
import { call } from '../../app/bridge.js';
import { useDeleteSteps } from '../../app/delete-steps.js';
import { Confirm } from '../../app/Dialog.js';
import { useAnnounceRemoval } from '../../app/removal.js';

const count = (n: number, one: string, many: string) => (n === 1 ? `1 ${one}` : `${n} ${many}`);

/** `onProblem` gets the store's code too: STALE means the engine changed since it was shown (reload it). */
export function useDeleteEngine(onDone: (id: number, plansDeleted: number) => void, onProblem: (message: string, code: string) => void) {
  const { target, stage, setStage, busy, setBusy, close, ask: open } = useDeleteSteps<{ step: 'counted'; plans: number; readings: number }>();
  const announce = useAnnounceRemoval();

  const ask = (t: Parameters<typeof open>[0]): void => {
    open(t);
    void call('engines.contents', { id: t.id }).then((r) => {
      if (r.ok) setStage({ step: 'counted', plans: r.value.plans, readings: r.value.readings });
      else {
        close();
        onProblem(r.error.message, r.error.code);
      }
    });
  };

  const send = async (plans: number): Promise<void> => {
    if (!target) return;
    setBusy(true);
    // Plans are sent as confirmed only when the question named them; one added since is refused (IN_USE).
    const r = await call('engines.delete', { id: target.id, deletePlansToo: plans > 0, expectedUpdatedAt: target.updatedAt });
    setBusy(false);
    const { id, name } = target;
    close();
    if (r.ok) {
      onDone(id, r.value.plansDeleted);
      const withPlans = r.value.plansDeleted > 0 ? `, with ${r.value.plansDeleted === 1 ? 'its plan' : `its ${r.value.plansDeleted} plans`}` : '';
      announce({ text: `${name} was deleted${withPlans}.`, undoToken: r.value.undoToken });
    } else onProblem(r.error.message, r.error.code);
  };

  const dialog: ReactNode =
    target && stage.step === 'counted' ? (
      <Confirm
        title={`Delete ${target.name}?`}
        confirmLabel={stage.plans > 0 ? `Delete the engine, ${count(stage.plans, 'plan', 'plans')} and ${count(stage.readings, 'reading', 'readings')}` : 'Delete the engine'}
        cancelLabel="Keep it"
        danger
        busy={busy}
        onConfirm={() => void send(stage.plans)}
        onCancel={close}
        testId="delete-dialog"
      >
        <p data-testid="delete-engine-counts">
          {stage.plans > 0
            ? `Its ${count(stage.plans, 'conversion plan', 'conversion plans')} and the ${count(stage.readings, 'reading', 'readings')} taken for them go with it.`
            : 'It has no conversion plans; its details and advance curve go.'}
        </p>
        <p>You can undo this from the note that follows, or under Records, Recently removed, until you close the app.</p>
      </Confirm>
    ) : null;

  return { ask, dialog };
}
