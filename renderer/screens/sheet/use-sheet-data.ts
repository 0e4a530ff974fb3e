/**
 * The data behind the wiring-sheet screen: the engines, the chosen engine's plans, and the sheet
 * of the chosen plan (re-read when `version` changes). A late answer for a plan no longer shown is
 * dropped, so a slow reply never puts another plan's sheet on the screen.
 */
import { useEffect, useState } from 'react';
import type { Plan } from '../../../db/schema.js';
import type { ResponseOf } from '../../../electron/ipc/channels.js';
import { call } from '../../app/bridge.js';

export type SheetAnswer = ResponseOf<'sheet.get'>;
export type Loaded<T> = { value: T | null; problem: string | null; busy: boolean; for: number | null };

export function useEngines(): { value: ResponseOf<'engines.list'> | null; problem: string | null } {
  const [state, setState] = useState<{ value: ResponseOf<'engines.list'> | null; problem: string | null }>({ value: null, problem: null });
  useEffect(() => {
    let live = true;
    void call('engines.list', {}).then((r) => live && setState(r.ok ? { value: r.value, problem: null } : { value: null, problem: r.error.message }));
    return () => {
      live = false;
    };
  }, []);
  return state;
}

export function usePlans(engineId: number | null): Loaded<Plan[]> {
  const [state, setState] = useState<Loaded<Plan[]>>({ value: null, problem: null, busy: false, for: null });
  useEffect(() => {
    if (engineId === null) return;
    let live = true;
    setState((s) => ({ ...s, busy: true }));
    void call('plans.list', { engineId }).then((r) => {
      if (!live) return;
      setState(r.ok ? { value: r.value, problem: null, busy: false, for: engineId } : { value: null, problem: r.error.message, busy: false, for: engineId });
    });
    return () => {
      live = false;
    };
  }, [engineId]);
  return state;
}

/** The sheet of `planId`; `replace` puts in an answer that came from a save ('sheet.tick' answers with the sheet). */
export function useSheet(planId: number | null, version: number): Loaded<SheetAnswer> & { replace: (a: SheetAnswer, planId: number) => void } {
  const [state, setState] = useState<Loaded<SheetAnswer>>({ value: null, problem: null, busy: false, for: null });
  useEffect(() => {
    if (planId === null) return;
    let live = true;
    setState((s) => ({ ...s, busy: true }));
    void call('sheet.get', { planId }).then((r) => {
      if (!live) return;
      // A failed re-read keeps the sheet already shown (with the problem above it): ticks and typed readings stay in view.
      setState((s) => (r.ok ? { value: r.value, problem: null, busy: false, for: planId } : { value: s.for === planId ? s.value : null, problem: r.error.message, busy: false, for: planId }));
    });
    return () => {
      live = false;
    };
  }, [planId, version]);
  return { ...state, replace: (a, id) => setState({ value: a, problem: null, busy: false, for: id }) };
}
