/**
 * The save mechanics every editor shares (engines, parts, plans). A field's message shows once the
 * person has touched it or tried to save; a save the form's own check refuses sends nothing; a
 * refusal from the store puts its field messages beside the fields. Either way focus moves to the
 * first field named (or to the heading) and everything typed stays in the form.
 */
import { useCallback, useMemo, useRef, useState, type FormEvent, type RefObject } from 'react';
import type { Result } from '../../electron/ipc/channels.js';
import { fieldId, type FieldErrors } from './fields.js';

export type Messages = Record<string, string>;
/** What a form's own check answers: the input ready to send, or messages keyed by schema path. */
export type Checked<I> = { ok: true; input: I } | { ok: false; errors: Messages };
/** The editor's status line. */
/** `stale`: the store refused the save because the record changed elsewhere (STALE); the editor offers to reload. */
export type SaveStatus = { kind: 'done' | 'problem'; text: string; stale?: boolean };

/** Field keys from the store are relative to the request (`engine.boreMm`); the form's are not. */
export function withoutPrefix(fields: Messages | undefined, prefix: string): Messages {
  const out: Messages = {};
  for (const [k, v] of Object.entries(fields ?? {})) out[k.startsWith(`${prefix}.`) ? k.slice(prefix.length + 1) : k] = v;
  return out;
}

/**
 * Focuses the first field with a message, after the next paint (the message has to be there
 * first). `order` lists paths in the order they appear, where the messages' own order would not
 * be the reading order. With none of the fields on screen, the heading takes focus.
 */
export function focusFirstError(errors: Messages, heading: RefObject<HTMLElement | null>, order: readonly string[] = []): void {
  requestAnimationFrame(() => {
    const rank = (path: string): number => order.indexOf(path) + 1 || 99;
    const paths = order.length > 0 ? Object.keys(errors).sort((a, b) => rank(a) - rank(b)) : Object.keys(errors);
    for (const path of paths) {
      const el = document.getElementById(fieldId(path)) ?? document.querySelector<HTMLElement>(`[name="${path}"]`);
      if (el) {
        // Centred, so the message under the field is not hidden behind the action bar.
        el.focus({ preventScroll: true });
        return el.scrollIntoView({ block: 'center' });
      }
    }
    heading.current?.focus();
  });
}

type SaveSteps<I, V> = {
  /** Names what is saved in the "needs correcting" sentence: "this", "this plan". */
  what: string;
  /** The request's key for the form's fields in the store's answer: "engine", "part", "plan". */
  serverPrefix: string;
  send: (input: I) => Promise<Result<V>>;
  /** Shows a problem sentence in the editor's status line; `code` is the store's error code when it refused the save. */
  problem: (text: string, code?: string) => void;
  saved: (value: V) => void;
};

export function useFormSave(clientErrors: Messages, heading: RefObject<HTMLElement | null>, order?: readonly string[]) {
  const [touched, setTouched] = useState<Set<string>>(() => new Set());
  const [submitted, setSubmitted] = useState(false);
  const [serverErrors, setServerErrors] = useState<Messages>({});
  const [saving, setSaving] = useState(false);
  // Each field's visible label (unit included), told by the field itself: the list of things to fix names fields by it.
  const names = useRef(new Map<string, string>());

  const errorsCtx = useMemo<FieldErrors>(
    () => ({
      message: (path) => ((submitted || touched.has(path)) && clientErrors[path]) || serverErrors[path],
      touch: (path) => setTouched((t) => (t.has(path) ? t : new Set(t).add(path))),
      name: (path, label) => void names.current.set(path, label),
    }),
    [clientErrors, serverErrors, submitted, touched],
  );
  const fieldName = useCallback((path: string): string | undefined => names.current.get(path), []);

  const save = async <I, V>(e: FormEvent | undefined, check: Checked<I>, steps: SaveSteps<I, V>): Promise<void> => {
    e?.preventDefault();
    if (saving) return;
    setSubmitted(true);
    setServerErrors({});
    if (!check.ok) {
      steps.problem(`Nothing has been saved yet: fix what is listed here, then save ${steps.what} again.`);
      return focusFirstError(check.errors, heading, order);
    }
    setSaving(true);
    const r = await steps.send(check.input);
    setSaving(false);
    if (!r.ok) {
      const fields = withoutPrefix(r.error.fields, steps.serverPrefix);
      setServerErrors(fields);
      steps.problem(`Not saved: ${r.error.message} Everything you typed is still here.`, r.error.code);
      return focusFirstError(fields, heading, order);
    }
    steps.saved(r.value);
  };

  /** After a save: what is on screen is now the clean state, so no message shows until touched again. */
  const settle = (): void => {
    setSubmitted(false);
    setTouched(new Set());
  };

  return { errorsCtx, submitted, serverErrors, setServerErrors, saving, save, settle, fieldName };
}
