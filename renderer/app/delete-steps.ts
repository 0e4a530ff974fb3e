/**
 * The state every delete-with-confirmation keeps: what is to be deleted, which question is open
 * (the first "Delete …?" or a later one the store's answer calls for), and whether the request is
 * on its way. `Later` names the screen's own later questions.
 */
import { useState } from 'react';

/** `updatedAt`: the version the screen shows, sent with the delete so a changed record is not removed. */
export type DeleteTarget = { id: number; name: string; updatedAt: string };

export function useDeleteSteps<Later extends { step: string }>() {
  const [target, setTarget] = useState<DeleteTarget | null>(null);
  const [stage, setStage] = useState<{ step: 'ask' } | { step: 'closed' } | Later>({ step: 'closed' });
  const [busy, setBusy] = useState(false);

  const close = (): void => {
    setStage({ step: 'closed' });
    setTarget(null);
  };
  const ask = (t: DeleteTarget): void => {
    setTarget(t);
    setStage({ step: 'ask' });
  };

  return { target, stage, setStage, busy, setBusy, close, ask };
}
