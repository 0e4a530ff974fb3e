/**
 * Small labelled inputs for every form (engines, parts, plans). Each takes the schema path it edits, shows its
 * unit in the label, and shows the message for that path right beside it (linked with
 * aria-describedby so a screen reader reads it with the field).
 */
import { createContext, useContext, useLayoutEffect, useRef, type ReactNode } from 'react';
import type { Part } from '../../db/schema.js';
import { NoticeMark } from './Notice.js';

/**
 * What a form's fields share: the message for a path, "this one was touched", and `name`, which
 * each field calls with its visible label (unit included) so the list of things to fix names the
 * field exactly as the form shows it.
 */
export type FieldErrors = { message(path: string): string | undefined; touch(path: string): void; name?(path: string, label: string): void };
export const FieldErrorsContext = createContext<FieldErrors>({ message: () => undefined, touch: () => {} });

/** Tells the form the words a field is shown with (its label, unit included). */
export function useFieldName(path: string, label: string): void {
  const ctx = useContext(FieldErrorsContext);
  useLayoutEffect(() => ctx.name?.(path, label), [ctx, path, label]);
}

export const fieldId = (path: string): string => `f-${path.replace(/\./g, '-')}`;

/**
 * A field's message appears once the person has changed it and moved on (or on save). Passing
 * through an untouched box shows nothing, so tabbing or clicking past never makes the layout
 * jump under the pointer.
 */
export function useTouchAfterEdit(path: string): { onEdit: () => void; onLeave: () => void } {
  const ctx = useContext(FieldErrorsContext);
  const edited = useRef(false);
  return {
    onEdit: () => {
      edited.current = true;
    },
    onLeave: () => {
      if (edited.current) ctx.touch(path);
    },
  };
}
const errorId = (path: string): string => `e-${path.replace(/\./g, '-')}`;

/** The message tab under a field: a notch pointing up at the box, the open-contact mark, the words. */
export function FieldMessageTab({ path, message }: { path: string; message: string }): ReactNode {
  return (
    <span className="field-error" id={errorId(path)} data-testid={`error-${path}`}>
      <NoticeMark kind="problem" />
      <span className="field-error-words">{message}</span>
    </span>
  );
}

function FieldMessage({ path, hint }: { path: string; hint?: string | undefined }): ReactNode {
  const message = useContext(FieldErrorsContext).message(path);
  return (
    <>
      {hint && !message ? <span className="hint" id={`h-${fieldId(path)}`}>{hint}</span> : null}
      {message ? <FieldMessageTab path={path} message={message} /> : null}
    </>
  );
}

function describe(path: string, message: string | undefined, hint: string | undefined): string | undefined {
  if (message) return errorId(path);
  return hint ? `h-${fieldId(path)}` : undefined;
}

type TextProps = {
  path: string;
  label: string;
  value: string;
  onChange: (v: string) => void;
  hint?: string;
  numeric?: boolean;
  wide?: boolean;
  placeholder?: string;
};

/** A text box; numbers are typed as text too, so a half-typed value is never lost or NaN. */
export function TextField({ path, label, value, onChange, hint, numeric, wide, placeholder }: TextProps): ReactNode {
  const ctx = useContext(FieldErrorsContext);
  useFieldName(path, label);
  const touch = useTouchAfterEdit(path);
  const message = ctx.message(path);
  return (
    <div className={`field${wide ? ' wide' : ''}${message ? ' has-error' : ''}`}>
      <label htmlFor={fieldId(path)}>{label}</label>
      <input
        id={fieldId(path)}
        name={path}
        type="text"
        inputMode={numeric ? 'decimal' : undefined}
        autoComplete="off"
        spellCheck={numeric ? false : undefined}
        className={numeric ? 'numeric' : undefined}
        value={value}
        placeholder={placeholder}
        aria-invalid={message ? true : undefined}
        aria-describedby={describe(path, message, hint)}
        onChange={(e) => {
          touch.onEdit();
          onChange(e.target.value);
        }}
        onBlur={touch.onLeave}
      />
      <FieldMessage path={path} hint={hint} />
    </div>
  );
}

export function NotesField({ path, label, value, onChange }: Omit<TextProps, 'numeric'>): ReactNode {
  const ctx = useContext(FieldErrorsContext);
  useFieldName(path, label);
  const touch = useTouchAfterEdit(path);
  const message = ctx.message(path);
  return (
    <div className={`field wide${message ? ' has-error' : ''}`}>
      <label htmlFor={fieldId(path)}>{label}</label>
      <textarea
        id={fieldId(path)}
        name={path}
        rows={2}
        value={value}
        aria-invalid={message ? true : undefined}
        aria-describedby={describe(path, message, undefined)}
        onChange={(e) => {
          touch.onEdit();
          onChange(e.target.value);
        }}
        onBlur={touch.onLeave}
      />
      <FieldMessage path={path} />
    </div>
  );
}

type Choice<T extends string> = { value: T; label: string };

export function SelectField<T extends string>(props: {
  path: string;
  label: string;
  value: T;
  choices: readonly Choice<T>[];
  onChange: (v: T) => void;
  hint?: string;
}): ReactNode {
  const { path, label, value, choices, onChange, hint } = props;
  const ctx = useContext(FieldErrorsContext);
  useFieldName(path, label);
  const message = ctx.message(path);
  return (
    <div className={`field${message ? ' has-error' : ''}`}>
      <label htmlFor={fieldId(path)}>{label}</label>
      <select
        id={fieldId(path)}
        name={path}
        value={value}
        aria-invalid={message ? true : undefined}
        aria-describedby={describe(path, message, hint)}
        onChange={(e) => {
          ctx.touch(path);
          onChange(e.target.value as T);
        }}
      >
        {choices.map((c) => (
          <option key={c.value} value={c.value}>
            {c.label}
          </option>
        ))}
      </select>
      <FieldMessage path={path} hint={hint} />
    </div>
  );
}

export function CheckField({ path, label, checked, onChange, hint }: { path: string; label: string; checked: boolean; onChange: (v: boolean) => void; hint?: string }): ReactNode {
  const message = useContext(FieldErrorsContext).message(path);
  useFieldName(path, label);
  return (
    <div className={`field check${message ? ' has-error' : ''}`}>
      <input
        id={fieldId(path)}
        name={path}
        type="checkbox"
        checked={checked}
        aria-describedby={describe(path, message, hint)}
        onChange={(e) => onChange(e.target.checked)}
      />
      <label htmlFor={fieldId(path)}>{label}</label>
      <FieldMessage path={path} hint={hint} />
    </div>
  );
}

/** Picks one stored part of a kind, or none; an id the list no longer holds is shown, not dropped. */
export function PartPicker({ path, label, value, parts, onChange, noneLabel = 'None recorded' }: {
  path: string;
  label: string;
  value: string;
  parts: readonly Part[];
  onChange: (v: string) => void;
  noneLabel?: string;
}): ReactNode {
  const choices: Choice<string>[] = [{ value: '', label: noneLabel }, ...parts.map((p) => ({ value: String(p.id), label: p.name }))];
  if (value !== '' && !parts.some((p) => String(p.id) === value)) choices.push({ value, label: `Part no. ${value} (not on the shelf)` });
  return <SelectField path={path} label={label} value={value} choices={choices} onChange={onChange} />;
}
