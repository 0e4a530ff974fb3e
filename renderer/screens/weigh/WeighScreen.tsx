/**
 * "Weigh a combination": pick the engine, make or change its plans, tick up to three and see them
 * beside the ignition fitted now (verdicts, charts, the four speeds, every check with why and what
 * to do), and the best combinations the parts bin offers. Unsaved plan edits are never dropped
 * without asking, whether the person leaves the screen, picks another engine or opens another plan.
 */
import { type ReactNode, useDeferredValue, useEffect, useMemo, useRef, useState } from 'react';
import type { Engine, Plan, PlanStatus } from '../../../db/schema.js';
import type { ShelfSuggestion, ShownSetup } from '../../../electron/ipc/channels.js';
import type { CurrentEngine } from '../../app/current-engine.js';
import { Confirm } from '../../app/Dialog.js';
import { useLeaveGuard } from '../../app/leave-guard.js';
import { Notice, type NoticeKind } from '../../app/Notice.js';
import { PrintBar } from '../../app/PrintBar.js';
import type { PageSize } from '../../sheet/SheetDocument.js';
import type { Navigate } from '../../app/routes.js';
import { saveSettings, settingsNow, useSettings } from '../../app/settings.js';
import { useGapUnit } from '../../app/units.js';
import { Cautions } from './Cautions.js';
import { KeyPointsTable } from './KeyPointsTable.js';
import { blankPlanForm, planToForm, suggestionToForm, type PlanForm } from './plan-form.js';
import { PlanEditor } from './PlanEditor.js';
import { useRemovalNotice } from '../../app/removal.js';
import { useDeletePlan } from './delete-plan.js';
import { MAX_TICKED, PlanList } from './PlanList.js';
import { RuleDetails, RuleOverview } from './RuleDetails.js';
import { SetupCards } from './SetupCards.js';
import { ShelfList } from './ShelfList.js';
import { AmbientField } from './AmbientField.js';
import { useComparison, useEngine, useEnginesAndParts, useShelfSearch } from './use-weigh-data.js';
import { WeighCharts } from './WeighCharts.js';
import { todayText } from '../../app/today.js';
import { figureText } from './words.js';

type Props = { current: CurrentEngine | null; onEngineChosen: (e: CurrentEngine) => void; navigate: Navigate };
type EditorState = { key: string; planId: number | null; updatedAt: string | null; status: PlanStatus; initial: PlanForm; startsDirty: boolean };

let editorSerial = 0;

export function WeighScreen({ current, onEngineChosen, navigate }: Props): ReactNode {
  const [unit] = useGapUnit();
  const { engines, parts } = useEnginesAndParts();
  const [engineId, setEngineId] = useState<number | null>(current?.id ?? null);
  const [plansVersion, setPlansVersion] = useState(0);
  // A deleted plan's note with its Undo; undoing reads the plans again.
  const removal = useRemovalNotice(() => setPlansVersion((v) => v + 1));
  const delPlan = useDeletePlan(
    (id, r) => {
      if (editor?.planId === id) {
        setEditor(null);
        setEditing({ dirty: false, name: '' });
      }
      setDone(null);
      removal.announce(r);
      setPlansVersion((v) => v + 1);
    },
    (message, code) => {
      setDone(null);
      removal.refused(message);
      if (code === 'STALE' || code === 'NOT_FOUND') setPlansVersion((v) => v + 1);
    },
  );
  const { engine, plans, plansFor } = useEngine(engineId, plansVersion);
  const [ticked, setTicked] = useState<{ ids: number[]; for: number | null }>({ ids: [], for: null });
  const [editor, setEditor] = useState<EditorState | null>(null);
  const [editing, setEditing] = useState({ dirty: false, name: '' });
  const [ask, setAsk] = useState<{ then: () => void } | null>(null);
  const [done, setDone] = useState<string | null>(null);
  const pageSize: PageSize = useSettings().pageSize;
  const [printed, setPrinted] = useState<{ kind: NoticeKind; text: string } | null>(null);

  const ready = plansFor === engineId && ticked.for === engineId;
  // A changed working condition (the air temperature) is weighed at once with the conditions just
  // typed, while the engine's own copy is saved beside it; the plans are not read again. A failed
  // save takes the typed conditions back, so the figures always match what is stored.
  const [weighAt, setWeighAt] = useState<{ for: number; conditions: Engine['conditions'] } | null>(null);
  const comparison = useComparison(engineId, ticked.ids, ready, String(plansVersion), weighAt && weighAt.for === engineId ? weighAt.conditions : undefined);
  const [shelfVersion, setShelfVersion] = useState(0);
  const search = useShelfSearch(engineId, shelfVersion);
  // The shelf is searched again once the change is saved (the search reads the stored engine) and
  // the comparison has answered, so the two do not share the processor and the charts come first.
  const [shelfDue, setShelfDue] = useState(false);
  // The save of a changed condition waits for the comparison's answer (at most 3 s): the store's
  // write holds the main process for the length of a disk flush, which the charts need not wait for.
  const weighed = useRef<{ before: unknown; resolve: () => void } | null>(null);
  useEffect(() => {
    const w = weighed.current;
    if (!w || comparison.busy) return;
    if (comparison.value === w.before && comparison.problem === null) return;
    weighed.current = null;
    w.resolve();
  }, [comparison]);
  const weighNow = (id: number, conditions: Engine['conditions']): Promise<void> =>
    new Promise((resolve) => {
      weighed.current?.resolve();
      weighed.current = { before: comparison.value, resolve };
      setTimeout(resolve, 3000);
      setWeighAt({ for: id, conditions });
    });
  useEffect(() => {
    if (!shelfDue || comparison.busy) return;
    setShelfDue(false);
    setShelfVersion((v) => v + 1);
  }, [comparison, shelfDue]);
  useLeaveGuard(editing.dirty, editing.name ? `The plan “${editing.name}”` : 'The new plan');

  // Without a remembered engine, or with one that is gone, start on the first in the list.
  useEffect(() => {
    const list = engines.value;
    if (!list || list.length === 0) return;
    if (engineId === null || !list.some((e) => e.id === engineId)) setEngineId(list[0]!.id);
  }, [engines.value]);

  // The engine chosen here is the one being worked on.
  useEffect(() => {
    const e = engine.value;
    if (e && e.id === engineId && current?.id !== e.id) onEngineChosen({ id: e.id, name: e.name });
  }, [engine.value]);

  // A newly shown engine starts with the plans ticked when it was last weighed (kept per engine in
  // the settings), or else its first plans; after a save, ticks that still name a plan stay.
  useEffect(() => {
    if (plansFor !== engineId || engineId === null) return;
    setTicked((t) => {
      if (t.for === engineId) return { ids: t.ids.filter((id) => plans.some((p) => p.id === id)), for: engineId };
      const remembered = settingsNow().weighTicks[String(engineId)];
      if (remembered) return { ids: remembered.filter((id) => plans.some((p) => p.id === id)).slice(0, MAX_TICKED), for: engineId };
      return { ids: plans.slice(0, MAX_TICKED).map((p) => p.id), for: engineId };
    });
  }, [plans, plansFor, engineId]);

  // The ticks are remembered for the engine, so a reload or the next start weighs the same plans.
  useEffect(() => {
    if (ticked.for === null || ticked.for !== engineId || plansFor !== engineId) return;
    const key = String(ticked.for);
    const stored = settingsNow().weighTicks;
    const before = stored[key];
    if (before && before.length === ticked.ids.length && before.every((id, i) => id === ticked.ids[i])) return;
    void saveSettings({ weighTicks: { ...stored, [key]: ticked.ids } });
  }, [ticked, plansFor, engineId]);

  /** Runs `then` at once, or after asking when a plan has unsaved changes. */
  const guarded = (then: () => void): void => {
    if (editing.dirty) setAsk({ then });
    else then();
  };

  const openEditor = (state: Omit<EditorState, 'key'>): void => {
    setDone(null);
    setEditor({ ...state, key: `ed${++editorSerial}` });
    requestAnimationFrame(() => {
      const el = document.getElementById('plan-editor-title');
      el?.scrollIntoView({ block: 'start' });
      document.getElementById('f-name')?.focus({ preventScroll: true });
    });
  };

  const e = engine.value;
  const newPlan = (): void => guarded(() => e && openEditor({ planId: null, updatedAt: null, status: 'draft', initial: blankPlanForm(e, unit), startsDirty: false }));
  const editPlan = (p: Plan): void => guarded(() => openEditor({ planId: p.id, updatedAt: p.updatedAt, status: p.status, initial: planToForm(p, unit), startsDirty: false }));
  const fromShelf = (s: ShelfSuggestion): void => guarded(() => e && openEditor({ planId: null, updatedAt: null, status: 'draft', initial: suggestionToForm(s, e, unit), startsDirty: true }));

  const onSaved = (plan: Plan, created: boolean): void => {
    setEditor(null);
    setEditing({ dirty: false, name: '' });
    let tickedNow = ticked.ids.includes(plan.id);
    if (created && !tickedNow && ticked.ids.length < MAX_TICKED) {
      setTicked((t) => ({ ids: [...t.ids, plan.id], for: t.for }));
      tickedNow = true;
    }
    setDone(
      tickedNow
        ? `Saved the plan “${plan.name}”; it is weighed below beside the ignition fitted now.`
        : `Saved the plan “${plan.name}”. Untick another plan to weigh this one (at most ${MAX_TICKED} at once).`,
    );
    setPlansVersion((v) => v + 1);
  };

  const chooseEngine = (id: number): void =>
    guarded(() => {
      setEditor(null);
      setDone(null);
      setEngineId(id);
    });

  const answer = comparison.value && comparison.value.engineId === engineId ? comparison.value : null;
  // The same array while the answer is the same, so the memoised charts and tables skip the renders
  // that only the rest of the screen needs (a save, a notice, the shelf search running).
  const setups: ShownSetup[] = useMemo(() => (answer ? [answer.existing, ...answer.candidates] : []), [answer]);
  // The cards and charts are drawn first; the four-speed table and the checks (most of the page)
  // follow straight after as a deferred render, marked as catching up meanwhile, so a changed
  // condition shows on the charts without waiting for every table.
  const shown = useMemo(() => ({ setups, margin: answer?.marginRatio ?? 1.25 }), [setups, answer]);
  const later = useDeferredValue(shown);
  const catchingUp = later !== shown;
  const cautions = answer?.cautions ?? (search.value?.engineId === engineId ? search.value.cautions : []);

  return (
    <section className="screen weigh" aria-labelledby="weigh-title">
      <div className="screen-head weigh-head">
        <h1 id="weigh-title" tabIndex={-1}>
          Weigh a combination
        </h1>
        {e ? (
          <span className="print-only" data-testid="weigh-print-head">
            Engine: {e.name}
            {e.yearText || e.modelText ? `, ${[e.yearText, e.modelText].filter(Boolean).join(' ')}` : ''}; {e.cylinders} cylinders, {e.systemVoltageV} V, {e.earthPolarity} earth. Printed on {todayText()}.
          </span>
        ) : null}
        {engines.value && engines.value.length > 0 ? (
          <div className="field engine-pick">
            <label htmlFor="weigh-engine">Engine</label>
            <select id="weigh-engine" value={engineId ?? ''} onChange={(ev) => chooseEngine(Number(ev.target.value))}>
              {engines.value.map((x) => (
                <option key={x.id} value={x.id}>
                  {x.name}
                </option>
              ))}
            </select>
          </div>
        ) : null}
      </div>
      {engines.problem ? <Notice kind="problem">{engines.problem}</Notice> : null}
      {engines.value && engines.value.length === 0 ? (
        <div className="empty">
          <p>There is no engine to weigh a combination on yet.</p>
          <button type="button" className="primary" onClick={() => navigate({ to: 'new-engine' })}>
            Add an engine
          </button>
        </div>
      ) : null}
      {engine.problem ? <Notice kind="problem">{engine.problem}</Notice> : null}
      {removal.notice}
      {done ? (
        <Notice kind="done" onDismiss={() => setDone(null)} testId="weigh-done">
          {done}
        </Notice>
      ) : null}

      {e && e.id === engineId ? (
        <>
          <PlanList
            plans={plansFor === engineId ? plans : []}
            parts={Object.values(parts).flat()}
            ticked={ticked.ids}
            onTick={(id, on) => setTicked((t) => ({ ids: on ? (t.ids.includes(id) || t.ids.length >= MAX_TICKED ? t.ids : [...t.ids, id]) : t.ids.filter((x) => x !== id), for: t.for }))}
            onEdit={editPlan}
            onDelete={delPlan.ask}
            onNew={newPlan}
            onOpenSheet={(p) => navigate({ to: 'sheet', planId: p.id })}
            editingId={editor ? (editor.planId ?? 'new') : null}
          />
          {editor ? (
            <PlanEditor
              key={editor.key}
              engine={e}
              parts={parts}
              initial={editor.initial}
              planId={editor.planId}
              updatedAt={editor.updatedAt}
              onReload={() => {
                setEditor(null);
                setEditing({ dirty: false, name: '' });
                setPlansVersion((v) => v + 1);
              }}
              status={editor.status}
              startsDirty={editor.startsDirty}
              onSaved={onSaved}
              onClose={() => guarded(() => setEditor(null))}
              onDirty={(dirty, name) => setEditing((s) => (s.dirty === dirty && s.name === name ? s : { dirty, name }))}
            />
          ) : null}

          <section className="results" aria-labelledby="compare-title" aria-busy={comparison.busy || undefined} data-testid="comparison">
            <div className="results-head">
              <h2 id="compare-title">How they compare</h2>
              {answer ? <PrintBar what="The comparison" pageSize={pageSize} onPageSize={(s) => void saveSettings({ pageSize: s })} onResult={(kind, text) => setPrinted({ kind, text })} /> : null}
            </div>
            <AmbientField
              key={e.id}
              engine={e}
              onWeigh={(conditions) => weighNow(e.id, conditions)}
              onSaved={() => setShelfDue(true)}
              onNotSaved={() => setWeighAt(null)}
            />
            {printed ? (
              <Notice kind={printed.kind} onDismiss={() => setPrinted(null)} testId="weigh-printed">
                {printed.text}
              </Notice>
            ) : null}
            {comparison.problem ? <Notice kind="problem">{comparison.problem}</Notice> : null}
            {!answer && comparison.busy ? <p className="quiet">Weighing…</p> : null}
            {answer ? (
              <>
                {answer.candidates.length === 0 ? <p className="quiet">No plan is ticked: this is the ignition fitted now on its own.</p> : null}
                <SetupCards setups={setups} margin={answer.marginRatio} />
                <div className="print-copy conditions-copy" aria-hidden="true">
                  <p className="print-copy-head">Working conditions these figures assume:</p>
                  <ul>
                    {answer.conditions.map((c) => (
                      <li key={c.name}>
                        {c.name}: {figureText(c.value, c.unit, unit)} ({c.measured ? 'measured' : (c.source ?? '')})
                      </li>
                    ))}
                  </ul>
                </div>
                <details className="conditions-used">
                  <summary>Working conditions these figures assume</summary>
                  <ul>
                    {answer.conditions.map((c) => (
                      <li key={c.name}>
                        {c.name}: {figureText(c.value, c.unit, unit)} <span className="quiet">({c.measured ? 'measured' : (c.source ?? '')})</span>
                      </li>
                    ))}
                  </ul>
                </details>
                <h2>Across the rev range</h2>
                <WeighCharts setups={setups} margin={answer.marginRatio} />
                <div className={catchingUp ? 'catching-up' : undefined} aria-busy={catchingUp || undefined}>
                  <h2>At four speeds</h2>
                  <KeyPointsTable setups={later.setups} margin={later.margin} />
                  <h2>Check by check</h2>
                  <RuleOverview setups={later.setups} />
                  {later.setups.map((s, i) => (
                    <RuleDetails key={`${s.kind}-${s.planId ?? i}`} setup={s} index={i} />
                  ))}
                </div>
              </>
            ) : null}
          </section>
          <Cautions cautions={cautions} />
          <ShelfList answer={search.value?.engineId === engineId ? search.value : null} problem={search.problem} busy={search.busy} onMakePlan={fromShelf} />
        </>
      ) : null}

      {ask ? (
        <Confirm
          title="Leave the plan without saving?"
          confirmLabel="Leave and lose the changes"
          cancelLabel="Stay and keep editing"
          danger
          onConfirm={() => {
            const then = ask.then;
            setAsk(null);
            setEditing({ dirty: false, name: '' });
            then();
          }}
          onCancel={() => setAsk(null)}
          testId="plan-leave-dialog"
        >
          <p>{editing.name ? `The plan “${editing.name}”` : 'The new plan'} has changes that are not saved. Going on throws them away.</p>
        </Confirm>
      ) : null}
      {delPlan.dialog}
    </section>
  );
}
