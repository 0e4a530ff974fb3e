/**
 * Problems found in a file someone brings in (a workshop file or a CSV), one per row and field,
 * and the walk that finds keys the store's schemas would silently drop: a zod object strips keys
 * it does not know, so anything in the raw value that is missing from the parsed value is a key
 * the file should not have. Unknown keys are refused, never dropped.
 */
import { z } from 'zod';

/** `where` names the row and field (`engines.2.plans.0.plugGapMm`, `row 14, primary resistance`). */
export type Problem = { where: string; message: string };

const isObject = (v: unknown): v is Record<string, unknown> => typeof v === 'object' && v !== null && !Array.isArray(v);

export const joinPath = (prefix: string, path: readonly PropertyKey[]): string =>
  [prefix, ...path.map(String)].filter((s) => s !== '').join('.');

/** Every zod issue as a problem under `prefix`. */
export function zodProblems(prefix: string, error: z.ZodError): Problem[] {
  return error.issues.map((i) => ({ where: joinPath(prefix, i.path) || '(the file)', message: i.message }));
}

/** Keys present in `raw` but not in `parsed` (what zod kept), at any depth. */
export function unknownKeyProblems(prefix: string, raw: unknown, parsed: unknown): Problem[] {
  const out: Problem[] = [];
  const walk = (r: unknown, p: unknown, path: string): void => {
    if (Array.isArray(r) && Array.isArray(p)) {
      r.forEach((item, i) => walk(item, p[i], `${path}.${i}`));
    } else if (isObject(r) && isObject(p)) {
      for (const key of Object.keys(r)) {
        if (!(key in p)) out.push({ where: `${path}.${key}`.replace(/^\./, ''), message: `"${key}" is not a field here; remove it or check its spelling.` });
        else walk(r[key], p[key], `${path}.${key}`);
      }
    }
  };
  walk(raw, parsed, prefix);
  return out;
}

/** One line per problem, `where: message`. */
export function problemLines(problems: readonly Problem[]): string[] {
  return problems.map((p) => `${p.where}: ${p.message}`);
}

/** Optional, nullable, default and pipe wrappers taken off, down to the schema that holds the keys. */
function unwrap(schema: z.ZodType): z.ZodType {
  let s: z.ZodType = schema;
  for (let i = 0; i < 20; i++) {
    if (s instanceof z.ZodOptional || s instanceof z.ZodNullable || s instanceof z.ZodDefault) s = s.unwrap() as z.ZodType;
    else if (s instanceof z.ZodPipe) s = s.in as z.ZodType;
    else return s;
  }
  return s;
}

/** The keys an object schema (or the option of a discriminated union the value names) knows, with their schemas. */
function shapeFor(schema: z.ZodType, raw: Record<string, unknown>): Record<string, z.ZodType> | null {
  const s = unwrap(schema);
  if (s instanceof z.ZodObject) return s.shape as Record<string, z.ZodType>;
  if (s instanceof z.ZodDiscriminatedUnion) {
    const key = s.def.discriminator;
    for (const option of s.options) {
      const shape = shapeFor(option as z.ZodType, raw);
      const tag = shape?.[key];
      if (tag instanceof z.ZodLiteral && tag.values.has(raw[key] as never)) return shape;
    }
    return null;
  }
  if (s instanceof z.ZodIntersection) {
    const left = shapeFor(s.def.left as z.ZodType, raw);
    const right = shapeFor(s.def.right as z.ZodType, raw);
    return left && right ? { ...left, ...right } : null;
  }
  return null;
}

/**
 * Keys in `raw` that `schema` does not know, found by walking the raw value beside the schema, so
 * they are reported even when other fields of the same record fail (where the parsed value, and so
 * unknownKeyProblems, is not available).
 */
export function unknownKeysBeside(prefix: string, schema: z.ZodType, raw: unknown): Problem[] {
  const out: Problem[] = [];
  const walk = (sch: z.ZodType, r: unknown, path: string): void => {
    const s = unwrap(sch);
    if (Array.isArray(r)) {
      if (s instanceof z.ZodArray) r.forEach((item, i) => walk(s.element as z.ZodType, item, `${path}.${i}`));
      return;
    }
    if (!isObject(r)) return;
    const shape = shapeFor(s, r);
    if (!shape) return;
    for (const key of Object.keys(r)) {
      const child = shape[key];
      if (!child) out.push({ where: `${path}.${key}`.replace(/^\./, ''), message: `"${key}" is not a field here; remove it or check its spelling.` });
      else walk(child, r[key], `${path}.${key}`);
    }
  };
  walk(schema, raw, prefix);
  return out;
}
