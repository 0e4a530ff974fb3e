/**
 * "You have unsaved changes": a screen with a form registers a check, and every in-app move
 * asks it first. Closing or reloading the page is covered separately by `beforeunload`.
 */
import { createContext, useContext, useEffect, useRef } from 'react';

export type LeaveCheck = () => { dirty: boolean; what: string };
export type LeaveGuard = { register(check: LeaveCheck): () => void };
export const LeaveGuardContext = createContext<LeaveGuard>({ register: () => () => {} });

/** Registers `dirty`/`what` for as long as the calling screen is shown. */
export function useLeaveGuard(dirty: boolean, what: string): void {
  const guard = useContext(LeaveGuardContext);
  const latest = useRef({ dirty, what });
  latest.current = { dirty, what };
  useEffect(() => guard.register(() => latest.current), [guard]);
  useEffect(() => {
    if (!dirty) return;
    const onBeforeUnload = (e: BeforeUnloadEvent): void => {
      e.preventDefault();
      e.returnValue = ''; // older engines need this set to show their own leave prompt
    };
    window.addEventListener('beforeunload', onBeforeUnload);
    return () => window.removeEventListener('beforeunload', onBeforeUnload);
  }, [dirty]);
}
