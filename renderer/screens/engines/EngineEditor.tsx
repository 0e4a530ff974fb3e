/**
 * Creating and editing one engine. What the person types stays in the form until it is saved:
 * a failed check or a refused save shows why beside the field concerned and keeps every value.
 */
import { useEffect, useMemo, useRef, useState, type FormEvent, type ReactNode } from 'react';
import type { Engine, Part, PartKind } from '../../../db/schema.js';
import { call } from '../../app/bridge.js';
import { useLeaveGuard } from '../../app/leave-guard.js';
import { Notice } from '../../app/Notice.js';
import type { Navigate } from '../../app/routes.js';
import { useGapUnit } from '../../app/units.js';
import { AdvanceCurveTable } from './AdvanceCurveTable.js';
import { useDeleteEngine } from './delete-engine.js';
import { FieldErrorsContext, fieldId, type FieldErrors } from './fields.js';
import { blankForm, engineToForm, formFingerprint, formToInput, regap, serverFieldsToForm, type EngineForm } from './form-model.js';
import { ElectricsSection, GeometrySection, IdentitySection, PointsSection, SpeedsSection } from './sections-engine.js';
import { ConditionsSection, ExistingSection } from './sections-existing.js';

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
  const [touched, setTouched] = useState<Set<string>>(() => new Set());
  const [submitted, setSubmitted] = useState(false);
  const [serverErrors, setServerErrors] = useState<Record<string, string>>({});
  const [status, setStatus] = useState<{ kind: 'done' | 'problem'; text: string } | null>(null);
  const [saving, setSaving] = useState(false);
  const headingRef = useRef<HTMLHeadingElement>(null);

  useEffect(() => {
    let live = true;
    void call('parts.list', {}).then((r) => {
      if (!live || !r.ok) return;
      const byKind = emptyParts();
      for (const p of r.value) byKind[p.kind].push(p);
      setParts(byKind);
    });
    if (id !== null) {
      void call('engines.get', { id }).then((r) => {
        if (!live) return;
        if (!r.ok) return setLoadProblem(r.error.message);
        const f = engineToForm(r.value, unit);
        setForm(f);
        setSavedPrint(formFingerprint(f));
        setSavedName(r.value.name);
        onOpened(r.value);
      });
    }
    return () => {
      live = false;
    };
    // Loaded once per editor; the unit is handled by the effect below.
  }, [id]);

  // Switching mm/inch re-shows the gaps; the stored millimetres stay exactly as they were.
  useEffect(() => {
    setForm((f) => (f ? { ...f, pointsGap: regap(f.pointsGap, unit), existing: { ...f.existing, plugGap: regap(f.existing.plugGap, unit) } } : f));
  }, [unit]);

  const check = useMemo(() => (form ? formToInput(form) : null), [form]);
  const dirty = form !== null && formFingerprint(form) !== savedPrint;
  useLeaveGuard(dirty, savedName ? `“${savedName}”` : 'This new engine');

  const clientErrors = check && !check.ok ? check.errors : {};
  const errorsCtx = useMemo<FieldErrors>(
    () => ({
      message: (path) => ((submitted || touched.has(path)) && clientErrors[path]) || serverErrors[path],
      touch: (path) => setTouched((t) => (t.has(path) ? t : new Set(t).add(path))),
    }),
    [clientErrors, serverErrors, submitted, touched],
  );

  const del = useDeleteEngine(
    (deletedId) => {
      // Leave first: moving to another screen clears the message line, and the deletion must be said.
      leave({ to: 'engines' });
      onDeleted(deletedId);
    },
    (message) => setStatus({ kind: 'problem', text: message }),
  );

  if (loadProblem) {
    return (
      <section className="screen" aria-labelledby="editor-title">
        <h1 id="editor-title" tabIndex={-1}>
          Engine
        </h1>
        <Notice kind="problem">{loadProblem}</Notice>
        <button type="button" onClick={() => navigate({ to: 'engines' })}>
          Back to the engines
        </button>
      </section>
    );
  }
  if (!form || !check) return <p className="quiet">Reading the engine…</p>;

  const update = (fn: (f: EngineForm) => EngineForm): void => {
    setForm((f) => (f ? fn(f) : f));
    setStatus((s) => (s?.kind === 'done' ? null : s));
  };

  const focusFirstError = (errors: Record<string, string>): void => {
    requestAnimationFrame(() => {
      for (const path of Object.keys(errors)) {
        const el = document.getElementById(fieldId(path));
        if (el) {
          // Centred, so the message under the field is not hidden behind the action bar.
          el.focus({ preventScroll: true });
          return el.scrollIntoView({ block: 'center' });
        }
      }
      headingRef.current?.focus();
    });
  };

  const save = async (e?: FormEvent): Promise<void> => {
    e?.preventDefault();
    if (saving) return;
    setSubmitted(true);
    setServerErrors({});
    if (!check.ok) {
      setStatus({ kind: 'problem', text: 'Some values need correcting before this can be saved. Nothing has been saved yet.' });
      return focusFirstError(check.errors);
    }
    setSaving(true);
    const r = engineId === null ? await call('engines.create', { engine: check.input }) : await call('engines.update', { id: engineId, engine: check.input });
    setSaving(false);
    if (!r.ok) {
      const fields = serverFieldsToForm(r.error.fields);
      setServerErrors(fields);
      setStatus({ kind: 'problem', text: `Not saved: ${r.error.message} Everything you typed is still here.` });
      return focusFirstError(fields);
    }
    // Show what the store now holds (it may have tidied the text) and take it as the clean state.
    const savedForm = engineToForm(r.value, unit);
    setForm(savedForm);
    setSavedPrint(formFingerprint(savedForm));
    setSavedName(r.value.name);
    setEngineId(r.value.id);
    setSubmitted(false);
    setTouched(new Set());
    onOpened(r.value);
    setStatus({ kind: 'done', text: `Saved “${r.value.name}”.` });
  };

  const summary = status?.kind === 'problem' && submitted ? { ...clientErrors, ...serverErrors } : {};
  const title = engineId === null ? 'New engine' : savedName || 'Engine';

  return (
    <section className="screen editor" aria-labelledby="editor-title">
      <div className="screen-head">
        <h1 id="editor-title" ref={headingRef} tabIndex={-1}>
          {engineId === null ? title : `Engine: ${title}`}
        </h1>
        {dirty ? (
          <span className="badge" data-testid="unsaved">
            <span aria-hidden="true">●</span> Unsaved changes
          </span>
        ) : null}
      </div>
      {status ? (
        <Notice kind={status.kind} onDismiss={() => setStatus(null)} testId="editor-status">
          {status.text}
          {Object.keys(summary).length > 0 ? (
            <ul className="error-summary">
              {Object.entries(summary).map(([path, message]) => (
                <li key={path}>
                  <button type="button" className="link" onClick={() => document.getElementById(fieldId(path))?.focus()}>
                    {message}
                  </button>
                </li>
              ))}
            </ul>
          ) : null}
        </Notice>
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
            <button type="submit" className="primary" disabled={saving}>
              {saving ? 'Saving…' : 'Save the engine'}
            </button>
            <button type="button" onClick={() => navigate({ to: 'engines' })}>
              Back to the engines
            </button>
            {engineId !== null ? (
              <button type="button" className="danger push-right" onClick={() => del.ask({ id: engineId, name: savedName })}>
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
