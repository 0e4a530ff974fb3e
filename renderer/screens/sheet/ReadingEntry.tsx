/**
 * Beside a measuring step: type what the meter shows (number, unit, date, note) and save it as a
 * reading of the plan, see the readings already taken with their place against the band, change
 * or delete one (delete asks first). A failed save keeps every character typed and shows the
 * store's message beside its field.
 */
import type { Removal } from '../../app/removal.js';
import { useEffect, useState, type ReactNode } from 'react';
import { fieldMessages, readingInput, type Reading } from '../../../db/schema.js';
import { call } from '../../app/bridge.js';
import { Confirm } from '../../app/Dialog.js';
import { numberToText, parseNumberText } from '../../app/numbers.js';
import { bandWords, valueText } from '../../sheet/format.js';
import { BandMark } from '../../sheet/Marks.js';
import type { Band, SheetStep } from '../../sheet/model.js';
import { todayText } from '../../app/today.js';
import { unitChoices } from './units.js';
import { NoticeMark } from '../../app/Notice.js';

type Form = { value: string; unit: string; takenOn: string; note: string };
type Props = {
  planId: number;
  step: SheetStep;
  /** This step's readings, latest first. */
  readings: readonly Reading[];
  bands: ReadonlyMap<number, Band>;
  onSaved: (what: string) => void;
  /** Read the sheet again without a success note (after a reading was changed or deleted elsewhere). */
  onReload: () => void;
  /** A reading was deleted: the sentence and the token that undoes it. */
  onRemoved: (r: Removal) => void;
  onDirty: (key: string, dirty: boolean) => void;
};

const safeId = (key: string): string => key.replace(/[^a-zA-Z0-9_-]/g, '-');

/** What a correction that met a newer or a deleted reading says (shown as "Not saved: ..."). */
export const staleWords = {
  changed: 'This reading was changed elsewhere after the sheet was read.',
  reread: (value: string, takenOn: string): string =>
    `This reading was changed elsewhere after the sheet was read; it has been read again (it is now ${value} on ${takenOn}). What you typed is kept: Save the change again to replace it, or Cancel the change.`,
  deleted: 'This reading was deleted elsewhere after the sheet was read; the sheet has been read again. What you typed is kept: Save reading adds it as a new reading.',
};

export function ReadingEntry({ planId, step, readings, bands, onSaved, onReload, onRemoved, onDirty }: Props): ReactNode {
  const r = step.reading!;
  const units = unitChoices(r.unit);
  const blank = (): Form => ({ value: '', unit: units[0]!.value, takenOn: todayText(), note: '' });
  const [form, setForm] = useState<Form>(blank);
  const [editing, setEditing] = useState<Reading | null>(null);
  const [errors, setErrors] = useState<Record<string, string>>({});
  const [problem, setProblem] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);
  const [asking, setAsking] = useState<Reading | null>(null);
  const id = `rd-${safeId(step.key)}`;
  const dirty = form.value.trim() !== '' || form.note.trim() !== '' || editing !== null;

  useEffect(() => onDirty(step.key, dirty), [dirty]);
  useEffect(() => () => onDirty(step.key, false), []);

  const set = (k: keyof Form) => (v: string) => setForm((f) => ({ ...f, [k]: v }));

  const save = async (): Promise<void> => {
    setProblem(null);
    const parsed = parseNumberText(form.value, 'The reading');
    const input = { planId, quantity: r.quantity, value: parsed.ok ? parsed.value : Number.NaN, unit: form.unit, takenOn: form.takenOn.trim(), note: form.note };
    const checked = readingInput.safeParse(input);
    const local: Record<string, string> = checked.success ? {} : fieldMessages(checked.error);
    if (!parsed.ok) local.value = parsed.message;
    if (Object.keys(local).length > 0) {
      setErrors(local);
      document.getElementById(`${id}-${Object.keys(local)[0] === 'value' ? 'value' : Object.keys(local)[0]}`)?.focus();
      return;
    }
    setErrors({});
    setBusy(true);
    const res = editing ? await call('readings.update', { id: editing.id, expectedUpdatedAt: editing.updatedAt, reading: checked.data! }) : await call('readings.add', { reading: checked.data! });
    if (!res.ok && editing && (res.error.code === 'STALE' || res.error.code === 'NOT_FOUND')) {
      // Changed or deleted elsewhere since the sheet was read: read the reading again, keep every
      // character typed, and say what happened. The edit goes on against the reading as it is now,
      // so the next Save changes it (never adds a second one); a deleted reading is added anew.
      const again = await call('readings.list', { planId });
      setBusy(false);
      onReload();
      if (!again.ok) {
        setProblem(`${staleWords.changed} It could not be read again (${again.error.message}); reload the page before saving again.`);
        return;
      }
      const now = again.value.find((x) => x.id === editing.id) ?? null;
      if (now === null) {
        setEditing(null);
        setProblem(staleWords.deleted);
      } else {
        setEditing(now);
        setProblem(staleWords.reread(valueText(now.value, now.unit), now.takenOn));
      }
      return;
    }
    setBusy(false);
    if (!res.ok) {
      const fields: Record<string, string> = {};
      for (const [k, m] of Object.entries(res.error.fields ?? {})) fields[k.replace(/^reading\./, '')] = m;
      setErrors(fields);
      if (Object.keys(fields).length === 0) setProblem(res.error.message);
      return;
    }
    const what = `${editing ? 'Changed' : 'Saved'} the reading: ${valueText(res.value.value, r.unit === '' ? res.value.unit : r.unit)} on ${res.value.takenOn}.`;
    setEditing(null);
    setForm((f) => ({ ...blank(), takenOn: f.takenOn }));
    onSaved(what);
  };

  const remove = async (x: Reading): Promise<void> => {
    setAsking(null);
    setBusy(true);
    const res = await call('readings.delete', { id: x.id, expectedUpdatedAt: x.updatedAt });
    setBusy(false);
    if (!res.ok && (res.error.code === 'STALE' || res.error.code === 'NOT_FOUND')) {
      // Not deleted: the reading changed or went elsewhere. A problem, not a success; the list is read again.
      setProblem(`${res.error.message} The readings have been read again.`);
      onReload();
    } else if (!res.ok) setProblem(res.error.message);
    else {
      if (editing?.id === x.id) {
        setEditing(null);
        setForm(blank());
      }
      onRemoved({ text: `Deleted the reading of ${valueText(x.value, x.unit)} taken on ${x.takenOn}.`, undoToken: res.value.undoToken });
    }
  };

  const field = (k: keyof Form, label: string, input: ReactNode): ReactNode => (
    <div className={`field reading-field rf-${k}${errors[k] ? ' has-error' : ''}`}>
      <label htmlFor={`${id}-${k}`}>{label}</label>
      {input}
      {errors[k] ? (
        <span className="field-error" id={`${id}-${k}-error`} data-testid={`reading-error-${step.key}-${k}`}>
          <NoticeMark kind="problem" />{errors[k]}
        </span>
      ) : null}
    </div>
  );
  const described = (k: keyof Form) => ({ 'aria-invalid': errors[k] ? true : undefined, 'aria-describedby': errors[k] ? `${id}-${k}-error` : undefined });

  return (
    <div className="reading-entry" data-testid={`reading-entry-${step.key}`}>
      <form
        className="reading-form"
        aria-label={`${editing ? 'Change the reading' : 'Write down a reading'}: ${step.title}`}
        onSubmit={(e) => {
          e.preventDefault();
          void save();
        }}
        noValidate
      >
        {field(
          'value',
          'Your reading',
          <input id={`${id}-value`} type="text" inputMode="decimal" autoComplete="off" spellCheck={false} className="numeric" value={form.value} onChange={(e) => set('value')(e.target.value)} {...described('value')} />,
        )}
        {field(
          'unit',
          'Unit',
          <select id={`${id}-unit`} value={form.unit} onChange={(e) => set('unit')(e.target.value)} {...described('unit')}>
            {units.map((u) => (
              <option key={u.value} value={u.value}>
                {u.label}
              </option>
            ))}
          </select>,
        )}
        {field('takenOn', 'Date taken', <input id={`${id}-takenOn`} type="date" value={form.takenOn} onChange={(e) => set('takenOn')(e.target.value)} {...described('takenOn')} />)}
        {field('note', 'Note', <input id={`${id}-note`} type="text" autoComplete="off" value={form.note} onChange={(e) => set('note')(e.target.value)} {...described('note')} />)}
        <div className="reading-actions">
          <button type="submit" className="primary small" disabled={busy}>
            {editing ? 'Save the change' : 'Save reading'}
          </button>
          {editing ? (
            <button
              type="button"
              className="small"
              onClick={() => {
                setEditing(null);
                setErrors({});
                setForm(blank());
              }}
            >
              Cancel the change
            </button>
          ) : null}
        </div>
      </form>
      {problem ? (
        <p className="field-error" role="alert" data-testid={`reading-problem-${step.key}`}>
          <NoticeMark kind="problem" />Not saved: {problem}
        </p>
      ) : null}
      {readings.length > 0 ? (
        <ul className="taken-list" aria-label={`Readings taken: ${step.title}`} data-testid={`taken-${step.key}`}>
          {readings.map((x, i) => {
            const band = bands.get(x.id);
            return (
              <li key={x.id} className={editing?.id === x.id ? 'editing' : undefined}>
                <span className="taken-value">{valueText(x.value, x.unit)}</span>
                <span className="taken-date">{x.takenOn}</span>
                {band ? (
                  <span className={`taken-band band-${band}`}>
                    <BandMark band={band} /> {bandWords[band]}
                  </span>
                ) : null}
                {i === 0 && readings.length > 1 ? <span className="quiet">latest</span> : null}
                {x.note ? <span className="taken-note">{x.note}</span> : null}
                <button
                  type="button"
                  className="small"
                  aria-label={`Change the reading of ${valueText(x.value, x.unit)} taken on ${x.takenOn}`}
                  onClick={() => {
                    setEditing(x);
                    setErrors({});
                    setForm({ value: numberToText(x.value, 6), unit: units.some((u) => u.value === x.unit) ? x.unit : units[0]!.value, takenOn: x.takenOn, note: x.note });
                    requestAnimationFrame(() => document.getElementById(`${id}-value`)?.focus());
                  }}
                >
                  Change
                </button>
                <button type="button" className="small danger" aria-label={`Delete the reading of ${valueText(x.value, x.unit)} taken on ${x.takenOn}`} onClick={() => setAsking(x)}>
                  Delete
                </button>
              </li>
            );
          })}
        </ul>
      ) : null}
      {asking ? (
        <Confirm title="Delete this reading?" confirmLabel="Delete the reading" cancelLabel="Keep it" danger onConfirm={() => void remove(asking)} onCancel={() => setAsking(null)} testId="reading-delete-dialog">
          <p>
            The reading of {valueText(asking.value, asking.unit)} taken on {asking.takenOn} for “{step.title}” will be removed from the plan.
          </p>
        </Confirm>
      ) : null}
    </div>
  );
}
