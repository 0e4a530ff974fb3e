/**
 * Making or changing one plan: which module, coil and ballast, how they are wired, and what else
 * changes. What the person types stays until it is saved; the store's messages appear beside the
 * fields; Enter saves. Anything the plan leaves as "keep" stays as the engine has it today.
 */
import { useContext, useEffect, useMemo, useRef, useState, type FormEvent, type ReactNode } from 'react';
import type { Engine, Part, PartKind, Plan, PlanStatus } from '../../../db/schema.js';
import { call } from '../../app/bridge.js';
import { FixList, UnsavedBadge } from '../../app/EditorStatus.js';
import { CheckField, FieldErrorsContext, fieldId, NotesField, SelectField, TextField } from '../../app/fields.js';
import { useFormSave } from '../../app/form-save.js';
import { gapFromText, regap } from '../../app/gaps.js';
import { Notice, NoticeMark } from '../../app/Notice.js';
import { unitLabel, useGapUnit } from '../../app/units.js';
import { formToPlanInput, planFingerprint, type PlanForm } from './plan-form.js';
import { feedChoices } from './words.js';
import { coilWiringChoices } from '../engines/labels.js';

type Props = {
  engine: Engine;
  parts: Record<PartKind, Part[]>;
  initial: PlanForm;
  /** Null for a new plan. */
  planId: number | null;
  /** The stored plan's version (null for a new plan), sent with the save. */
  updatedAt: string | null;
  /** After a save refused as stale: close the editor and read the plans again. */
  onReload: () => void;
  status: PlanStatus;
  /** True when the starting values are not saved anywhere yet (a shelf suggestion), so leaving asks first. */
  startsDirty?: boolean;
  onSaved: (plan: Plan, created: boolean) => void;
  onClose: () => void;
  onDirty: (dirty: boolean, name: string) => void;
};

/** In the order the fields appear, so focus lands on the first one a person would read. */
const fieldOrder = ['name', 'moduleId', 'coilId', 'ballastId', 'crankingBypass', 'moduleFeed', 'coilWiring', 'tachId', 'leadsId', 'plugId', 'plugGapMm', 'notes'];

const nameOf = (parts: readonly Part[], id: number | null): string | null => (id === null ? null : (parts.find((p) => p.id === id)?.name ?? `part no. ${id}`));

function choicesOf(parts: readonly Part[], none: string, value: string): Array<{ value: string; label: string }> {
  const out = [{ value: '', label: none }, ...parts.map((p) => ({ value: String(p.id), label: p.name }))];
  if (value !== '' && !parts.some((p) => String(p.id) === value)) out.push({ value, label: `Part no. ${value} (not on the shelf)` });
  return out;
}

export function PlanEditor({ engine, parts, initial, planId, updatedAt, status, startsDirty = false, onSaved, onClose, onDirty, onReload }: Props): ReactNode {
  const [unit] = useGapUnit();
  const [form, setForm] = useState<PlanForm>(initial);
  const [savedPrint, setSavedPrint] = useState(() => (startsDirty ? '' : planFingerprint(initial)));
  const [problem, setProblem] = useState<string | null>(null);
  const [stale, setStale] = useState(false);
  const headingRef = useRef<HTMLHeadingElement>(null);

  useEffect(() => {
    setForm((f) => ({ ...f, plugGap: regap(f.plugGap, unit) }));
  }, [unit]);

  const dirty = planFingerprint(form) !== savedPrint;
  useEffect(() => onDirty(dirty, form.name.trim() || initial.name.trim()), [dirty, form.name]);
  useEffect(() => () => onDirty(false, ''), []);

  const check = useMemo(() => formToPlanInput(form, engine.id, status), [form, engine.id, status]);
  const clientErrors = check.ok ? {} : check.errors;
  const { errorsCtx, submitted, serverErrors, saving, save: saveForm, fieldName } = useFormSave(clientErrors, headingRef, fieldOrder);

  const set = (patch: Partial<PlanForm>): void => setForm((f) => ({ ...f, ...patch }));
  const text = (key: 'name' | 'notes' | 'moduleId' | 'coilId' | 'tachId' | 'leadsId' | 'plugId') => (v: string) => set({ [key]: v } as Partial<PlanForm>);

  const save = (e?: FormEvent): Promise<void> =>
    saveForm(e, check, {
      what: 'this plan',
      serverPrefix: 'plan',
      // An edit leaves the status out: it may have moved on (weighed, wired) since the editor opened.
      send: (plan) => {
        if (planId === null) return call('plans.create', { plan });
        const { status: _status, ...fields } = plan;
        return call('plans.update', { id: planId, expectedUpdatedAt: updatedAt ?? '', plan: fields });
      },
      problem: (text, code) => {
        setProblem(text);
        setStale(code === 'STALE');
      },
      saved: (plan) => {
        setProblem(null);
        setSavedPrint(planFingerprint(form));
        onDirty(false, '');
        onSaved(plan, planId === null);
      },
    });

  const existing = engine.existing;
  const keep = (kind: PartKind, id: number | null): string => {
    const name = nameOf(parts[kind], id);
    return name ? `Keep: ${name}` : 'Keep: none fitted';
  };
  const coilNow = nameOf(parts.coil, existing.coilPartId);
  const summary = problem && submitted ? { ...clientErrors, ...serverErrors } : {};

  return (
    <section className="plan-editor" aria-labelledby="plan-editor-title" data-testid="plan-editor">
      <div className="screen-head">
        <h2 id="plan-editor-title" ref={headingRef} tabIndex={-1}>
          {planId === null ? 'New plan' : `Change the plan “${initial.name}”`}
        </h2>
        {dirty ? <UnsavedBadge testId="plan-unsaved" /> : null}
      </div>
      {problem ? (
        <Notice
          kind="problem"
          onDismiss={() => setProblem(null)}
          testId="plan-status"
          action={stale && onReload ? { label: 'Close and reload the plans', onClick: onReload, testId: 'reload-record' } : undefined}
        >
          {problem}
          <FixList messages={summary} nameOf={fieldName} />
        </Notice>
      ) : null}
      <FieldErrorsContext.Provider value={errorsCtx}>
        <form onSubmit={(e) => void save(e)} noValidate aria-label={planId === null ? 'New plan' : `Plan ${initial.name}`}>
          <div className="group-fields plan-fields">
            <TextField path="name" label="Plan name" value={form.name} onChange={text('name')} wide placeholder="For example: current-limited unit, ballast out" />
            <SelectField path="moduleId" label="Ignition module" value={form.moduleId} choices={choicesOf(parts.module, 'None: keep the points', form.moduleId)} onChange={text('moduleId')} />
            <SelectField
              path="coilId"
              label="Coil"
              value={form.coilId}
              choices={choicesOf(parts.coil, coilNow ? `Keep: ${coilNow}` : 'Keep the coil fitted now', form.coilId)}
              onChange={text('coilId')}
            />
            <SelectField
              path="ballastId"
              label="Ballast resistor"
              value={form.ballastId}
              choices={choicesOf(parts.ballast, 'No ballast', form.ballastId)}
              onChange={(v) => set({ ballastId: v, crankingBypass: v === '' ? false : form.crankingBypass })}
              hint="Only a ballast on the shelf can be chosen."
            />
            {form.ballastId !== '' ? (
              <CheckField
                path="crankingBypass"
                label="Cranking bypass: the starter feeds the coil direct, past the ballast, while cranking"
                checked={form.crankingBypass}
                onChange={(v) => set({ crankingBypass: v })}
              />
            ) : null}
            {form.moduleId !== '' ? <FeedChoice value={form.moduleFeed} onChange={(v) => set({ moduleFeed: v })} noBallast={form.ballastId === ''} /> : null}
            <SelectField
              path="coilWiring"
              label="Coil terminal on the supply side"
              value={form.coilWiring}
              choices={coilWiringChoices(engine.earthPolarity)}
              onChange={(v) => set({ coilWiring: v })}
              hint="Wired the other way round, the plug fires the wrong way and needs about 10 % more voltage"
            />
            <p className="hint wide">“Keep” leaves the part as the engine has it today.</p>
            <SelectField path="tachId" label="Rev counter" value={form.tachId} choices={choicesOf(parts.tach, keep('tach', existing.tachPartId), form.tachId)} onChange={text('tachId')} />
            <SelectField path="leadsId" label="HT leads" value={form.leadsId} choices={choicesOf(parts.leads, keep('leads', existing.leadsPartId), form.leadsId)} onChange={text('leadsId')} />
            <SelectField path="plugId" label="Spark plugs" value={form.plugId} choices={choicesOf(parts.plug, keep('plug', existing.plugPartId), form.plugId)} onChange={text('plugId')} />
            <TextField path="plugGapMm" label={`Plug gap (${unitLabel(unit)})`} numeric value={form.plugGap.text} onChange={(v) => set({ plugGap: gapFromText(v, unit) })} />
            <NotesField path="notes" label="Notes" value={form.notes} onChange={text('notes')} />
          </div>
          {/* Pressing a button must not blur the field first: the blur would show its message and move
              the button out from under the pointer before the click lands. */}
          <div className="plan-actions" onMouseDown={(e) => e.target instanceof HTMLButtonElement && e.preventDefault()}>
            <button type="submit" className="primary" disabled={saving}>
              {saving ? 'Saving…' : planId === null ? 'Save the plan' : 'Save the changes'}
            </button>
            <button type="button" onClick={onClose}>
              {dirty ? 'Close without saving' : 'Close'}
            </button>
          </div>
        </form>
      </FieldErrorsContext.Provider>
    </section>
  );
}

/** Where the module takes its own supply, as two radio buttons with what each means. */
function FeedChoice({ value, onChange, noBallast }: { value: PlanForm['moduleFeed']; onChange: (v: PlanForm['moduleFeed']) => void; noBallast: boolean }): ReactNode {
  const message = useContext(FieldErrorsContext).message('moduleFeed');
  return (
    <fieldset className={`field wide feed-choice${message ? ' has-error' : ''}`} id={fieldId('moduleFeed')}>
      <legend>Where the module takes its own supply</legend>
      {feedChoices.map((c) => (
        <label key={c.value} className="feed-option">
          <input type="radio" name="moduleFeed" value={c.value} checked={value === c.value} onChange={() => onChange(c.value)} />
          <span>
            <strong>{c.label}</strong>
            <span className="hint">{c.explain}</span>
          </span>
        </label>
      ))}
      {noBallast ? <span className="hint">With no ballast in the plan, both are the same wire.</span> : null}
      {message ? (
        <span className="field-error" data-testid="error-moduleFeed">
          <NoticeMark kind="problem" />{message}
        </span>
      ) : null}
    </fieldset>
  );
}
