/**
 * "Wiring sheet": the sheet of one plan, to print or to keep open beside the car. Pick the engine
 * and the plan (by default the plan on the bench, else the engine being worked on and its first
 * plan); tick steps as they are done (saved at once); write down readings beside the measuring
 * steps (each flagged in words, a mark and a colour when outside its band, with the likely causes);
 * set the plan's status by hand; print on A4 or Letter.
 */
import { useEffect, useMemo, useState, type ReactNode } from 'react';
import type { PlanStatus, Reading } from '../../../db/schema.js';
import type { BenchPlan } from '../../app/bench-plan.js';
import { call } from '../../app/bridge.js';
import type { CurrentEngine } from '../../app/current-engine.js';
import { Confirm } from '../../app/Dialog.js';
import { useLeaveGuard } from '../../app/leave-guard.js';
import { Notice, type NoticeKind, NoticeMark } from '../../app/Notice.js';
import type { Navigate } from '../../app/routes.js';
import { saveSettings, useSettings } from '../../app/settings.js';
import { statusWords } from '../../sheet/format.js';
import type { Band, JudgedReading, SheetStep } from '../../sheet/model.js';
import { SheetDocument, type PageSize } from '../../sheet/SheetDocument.js';
import { PrintBar } from '../../app/PrintBar.js';
import { useRemovalNotice } from '../../app/removal.js';
import { ReadingEntry } from './ReadingEntry.js';
import { TickBox, TickError, type TickState } from './TickBox.js';
import { useEngines, usePlans, useSheet } from './use-sheet-data.js';

type Props = {
  planId: number | null;
  current: CurrentEngine | null;
  bench: BenchPlan | null;
  onEngineChosen: (e: CurrentEngine) => void;
  onPlanChosen: (p: BenchPlan) => void;
  navigate: Navigate;
};

const statuses: readonly PlanStatus[] = ['draft', 'checked', 'wired', 'done'];
const reachedWords = { none: 'not yet wired', wired: 'wired in: every fitting step is ticked', done: 'finished: wired, and every check reads in range' } as const;

/** Latest first: the latest date taken, then the highest id (the store's own order for "latest"). */
const latestFirst = (a: Reading, b: Reading): number => (a.takenOn === b.takenOn ? b.id - a.id : a.takenOn < b.takenOn ? 1 : -1);

export function SheetScreen({ planId: routePlanId, current, bench, onEngineChosen, onPlanChosen, navigate }: Props): ReactNode {
  const engines = useEngines();
  const [engineId, setEngineId] = useState<number | null>(null);
  const [planId, setPlanId] = useState<number | null>(routePlanId ?? bench?.id ?? null);
  const plans = usePlans(engineId);
  const [version, setVersion] = useState(0);
  const sheet = useSheet(planId, version);
  const [ticks, setTicks] = useState<Record<string, TickState>>({});
  const [drafts, setDrafts] = useState<ReadonlySet<string>>(new Set());
  const [ask, setAsk] = useState<{ then: () => void } | null>(null);
  const [flash, setFlash] = useState<{ kind: NoticeKind; text: string } | null>(null);
  // A deleted reading's note with its Undo, here on the sheet (the frame's note is for engines and parts).
  const removal = useRemovalNotice(() => setVersion((v) => v + 1));
  const [statusProblem, setStatusProblem] = useState<string | null>(null);

  useLeaveGuard(drafts.size > 0, 'A reading you typed on the wiring sheet');

  // The route or the bench names a plan: find its engine. Otherwise start on the engine being worked on.
  const [lookingUp, setLookingUp] = useState(true);
  useEffect(() => {
    const wanted = routePlanId ?? bench?.id ?? null;
    setLookingUp(true);
    if (wanted === null) {
      setEngineId(current?.id ?? null);
      setLookingUp(false);
      return;
    }
    let live = true;
    void call('plans.get', { id: wanted }).then((r) => {
      if (!live) return;
      if (r.ok) {
        setEngineId(r.value.engineId);
        setPlanId(r.value.id);
      } else {
        setPlanId(null);
        setEngineId(current?.id ?? null);
      }
      setLookingUp(false);
    });
    return () => {
      live = false;
    };
  }, [routePlanId]);

  // Without an engine (or with one that is gone), the first in the list.
  useEffect(() => {
    const list = engines.value;
    if (lookingUp || !list || list.length === 0) return;
    if (engineId === null || !list.some((e) => e.id === engineId)) setEngineId(list[0]!.id);
  }, [engines.value, engineId, lookingUp]);

  // The engine's plans arrived: keep the chosen plan if it is one of them, else take the first.
  useEffect(() => {
    if (plans.for !== engineId || !plans.value) return;
    if (planId === null || !plans.value.some((p) => p.id === planId)) setPlanId(plans.value[0]?.id ?? null);
  }, [plans.value, plans.for]);

  const answer = sheet.value && sheet.for === planId ? sheet.value : null;
  const plan = plans.value?.find((p) => p.id === planId) ?? null;

  // The plan shown is the plan on the bench, and its engine the one being worked on.
  useEffect(() => {
    if (!answer || !plan || plan.id !== planId) return;
    if (bench?.id !== plan.id || bench.name !== plan.name) onPlanChosen({ id: plan.id, name: plan.name, engineId: plan.engineId });
    const e = engines.value?.find((x) => x.id === plan.engineId);
    if (e && current?.id !== e.id) onEngineChosen({ id: e.id, name: e.name });
  }, [answer, plan]);

  const guarded = (then: () => void): void => {
    if (drafts.size > 0) setAsk({ then });
    else then();
  };
  const choosePlan = (id: number | null): void =>
    guarded(() => {
      setTicks({});
      setDrafts(new Set());
      setFlash(null);
      setPlanId(id);
    });
  const chooseEngine = (id: number): void =>
    guarded(() => {
      setTicks({});
      setDrafts(new Set());
      setFlash(null);
      setPlanId(null);
      setEngineId(id);
    });

  const tick = async (step: SheetStep, on: boolean): Promise<void> => {
    if (planId === null) return;
    const forPlan = planId;
    setTicks((t) => ({ ...t, [step.key]: { want: on, saving: true, error: null } }));
    const r = await call('sheet.tick', { planId: forPlan, stepKey: step.key, ticked: on });
    if (r.ok) {
      sheet.replace(r.value, forPlan);
      setTicks((t) => {
        const rest = { ...t };
        if (rest[step.key]?.want === on) delete rest[step.key];
        return rest;
      });
    } else {
      setTicks((t) => ({ ...t, [step.key]: { want: on, saving: false, error: r.error.message } }));
    }
  };

  const setStatus = async (status: PlanStatus): Promise<void> => {
    if (planId === null) return;
    setStatusProblem(null);
    const r = await call('plans.setStatus', { id: planId, status });
    if (!r.ok) setStatusProblem(r.error.message);
    else {
      setFlash({ kind: 'done', text: `The plan is now marked “${statusWords[status]}”.` });
      setVersion((v) => v + 1);
    }
  };

  const ticked = useMemo(() => new Set(answer?.ticked ?? []), [answer]);
  const bands = useMemo(() => new Map<number, Band>((answer?.judged ?? []).map((j) => [j.readingId, j.band])), [answer]);
  const readingsByQuantity = useMemo(() => {
    const m = new Map<string, Reading[]>();
    for (const r of answer?.readings ?? []) m.set(r.quantity, [...(m.get(r.quantity) ?? []), r]);
    for (const list of m.values()) list.sort(latestFirst);
    return m;
  }, [answer]);
  const taken = useMemo(() => {
    const m = new Map<string, JudgedReading & { takenOn?: string }>();
    if (!answer) return m;
    for (const stage of answer.sheet.stages) {
      for (const step of stage.steps) {
        if (!step.reading) continue;
        const latest = readingsByQuantity.get(step.reading.quantity)?.[0];
        const j = latest ? answer.judged.find((x) => x.readingId === latest.id && x.stepKey === step.key) : undefined;
        if (latest && j) m.set(step.key, { ...j, takenOn: latest.takenOn });
      }
    }
    return m;
  }, [answer, readingsByQuantity]);

  // The paper is kept in the store's settings (shared with the weighing screen's print).
  const pageSize: PageSize = useSettings().pageSize;
  const onDirty = useMemo(
    () => (key: string, dirty: boolean) =>
      setDrafts((d) => {
        if (d.has(key) === dirty) return d;
        const n = new Set(d);
        if (dirty) n.add(key);
        else n.delete(key);
        return n;
      }),
    [],
  );

  const noEngines = engines.value !== null && engines.value.length === 0;
  const noPlans = plans.for === engineId && plans.value !== null && plans.value.length === 0;

  return (
    <section className="screen sheet-screen" aria-labelledby="sheet-screen-title">
      <div className="screen-head sheet-screen-head">
        <h1 id="sheet-screen-title" tabIndex={-1}>
          Wiring sheet
        </h1>
        {engines.value && engines.value.length > 0 ? (
          <div className="sheet-pickers">
            <div className="field inline-field">
              <label htmlFor="sheet-engine">Engine</label>
              <select id="sheet-engine" value={engineId ?? ''} onChange={(e) => chooseEngine(Number(e.target.value))}>
                {engineId === null ? <option value="">Choose…</option> : null}
                {engines.value.map((x) => (
                  <option key={x.id} value={x.id}>
                    {x.name}
                  </option>
                ))}
              </select>
            </div>
            {plans.value && plans.value.length > 0 ? (
              <div className="field inline-field">
                <label htmlFor="sheet-plan">Plan</label>
                <select id="sheet-plan" value={planId ?? ''} onChange={(e) => choosePlan(Number(e.target.value))}>
                  {plans.value.map((p) => (
                    <option key={p.id} value={p.id}>
                      {p.name}
                    </option>
                  ))}
                </select>
              </div>
            ) : null}
          </div>
        ) : null}
      </div>
      {engines.problem ? <Notice kind="problem">{engines.problem}</Notice> : null}
      {plans.problem ? <Notice kind="problem">{plans.problem}</Notice> : null}
      {noEngines ? (
        <div className="empty">
          <p>There is no engine yet, so there is no plan to wire.</p>
          <button type="button" className="primary" onClick={() => navigate({ to: 'new-engine' })}>
            Add an engine
          </button>
        </div>
      ) : null}
      {noPlans ? (
        <div className="empty">
          <p>This engine has no plan yet. Make one while weighing a combination; its wiring sheet then shows here.</p>
          <button type="button" className="primary" onClick={() => navigate({ to: 'combination' })}>
            Weigh a combination
          </button>
        </div>
      ) : null}
      {sheet.problem && sheet.for === planId ? <Notice kind="problem">{sheet.problem}</Notice> : null}
      {removal.notice}
      {flash ? (
        <Notice kind={flash.kind} onDismiss={() => setFlash(null)} testId="sheet-flash">
          {flash.text}
        </Notice>
      ) : null}
      {!answer && sheet.busy ? <p className="quiet">Making the sheet…</p> : null}

      {answer && planId !== null ? (
        <>
          <div className="sheet-controls" data-testid="sheet-controls">
            <div className="field inline-field">
              <label htmlFor="sheet-status">Plan status</label>
              <select id="sheet-status" value={answer.status} onChange={(e) => void setStatus(e.target.value as PlanStatus)} aria-describedby={statusProblem ? 'sheet-status-error' : undefined}>
                {statuses.map((s) => (
                  <option key={s} value={s}>
                    {statusWords[s]}
                  </option>
                ))}
              </select>
              {statusProblem ? (
                <span className="field-error" id="sheet-status-error">
                  <NoticeMark kind="problem" />{statusProblem}
                </span>
              ) : null}
            </div>
            <p className="sheet-progress" data-testid="sheet-progress" aria-live="polite">
              <strong>{answer.progress.fittingTicked}</strong> of {answer.progress.fittingSteps} fitting steps ticked · <strong>{answer.progress.checksInBand}</strong> of {answer.progress.checkSteps} checks in range
              <span className="quiet"> ({reachedWords[answer.progress.reached]})</span>
            </p>
            <PrintBar
              what="The sheet"
              pageSize={pageSize}
              onPageSize={(s) => void saveSettings({ pageSize: s })}
              onResult={(kind, text) => setFlash({ kind, text })}
            />
          </div>
          <SheetDocument
            sheet={answer.sheet}
            pageSize={pageSize}
            ticked={ticked}
            taken={taken}
            tickSlot={(step) => <TickBox stepKey={step.key} title={step.title} saved={ticked.has(step.key)} pending={ticks[step.key]} onChange={(on) => void tick(step, on)} />}
            noteSlot={(step) => <TickError stepKey={step.key} pending={ticks[step.key]} />}
            readingSlot={(step) => (
              <ReadingEntry
                key={`${planId}-${step.key}`}
                planId={planId}
                step={step}
                readings={readingsByQuantity.get(step.reading!.quantity) ?? []}
                bands={bands}
                onDirty={onDirty}
                onSaved={(what) => {
                  setFlash({ kind: 'done', text: what });
                  setVersion((v) => v + 1);
                }}
                onReload={() => setVersion((v) => v + 1)}
                onRemoved={(r) => {
                  setFlash(null);
                  removal.announce(r);
                  setVersion((v) => v + 1);
                }}
              />
            )}
          />
        </>
      ) : null}

      {ask ? (
        <Confirm
          title="Leave the typed reading?"
          confirmLabel="Leave and lose it"
          cancelLabel="Stay and keep it"
          danger
          onConfirm={() => {
            const then = ask.then;
            setAsk(null);
            then();
          }}
          onCancel={() => setAsk(null)}
          testId="sheet-leave-dialog"
        >
          <p>A reading typed on this sheet is not saved yet. Going to another plan throws it away.</p>
        </Confirm>
      ) : null}
    </section>
  );
}
