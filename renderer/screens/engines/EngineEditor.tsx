/**
 * Creating and editing one engine. What the person types stays in the form until it is saved:
 * a failed check or a refused save shows why beside the field concerned and keeps every value.
 */
import { useEffect, useMemo, useRef, useState, type FormEvent, type ReactNode } from 'react';
import type { Engine, Part, PartKind } from '../../../db/schema.js';
import { call } from '../../app/bridge.js';
import { CannotOpen, EditorStatus, UnsavedBadge } from '../../app/EditorStatus.js';
import { FieldErrorsContext } from '../../app/fields.js';
import { useFormSave, type SaveStatus } from '../../app/form-save.js';
import { regap } from '../../app/gaps.js';
import { useLeaveGuard } from '../../app/leave-guard.js';
import type { Navigate } from '../../app/routes.js';
import { useGapUnit } from '../../app/units.js';
import { AdvanceCurveTable } from './AdvanceCurveTable.js';
import { useDeleteEngine } from './delete-engine.js';
import { blankForm, engineToForm, formFingerprint, formToInput, type EngineForm } from './form-model.js';
import { ElectricsSection, GeometrySection, IdentitySection, PointsSection, SpeedsSection } from './sections-engine.js';
import { ConditionsSection } from './sections-conditions.js';
import { ExistingSection } from './sections-existing.js';

type Props = {
  id: number | null;
  navigate: Navigate;
  /** Moves without the unsaved-changes question (after a delete, nothing is left to lose). */
  leave: Navigate;
  onOpened: (e: Engine) => void;
  onDeleted: (id: number) => void;
};

const emptyParts = (): Record<PartKind, Part[]> => ({ coil: [], ballast: [], module: [], tach: [], leads: [], plug: [] });

export function EngineEditor({ id, navigate, leave, onOpened, onDeleted }: Props): ReactNode {
  const [unit] = useGapUnit();
  const [engineId, setEngineId] = useState<number | null>(id);
  const [form, setForm] = useState<EngineForm | null>(id === null ? blankForm(unit) : null);
  const [savedPrint, setSavedPrint] = useState<string>(() => (id === null ? formFingerprint(blankForm(unit)) : ''));
  const [savedName, setSavedName] = useState('');
  const [loadProblem, setLoadProblem] = useState<string | null>(null);
  const [parts, setParts] = useState<Record<PartKind, Part[]>>(emptyParts);
  const [status, setStatus] = useState<SaveStatus | null>(null);
  // The version of the engine on screen (sent with a save or delete) and the reload counter.
  const [version, setVersion] = useState('');
  const [reloads, setReloads] = useState(0);
  const headingRef = useRef<HTMLHeadingElement>(null);

  useEffect(() => {
    let live = true;
    void call('parts.list', {}).then((r) => {
      if (!live || !r.ok) return;
      const byKind = emptyParts();
      for (const p of r.value) byKind[p.kind].push(p);
      setParts(byKind);
    });
    const shownId = engineId ?? id;
    if (shownId !== null) {
      void call('engines.get', { id: shownId }).then((r) => {
        if (!live) return;
        if (!r.ok) return setLoadProblem(r.error.message);
        const f = engineToForm(r.value, unit);
        setForm(f);
        setSavedPrint(formFingerprint(f));
        setSavedName(r.value.name);
        setVersion(r.value.updatedAt);
        onOpened(r.value);
      });
    }
    return () => {
      live = false;
    };
    // Loaded once per editor (and again on reload); the unit is handled by the effect below.
  }, [id, reloads]);

  // Switching mm/inch re-shows the gaps; the stored millimetres stay exactly as they were.
  useEffect(() => {
    setForm((f) => (f ? { ...f, pointsGap: regap(f.pointsGap, unit), existing: { ...f.existing, plugGap: regap(f.existing.plugGap, unit) } } : f));
  }, [unit]);

  const check = useMemo(() => (form ? formToInput(form) : null), [form]);
  const dirty = form !== null && formFingerprint(form) !== savedPrint;
  useLeaveGuard(dirty, savedName ? `“${savedName}”` : 'This new engine');

  const clientErrors = check && !check.ok ? check.errors : {};
  const { errorsCtx, submitted, serverErrors, saving, save: saveForm, settle, fieldName } = useFormSave(clientErrors, headingRef);

  const del = useDeleteEngine(
    (deletedId) => {
      // Leave first: moving to another screen clears the message line, and the deletion must be said.
      leave({ to: 'engines' });
      onDeleted(deletedId);
    },
    (message, code) => setStatus({ kind: 'problem', text: message, stale: code === 'STALE' }),
  );

  if (loadProblem) return <CannotOpen title="Engine" titleId="editor-title" problem={loadProblem} back={() => navigate({ to: 'engines' })} backLabel="Back to the engines" />;
  if (!form || !check) return <p className="quiet">Reading the engine…</p>;

  const update = (fn: (f: EngineForm) => EngineForm): void => {
    setForm((f) => (f ? fn(f) : f));
    setStatus((s) => (s?.kind === 'done' ? null : s));
  };

  const save = (e?: FormEvent): Promise<void> =>
    saveForm(e, check, {
      what: 'this',
      serverPrefix: 'engine',
      send: (engine) => (engineId === null ? call('engines.create', { engine }) : call('engines.update', { id: engineId, expectedUpdatedAt: version, engine })),
      problem: (text, code) => setStatus({ kind: 'problem', text, stale: code === 'STALE' }),
      saved: (engine) => {
        // Show what the store now holds (it may have tidied the text) and take it as the clean state.
        const savedForm = engineToForm(engine, unit);
        setForm(savedForm);
        setSavedPrint(formFingerprint(savedForm));
        setSavedName(engine.name);
        setEngineId(engine.id);
        setVersion(engine.updatedAt);
        settle();
        onOpened(engine);
        setStatus({ kind: 'done', text: `Saved “${engine.name}”.` });
      },
    });

  const summary = status?.kind === 'problem' && submitted ? { ...clientErrors, ...serverErrors } : {};
  const title = engineId === null ? 'New engine' : savedName || 'Engine';

  return (
    <section className="screen editor" aria-labelledby="editor-title">
      <div className="screen-head">
        <h1 id="editor-title" ref={headingRef} tabIndex={-1}>
          {engineId === null ? title : `Engine: ${title}`}
        </h1>
        {dirty ? <UnsavedBadge testId="unsaved" /> : null}
      </div>
      {status?.kind === 'problem' ? (
        <EditorStatus
          status={status}
          summary={summary}
          nameOf={fieldName}
          onDismiss={() => setStatus(null)}
          onReload={() => {
            setStatus(null);
            setReloads((n) => n + 1);
          }}
        />
      ) : null}
      <FieldErrorsContext.Provider value={errorsCtx}>
        <form className="engine-form" onSubmit={(e) => void save(e)} noValidate aria-label={engineId === null ? 'New engine' : `Engine ${title}`}>
          <div className="groups">
            <IdentitySection form={form} update={update} unit={unit} />
            <GeometrySection form={form} update={update} unit={unit} />
            <SpeedsSection form={form} update={update} unit={unit} />
            <ElectricsSection form={form} update={update} unit={unit} />
            <PointsSection form={form} update={update} unit={unit} />
            <AdvanceCurveTable form={form} update={update} />
            <ExistingSection form={form} update={update} unit={unit} parts={parts} />
            <ConditionsSection form={form} update={update} />
          </div>
          <div className="form-actions">
            {/* After a save the note sits by the save button, where the person is looking, and takes focus. */}
            {status?.kind === 'done' ? <EditorStatus status={status} summary={{}} onDismiss={() => setStatus(null)} takeFocus className="tag-by-save" /> : null}
            <button type="submit" className="primary" disabled={saving}>
              {saving ? 'Saving…' : 'Save the engine'}
            </button>
            <button type="button" onClick={() => navigate({ to: 'engines' })}>
              Back to the engines
            </button>
            {engineId !== null ? (
              <button type="button" className="danger push-right" onClick={() => del.ask({ id: engineId, name: savedName, updatedAt: version })}>
                Delete this engine
              </button>
            ) : null}
          </div>
        </form>
      </FieldErrorsContext.Provider>
      {del.dialog}
    </section>
  );
}
