/**
 * A cold morning one setting away: the air temperature the engine is weighed at. Applying it has the
 * screen weigh again at once and saves the engine's own `ambientC` working condition (the same one
 * the engine editor sets) beside it; a refused save weighs again with what is stored. A blank box
 * goes back to the default. The air temperature moves the
 * cranking supply (a cold battery), the charge at the cranking point and the coil's resistance.
 */
import { useState, type FormEvent, type ReactNode } from 'react';
import { conditionByKey, conditionOverrides, conditionText, type Engine } from '../../../db/schema.js';
import { call } from '../../app/bridge.js';
import { parseOptionalNumberText } from '../../app/numbers.js';
import { NoticeMark } from '../../app/Notice.js';

type Props = {
  engine: Engine;
  /** Weigh at once with these working conditions; settles when the comparison has answered. */
  onWeigh: (conditions: Engine['conditions']) => Promise<void>;
  /** The engine as stored after the change (the shelf can be searched again with it). */
  onSaved: (engine: Engine) => void;
  /** The save was refused: weigh again with what is stored. */
  onNotSaved: () => void;
};

const amb = conditionByKey.ambientC;

const shown = (v: number | undefined): string => (v === undefined ? '' : String(v));

export function AmbientField({ engine, onWeigh, onSaved, onNotSaved }: Props): ReactNode {
  // The latest stored copy: a second change must not send back the first one's stale record.
  const [saved, setSaved] = useState<Engine | null>(null);
  const current = saved && saved.id === engine.id ? saved : engine;
  const [text, setText] = useState<{ for: number; value: string }>({ for: engine.id, value: shown(engine.conditions.ambientC) });
  const [message, setMessage] = useState<{ kind: 'problem' | 'done'; text: string } | null>(null);
  const [busy, setBusy] = useState(false);
  const typed = text.for === engine.id ? text.value : shown(current.conditions.ambientC);
  const def = amb.byDefault({ systemVoltageV: current.systemVoltageV, ambientC: 20 });
  const stored = current.conditions.ambientC;

  const apply = async (e: FormEvent): Promise<void> => {
    e.preventDefault();
    const p = parseOptionalNumberText(typed, amb.label);
    if (!p.ok) return setMessage({ kind: 'problem', text: p.message });
    if (p.value !== null) {
      const checked = conditionOverrides.shape.ambientC.safeParse(p.value);
      if (!checked.success) return setMessage({ kind: 'problem', text: checked.error.issues[0]?.message ?? `${amb.label} could not be used.` });
    }
    if ((p.value ?? undefined) === stored) return setMessage({ kind: 'done', text: 'Already weighed at this air temperature.' });
    const { id, updatedAt, ...rest } = current;
    const conditions = { ...rest.conditions };
    if (p.value === null) delete conditions.ambientC;
    else conditions.ambientC = p.value;
    setBusy(true);
    await onWeigh(conditions);
    const r = await call('engines.update', { id, expectedUpdatedAt: updatedAt, engine: { ...rest, conditions } });
    setBusy(false);
    if (!r.ok) {
      onNotSaved();
      const beside = r.error.fields?.['engine.conditions.ambientC'];
      return setMessage({ kind: 'problem', text: `${beside ?? r.error.message} The figures shown are for what is stored.` });
    }
    setSaved(r.value);
    setText({ for: r.value.id, value: shown(r.value.conditions.ambientC) });
    setMessage({ kind: 'done', text: p.value === null ? `Back to the default ${conditionText(amb, def.value)}; weighing again.` : `Saved ${conditionText(amb, p.value)} for this engine; weighing again.` });
    onSaved(r.value);
  };

  const hint =
    stored === undefined
      ? `Blank: ${conditionText(amb, def.value)}, ${def.source}. Type a cold morning (for example -18) to see the cranking figures then.`
      : `Set for this engine (engine override): ${conditionText(amb, stored)}. Clear the box for the default ${conditionText(amb, def.value)}.`;

  return (
    <form className="ambient-field" onSubmit={(e) => void apply(e)} noValidate aria-label="Air temperature to weigh at" data-testid="ambient-field">
      <div className={`field${message?.kind === 'problem' ? ' has-error' : ''}`}>
        <label htmlFor="weigh-ambient">Ambient air ({amb.unit})</label>
        <input
          id="weigh-ambient"
          type="text"
          inputMode="decimal"
          autoComplete="off"
          spellCheck={false}
          className="numeric"
          value={typed}
          placeholder={String(def.value)}
          aria-invalid={message?.kind === 'problem' ? true : undefined}
          aria-describedby="weigh-ambient-note"
          onChange={(ev) => {
            setText({ for: engine.id, value: ev.target.value });
            setMessage(null);
          }}
        />
        {message ? (
          <span id="weigh-ambient-note" className={message.kind === 'problem' ? 'field-error' : 'hint'} data-testid="ambient-message" role={message.kind === 'problem' ? 'alert' : 'status'}>
            {message.kind === 'problem' ? (
              <NoticeMark kind="problem" />
            ) : null}{' '}
            {message.text}
          </span>
        ) : (
          <span id="weigh-ambient-note" className="hint">
            {hint}
          </span>
        )}
      </div>
      <button type="submit" disabled={busy}>
        {busy ? 'Saving…' : 'Weigh at this temperature'}
      </button>
    </form>
  );
}
