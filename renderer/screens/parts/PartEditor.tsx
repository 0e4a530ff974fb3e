/**
 * Adding or editing one part. What the person types stays in the form until it is saved: a failed
 * check or a refused save shows why beside the field concerned and keeps every value.
 */
import { useEffect, useMemo, useRef, useState, type FormEvent, type ReactNode } from 'react';
import type { Part, PartKind } from '../../../db/schema.js';
import { call } from '../../app/bridge.js';
import { CannotOpen, EditorStatus, UnsavedBadge } from '../../app/EditorStatus.js';
import { FieldErrorsContext } from '../../app/fields.js';
import { useFormSave, type SaveStatus } from '../../app/form-save.js';
import { useLeaveGuard } from '../../app/leave-guard.js';
import type { Navigate } from '../../app/routes.js';
import { useGapUnit } from '../../app/units.js';
import { useDeletePart } from './delete-part.js';
import { blankPartForm, formFingerprint, formToInput, partToForm, regapForm, type PartForm } from './form-model.js';
import { kindWords } from './labels.js';
import { BallastSections, CoilSections, IdentitySection, LeadsSections, ModuleSections, PlugSections, TachSections } from './sections.js';

type Props = {
  target: { id: number } | { newKind: PartKind };
  navigate: Navigate;
  /** Moves without the unsaved-changes question (after a delete, nothing is left to lose). */
  leave: Navigate;
};

export function PartEditor({ target, navigate, leave }: Props): ReactNode {
  const [unit] = useGapUnit();
  const isNew = 'newKind' in target;
  const [partId, setPartId] = useState<number | null>(isNew ? null : target.id);
  const [form, setForm] = useState<PartForm | null>(isNew ? blankPartForm(target.newKind) : null);
  const [savedPrint, setSavedPrint] = useState(() => (isNew ? formFingerprint(blankPartForm(target.newKind)) : ''));
  const [saved, setSaved] = useState<Part | null>(null);
  const [loadProblem, setLoadProblem] = useState<string | null>(null);
  const [status, setStatus] = useState<SaveStatus | null>(null);
  // Bumped by "Reload the saved version" after a save was refused as stale.
  const [reloads, setReloads] = useState(0);
  const headingRef = useRef<HTMLHeadingElement>(null);

  useEffect(() => {
    if (isNew) return;
    let live = true;
    void call('parts.get', { id: partId ?? target.id }).then((r) => {
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
    // Loaded once per editor (and again on reload); the unit is handled by the effect below.
  }, [reloads]);

  useEffect(() => {
    setForm((f) => (f ? regapForm(f, unit) : f));
  }, [unit]);

  const check = useMemo(() => (form ? formToInput(form, unit) : null), [form, unit]);
  const clientErrors = check && !check.ok ? check.errors : {};
  const { errorsCtx, submitted, serverErrors, setServerErrors, saving, save: saveForm, settle, fieldName } = useFormSave(clientErrors, headingRef);

  // The store's "its kind cannot change" was about the kind sent; choosing another kind answers it.
  const kind = form?.kind;
  useEffect(() => {
    setServerErrors((e) => {
      if (!('kind' in e)) return e;
      const { kind: _answered, ...rest } = e;
      return rest;
    });
  }, [kind]);

  const dirty = form !== null && formFingerprint(form) !== savedPrint;
  useLeaveGuard(dirty, saved ? `“${saved.name}”` : 'This new part');

  const del = useDeletePart(
    () => {
      // The note with its Undo comes from the delete itself and outlives the move.
      leave({ to: 'parts' });
    },
    () => setReloads((n) => n + 1),
  );

  if (loadProblem) return <CannotOpen title="Part" titleId="part-title" problem={loadProblem} back={() => navigate({ to: 'parts' })} backLabel="Back to the parts" />;
  if (!form || !check) return <p className="quiet">Reading the part…</p>;

  const update = (fn: (f: PartForm) => PartForm): void => {
    setForm((f) => (f ? fn(f) : f));
    setStatus((s) => (s?.kind === 'done' ? null : s));
  };

  const save = (e?: FormEvent): Promise<void> =>
    saveForm(e, check, {
      what: 'this',
      serverPrefix: 'part',
      send: (part) => (partId === null || !saved ? call('parts.create', { part }) : call('parts.update', { id: partId, expectedUpdatedAt: saved.updatedAt, part })),
      problem: (text, code) => setStatus({ kind: 'problem', text, stale: code === 'STALE' }),
      saved: (part) => {
        const savedForm = partToForm(part, unit);
        // Keep the other kinds' typed text: only the saved kind is replaced by what the store holds.
        const merged = { ...form, kind: savedForm.kind, name: savedForm.name, notes: savedForm.notes, [savedForm.kind]: savedForm[savedForm.kind] } as PartForm;
        setForm(merged);
        setSavedPrint(formFingerprint(merged));
        setSaved(part);
        setPartId(part.id);
        settle();
        setStatus({ kind: 'done', text: `Saved “${part.name}”.` });
      },
    });

  const summary = status?.kind === 'problem' && submitted ? { ...clientErrors, ...serverErrors } : {};
  const title = saved ? `${kindWords[saved.kind].one}: ${saved.name}` : `New ${kindWords[form.kind].one.toLowerCase()}`;
  const props = { form, update, unit };

  return (
    <section className="screen editor part-editor" aria-labelledby="part-title">
      <div className="screen-head">
        <h1 id="part-title" ref={headingRef} tabIndex={-1}>
          {title}
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
            {/* After a save the note sits by the save button, where the person is looking, and takes focus. */}
            {status?.kind === 'done' ? <EditorStatus status={status} summary={{}} onDismiss={() => setStatus(null)} takeFocus className="tag-by-save" /> : null}
            <button type="submit" className="primary" disabled={saving}>
              {saving ? 'Saving…' : 'Save the part'}
            </button>
            <button type="button" onClick={() => navigate({ to: 'parts' })}>
              Back to the parts
            </button>
            {partId !== null && saved ? (
              <button type="button" className="danger push-right" onClick={() => del.ask({ id: partId, name: saved.name, updatedAt: saved.updatedAt })}>
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
