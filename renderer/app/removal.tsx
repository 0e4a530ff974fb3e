/**
 * After a delete: a note saying what went, with an "Undo" button for UNDO_SECONDS, whichever screen
 * the person moves to meanwhile. After that the note stays until put away and points to the
 * recently removed list (Records screen), which keeps every delete until the app is closed.
 */
import { createContext, useCallback, useContext, useEffect, useState, type ReactNode } from 'react';
import { call } from './bridge.js';
import { Notice } from './Notice.js';

/** What a screen says after its delete went through: the sentence and the store's token for undoing it. */
export type Removal = { text: string; undoToken: number };

/** How long the note offers "Undo" (seconds). */
export const UNDO_SECONDS = 30;

const RemovalContext = createContext<(r: Removal) => void>(() => undefined);
export const RemovalProvider = RemovalContext.Provider;

/** The screens' way to announce a delete. */
export function useAnnounceRemoval(): (r: Removal) => void {
  return useContext(RemovalContext);
}

type State =
  | { step: 'removed'; removal: Removal; undoable: boolean }
  | { step: 'undoing'; removal: Removal }
  | { step: 'back'; text: string }
  | { step: 'refused'; text: string }
  | null;

/** `onRestored`: the store changed (a record is back); lists should read again. */
export function useRemovalNotice(onRestored: () => void) {
  const [state, setState] = useState<State>(null);

  const announce = useCallback((removal: Removal) => setState({ step: 'removed', removal, undoable: removal.undoToken > 0 }), []);

  // The Undo button goes after UNDO_SECONDS; the recently removed list still has it.
  const token = state?.step === 'removed' && state.undoable ? state.removal.undoToken : null;
  useEffect(() => {
    if (token === null) return;
    const timer = setTimeout(() => {
      setState((s) => (s?.step === 'removed' && s.removal.undoToken === token ? { ...s, undoable: false } : s));
    }, UNDO_SECONDS * 1000);
    return () => clearTimeout(timer);
  }, [token]);

  const undo = async (removal: Removal): Promise<void> => {
    setState({ step: 'undoing', removal });
    const r = await call('removed.restore', { token: removal.undoToken });
    if (r.ok) {
      setState({ step: 'back', text: `${r.value.label} is back, as it was.` });
      onRestored();
    } else setState({ step: 'refused', text: r.error.message });
  };

  const put = (): void => setState(null);
  /** A delete that was refused: said in the same place, with no Undo. */
  const refused = useCallback((text: string) => setState({ step: 'refused', text }), []);

  const notice: ReactNode =
    state === null ? null : state.step === 'removed' || state.step === 'undoing' ? (
      <Notice
        key={`removed-${state.removal.undoToken}`}
        kind="done"
        testId="removal-notice"
        takeFocus
        onDismiss={put}
        action={
          state.step === 'removed' && state.undoable
            ? { label: 'Undo', onClick: () => void undo(state.removal) }
            : undefined
        }
      >
        {state.removal.text}{' '}
        {state.step === 'undoing'
          ? 'Putting it back…'
          : state.undoable
            ? `Undo brings it back (for ${UNDO_SECONDS} seconds here; under Records, Recently removed, until you close the app).`
            : 'It can still be brought back under Records, Recently removed, until you close the app.'}
      </Notice>
    ) : (
      <Notice kind={state.step === 'back' ? 'done' : 'problem'} testId="removal-notice" takeFocus onDismiss={put}>
        {state.text}
      </Notice>
    );

  return { announce, refused, notice };
}
