/**
 * The data behind the weigh screen, each piece fetched through the bridge when what it depends on
 * changes. A late answer for an engine no longer shown is dropped, so a slow reply can never put
 * another engine's figures on the screen.
 */
import { useEffect, useState } from 'react';
import type { Engine, Part, PartKind, Plan } from '../../../db/schema.js';
import type { ComparisonAnswer, ResponseOf, SearchAnswer } from '../../../electron/ipc/channels.js';
import { call } from '../../app/bridge.js';

export type PartsByKind = Record<PartKind, Part[]>;
export const emptyParts = (): PartsByKind => ({ coil: [], ballast: [], module: [], tach: [], leads: [], plug: [] });

export type Loaded<T> = { value: T | null; problem: string | null; busy: boolean };
const start = <T,>(): Loaded<T> => ({ value: null, problem: null, busy: true });

export function useEnginesAndParts(): { engines: Loaded<ResponseOf<'engines.list'>>; parts: PartsByKind } {
  const [engines, setEngines] = useState<Loaded<ResponseOf<'engines.list'>>>(start);
  const [parts, setParts] = useState<PartsByKind>(emptyParts);
  useEffect(() => {
    let live = true;
    void call('engines.list', {}).then((r) => live && setEngines(r.ok ? { value: r.value, problem: null, busy: false } : { value: null, problem: r.error.message, busy: false }));
    void call('parts.list', {}).then((r) => {
      if (!live || !r.ok) return;
      const byKind = emptyParts();
      for (const p of r.value) byKind[p.kind].push(p);
      setParts(byKind);
    });
    return () => {
      live = false;
    };
  }, []);
  return { engines, parts };
}

/** The chosen engine and its plans; `version` re-reads the plans after a save. */
export function useEngine(engineId: number | null, version: number): { engine: Loaded<Engine>; plans: Plan[]; plansFor: number | null } {
  const [engine, setEngine] = useState<Loaded<Engine>>(start);
  const [plans, setPlans] = useState<{ list: Plan[]; for: number | null }>({ list: [], for: null });
  useEffect(() => {
    if (engineId === null) return;
    let live = true;
    setEngine((e) => (e.value?.id === engineId ? e : start()));
    void call('engines.get', { id: engineId }).then((r) => live && setEngine(r.ok ? { value: r.value, problem: null, busy: false } : { value: null, problem: r.error.message, busy: false }));
    return () => {
      live = false;
    };
  }, [engineId]);
  useEffect(() => {
    if (engineId === null) return;
    let live = true;
    void call('plans.list', { engineId }).then((r) => {
      if (live) setPlans({ list: r.ok ? r.value : [], for: engineId });
    });
    return () => {
      live = false;
    };
  }, [engineId, version]);
  return { engine, plans: plans.list, plansFor: plans.for };
}

/**
 * The comparison of the engine's fitted ignition with the ticked plans; `conditions`, when given,
 * are weighed in place of the engine's stored working conditions (a change not yet saved).
 */
export function useComparison(
  engineId: number | null,
  ticked: readonly number[],
  ready: boolean,
  version: string,
  conditions?: Engine['conditions'] | undefined,
): Loaded<ComparisonAnswer> {
  const [state, setState] = useState<Loaded<ComparisonAnswer>>(start);
  const key = ticked.join(',');
  const conditionsKey = conditions ? JSON.stringify(conditions) : '';
  useEffect(() => {
    if (engineId === null || !ready) return;
    let live = true;
    setState((s) => ({ ...s, busy: true }));
    void call('check.plans', { engineId, planIds: [...ticked], ...(conditions ? { conditions } : {}) }).then((r) => {
      if (!live) return;
      setState(r.ok ? { value: r.value, problem: null, busy: false } : { value: null, problem: r.error.message, busy: false });
    });
    return () => {
      live = false;
    };
  }, [engineId, key, ready, version, conditionsKey]);
  return state;
}

/** The best combinations from the whole parts bin for the engine. */
export function useShelfSearch(engineId: number | null, version: number): Loaded<SearchAnswer> {
  const [state, setState] = useState<Loaded<SearchAnswer>>(start);
  useEffect(() => {
    if (engineId === null) return;
    let live = true;
    setState({ value: null, problem: null, busy: true });
    void call('check.search', { engineId, top: 5 }).then((r) => {
      if (live) setState(r.ok ? { value: r.value, problem: null, busy: false } : { value: null, problem: r.error.message, busy: false });
    });
    return () => {
      live = false;
    };
  }, [engineId, version]);
  return state;
}
