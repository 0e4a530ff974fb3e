/**
 * The distributor's mechanical advance curve as a small table: engine rpm against the degrees the
 * weights add on top of the static setting. Rows can be added and removed; each cell carries its
 * own message (path "advanceCurve.<row>.rpm"). A row left wholly blank is not part of the curve
 * (form-model.ts leaves it out), so a new row shows nothing until something is typed in it.
 */
import { useContext, useRef, type ReactNode } from 'react';
import { FieldErrorsContext, FieldMessageTab, fieldId, useFieldName, useTouchAfterEdit } from '../../app/fields.js';
import { Group } from '../../app/Group.js';
import { nextRowKey, type EngineForm } from './form-model.js';
import type { Update } from './sections-engine.js';

function Cell({ path, label, value, onChange }: { path: string; label: string; value: string; onChange: (v: string) => void }): ReactNode {
  const ctx = useContext(FieldErrorsContext);
  const touch = useTouchAfterEdit(path);
  const message = ctx.message(path);
  useFieldName(path, label);
  const errId = `e-${path.replace(/\./g, '-')}`;
  return (
    <td className={message ? 'has-error' : undefined}>
      <input
        id={fieldId(path)}
        type="text"
        inputMode="decimal"
        className="numeric"
        aria-label={label}
        value={value}
        aria-invalid={message ? true : undefined}
        aria-describedby={message ? errId : undefined}
        onChange={(e) => {
          touch.onEdit();
          onChange(e.target.value);
        }}
        onBlur={touch.onLeave}
      />
      {message ? <FieldMessageTab path={path} message={message} /> : null}
    </td>
  );
}

export function AdvanceCurveTable({ form, update }: { form: EngineForm; update: Update }): ReactNode {
  const addRef = useRef<HTMLButtonElement>(null);
  const rows = form.advanceCurve;
  const setCell = (i: number, key: 'rpm' | 'advanceDeg', v: string): void =>
    update((f) => ({ ...f, advanceCurve: f.advanceCurve.map((r, j) => (j === i ? { ...r, [key]: v } : r)) }));
  const add = (): void => {
    update((f) => ({ ...f, advanceCurve: [...f.advanceCurve, { key: nextRowKey(), rpm: '', advanceDeg: '' }] }));
    // Put the cursor in the new row's rpm box once it exists.
    requestAnimationFrame(() => document.getElementById(fieldId(`advanceCurve.${rows.length}.rpm`))?.focus());
  };
  const remove = (i: number): void => {
    update((f) => ({ ...f, advanceCurve: f.advanceCurve.filter((_, j) => j !== i) }));
    addRef.current?.focus();
  };
  return (
    <Group title="Advance curve (from the workshop manual)" id="g-curve" full>
      <div className="wide">
        {rows.length === 0 ? <p className="quiet">No rows yet. Without a curve only the static timing is used.</p> : null}
        {rows.length > 0 ? (
          <table className="curve" aria-label="Advance curve">
            <thead>
              <tr>
                <th scope="col">Row</th>
                <th scope="col">Engine speed (rpm)</th>
                <th scope="col">Advance added to static (crankshaft degrees)</th>
                <th scope="col"><span className="visually-hidden">Remove</span></th>
              </tr>
            </thead>
            <tbody>
              {rows.map((r, i) => (
                <tr key={r.key}>
                  <th scope="row">{i + 1}</th>
                  <Cell path={`advanceCurve.${i}.rpm`} label={`Row ${i + 1} engine speed (rpm)`} value={r.rpm} onChange={(v) => setCell(i, 'rpm', v)} />
                  <Cell path={`advanceCurve.${i}.advanceDeg`} label={`Row ${i + 1} advance (crankshaft degrees)`} value={r.advanceDeg} onChange={(v) => setCell(i, 'advanceDeg', v)} />
                  <td>
                    <button type="button" className="small" onClick={() => remove(i)} aria-label={`Remove row ${i + 1}`}>
                      Remove
                    </button>
                  </td>
                </tr>
              ))}
            </tbody>
          </table>
        ) : null}
        <button type="button" ref={addRef} onClick={add} disabled={rows.length >= 40}>
          Add a row
        </button>
      </div>
    </Group>
  );
}
