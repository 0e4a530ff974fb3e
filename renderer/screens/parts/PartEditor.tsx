/**
 * Adding or editing one part. What the person types stays in the form until it is saved: a failed
 * check or a refused save shows why beside the field concerned and keeps every value.
 */
import { useEffect, useMemo, useRef, useState, type FormEvent, type ReactNode } from 'react';
import type { Part, PartKind } from '../../../db/schema.js';
import { call } from '../../app/bridge.js';
import { useLeaveGuard } from '../../app/leave-guard.js';
import { Notice } from '../../app/Notice.js';
import type { Navigate } from '../../app/routes.js';
import { useGapUnit } from '../../app/units.js';
import { FieldErrorsContext, fieldId, type FieldErrors } from '../engines/fields.js';
import { useDeletePart } from './delete-part.js';
import { blankPartForm, formFingerprint, formToInput, partToForm, regapForm, serverFieldsToForm, type PartForm } from './form-model.js';
import { kindWords } from './labels.js';
import { BallastSections, CoilSections, IdentitySection, LeadsSections, ModuleSections, PlugSections, TachSections } from './sections.js';

type Props = {
  target: { id: number } | { newKind: PartKind };
  navigate: Navigate;
  /** Moves without the unsaved-changes question (after a delete, nothing is left to lose). */
  leave: Navigate;
  onDeleted: (name: string) => void;
};

export function PartEditor({ target, navigate, leave, onDeleted }: Props): ReactNode {
  const [unit] = useGapUnit();
  const isNew = 'newKind' in target;
  const [partId, setPartId] = useState<number | null>(isNew ? null : target.id);
  const [form, setForm] = useState<PartForm | null>(isNew ? blankPartForm(target.newKind) : null);
  const [savedPrint, setSavedPrint] = useState(() => (isNew ? formFingerprint(blankPartForm(target.newKind)) : ''));
  const [saved, setSaved] = useState<Part | null>(null);
  const [loadProblem, setLoadProblem] = useState<string | null>(null);
  const [touched, setTouched] = useState<Set<string>>(() => new Set());
  const [submitted, setSubmitted] = useState(false);
  const [serverErrors, setServerErrors] = useState<Record<string, string>>({});
  const [status, setStatus] = useState<{ kind: 'done' | 'problem'; text: string } | null>(null);
  const [saving, setSaving] = useState(false);
  const headingRef = useRef<HTMLHeadingElement>(null);

  useEffect(() => {
    if (isNew) return;
    let live = true;
    void call('parts.get', { id: target.id }).then((r) => {
      if (!live) return;
      if (!r.ok) return setLoadProblem(r.error.message);
      const f = partToForm(r.value, unit);
      setForm(f);
      setSavedPrint(formFingerprint(f));
      setSaved(r.value);
    });
    return () => {
      live = false;
    };
    // Loaded once per editor; the unit is handled by the effect below.
  }, []);

  useEffect(() => {
    setForm((f) => (f ? regapForm(f, unit) : f));
  }, [unit]);

  // The store's "its kind cannot change" was about the kind sent; choosing another kind answers it.
  const kind = form?.kind;
  useEffect(() => {
    setServerErrors((e) => {
      if (!('kind' in e)) return e;
      const { kind: _answered, ...rest } = e;
      return rest;
    });
  }, [kind]);

  const check = useMemo(() => (form ? formToInput(form, unit) : null), [form, unit]);
  const dirty = form !== null && formFingerprint(form) !== savedPrint;
  useLeaveGuard(dirty, saved ? `“${saved.name}”` : 'This new part');

  const clientErrors = check && !check.ok ? check.errors : {};
  const errorsCtx = useMemo<FieldErrors>(
    () => ({
      message: (path) => ((submitted || touched.has(path)) && clientErrors[path]) || serverErrors[path],
      touch: (path) => setTouched((t) => (t.has(path) ? t : new Set(t).add(path))),
    }),
    [clientErrors, serverErrors, submitted, touched],
  );

  const del = useDeletePart((t) => {
    // Leave first: moving clears the frame's status line, and the "deleted" line must survive it.
    leave({ to: 'parts' });
    onDeleted(t.name);
  });

  if (loadProblem) {
    return (
      <section className="screen" aria-labelledby="part-title">
        <h1 id="part-title" tabIndex={-1}>
          Part
        </h1>
        <Notice kind="problem">{loadProblem}</Notice>
        <button type="button" onClick={() => navigate({ to: 'parts' })}>
          Back to the parts
        </button>
      </section>
    );
  }
  if (!form || !check) return <p className="quiet">Reading the part…</p>;

  const update = (fn: (f: PartForm) => PartForm): void => {
    setForm((f) => (f ? fn(f) : f));
    setStatus((s) => (s?.kind === 'done' ? null : s));
  };

  const focusFirstError = (errors: Record<string, string>): void => {
    requestAnimationFrame(() => {
      for (const path of Object.keys(errors)) {
        const el = document.getElementById(fieldId(path));
        if (el) {
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
    const r = partId === null ? await call('parts.create', { part: check.input }) : await call('parts.update', { id: partId, part: check.input });
    setSaving(false);
    if (!r.ok) {
      const fields = serverFieldsToForm(r.error.fields);
      setServerErrors(fields);
      setStatus({ kind: 'problem', text: `Not saved: ${r.error.message} Everything you typed is still here.` });
      return focusFirstError(fields);
    }
    const savedForm = partToForm(r.value, unit);
    // Keep the other kinds' typed text: only the saved kind is replaced by what the store holds.
    const merged = { ...form, kind: savedForm.kind, name: savedForm.name, notes: savedForm.notes, [savedForm.kind]: savedForm[savedForm.kind] } as PartForm;
    setForm(merged);
    setSavedPrint(formFingerprint(merged));
    setSaved(r.value);
    setPartId(r.value.id);
    setSubmitted(false);
    setTouched(new Set());
    setStatus({ kind: 'done', text: `Saved “${r.value.name}”.` });
  };

  const summary = status?.kind === 'problem' && submitted ? { ...clientErrors, ...serverErrors } : {};
  const title = saved ? `${kindWords[saved.kind].one}: ${saved.name}` : `New ${kindWords[form.kind].one.toLowerCase()}`;
  const props = { form, update, unit };

  return (
    <section className="screen editor part-editor" aria-labelledby="part-title">
      <div className="screen-head">
        <h1 id="part-title" ref={headingRef} tabIndex={-1}>
          {title}
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
        <form className="engine-form part-form" onSubmit={(e) => void save(e)} noValidate aria-label={title}>
          <div className="groups">
            <IdentitySection {...props} kindLocked={saved ? 'A part that a plan or an engine uses keeps its kind.' : null} />
            {form.kind === 'coil' ? <CoilSections {...props} /> : null}
            {form.kind === 'ballast' ? <BallastSections {...props} /> : null}
            {form.kind === 'module' ? <ModuleSections {...props} /> : null}
            {form.kind === 'tach' ? <TachSections {...props} /> : null}
            {form.kind === 'leads' ? <LeadsSections {...props} /> : null}
            {form.kind === 'plug' ? <PlugSections {...props} /> : null}
          </div>
          <div className="form-actions">
            <button type="submit" className="primary" disabled={saving}>
              {saving ? 'Saving…' : 'Save the part'}
            </button>
            <button type="button" onClick={() => navigate({ to: 'parts' })}>
              Back to the parts
            </button>
            {partId !== null && saved ? (
              <button type="button" className="danger push-right" onClick={() => del.ask({ id: partId, name: saved.name })}>
                Delete this part
              </button>
            ) : null}
          </div>
        </form>
      </FieldErrorsContext.Provider>
      {del.dialog}
    </section>
  );
}
