/**
 * Unknown settings in a plan or bin file, found anywhere (engine, its conditions, the existing
 * setup, every inline part, candidates, options): each is refused with the place, the name and
 * the setting probably meant, `engine: unknown setting "pointsFloatRPM" (did you mean
 * pointsFloatRpm?)`. The walk follows the file's own zod schema beside the raw JSON, so a field
 * added to a schema is known here at once. The store's schemas strip unknown keys on their own
 * (a stored row may be read by an older copy of the app); a file someone typed must not lose a
 * misspelt setting silently.
 */
import { z } from 'zod';
import { closestName } from './suggest.js';

const isObject = (v: unknown): v is Record<string, unknown> => typeof v === 'object' && v !== null && !Array.isArray(v);

const where = (path: readonly (string | number)[]): string => path.map(String).join('.') || '(the file)';

/** Words for keys a person may put in the wrong place, said instead of a spelling guess. */
export type Hints = Readonly<Record<string, string>>;

/** Optional, nullable, default and preprocess wrappers taken off, down to the schema that holds the keys. */
function unwrap(schema: z.ZodType): z.ZodType {
  let s: z.ZodType = schema;
  for (let i = 0; i < 20; i++) {
    if (s instanceof z.ZodOptional || s instanceof z.ZodNullable || s instanceof z.ZodDefault) s = s.unwrap() as z.ZodType;
    else if (s instanceof z.ZodPipe) s = (s.out instanceof z.ZodTransform ? s.in : s.out) as z.ZodType;
    else return s;
  }
  return s;
}

/** The option of a discriminated union that the raw value names, if any. */
function optionFor(union: z.ZodDiscriminatedUnion, raw: Record<string, unknown>): z.ZodObject | null {
  const key = union.def.discriminator;
  for (const option of union.options) {
    const o = unwrap(option as z.ZodType);
    if (!(o instanceof z.ZodObject)) continue;
    const tag = o.shape[key];
    if (tag instanceof z.ZodLiteral && tag.values.has(raw[key] as never)) return o;
  }
  return null;
}

/**
 * Every unknown key in `raw` against `schema`, as `place: unknown setting "x" (did you mean y?)`,
 * and `known`: a copy of `raw` without them, so the rest of the file can still be checked and
 * every problem said at once. `at` gives another schema for a path (the plan file's engine is a
 * plain record until it is read as an engine); `hints` a sentence for a key known elsewhere.
 */
export function unknownSettings(
  raw: unknown,
  schema: z.ZodType,
  at: Readonly<Record<string, z.ZodType>> = {},
  hints: Hints = {},
): { lines: string[]; known: unknown } {
  const lines: string[] = [];
  const walk = (value: unknown, s0: z.ZodType, path: (string | number)[]): unknown => {
    const s = unwrap(at[where(path)] ?? s0);
    if (s instanceof z.ZodArray) {
      return Array.isArray(value) ? value.map((v, i) => walk(v, s.element as z.ZodType, [...path, i])) : value;
    }
    if (!isObject(value)) return value;
    let obj: z.ZodObject | null = null;
    if (s instanceof z.ZodObject) obj = s;
    else if (s instanceof z.ZodDiscriminatedUnion) obj = optionFor(s, value);
    if (!obj) return value;
    const known = Object.keys(obj.shape);
    const kept: Record<string, unknown> = {};
    for (const [key, v] of Object.entries(value)) {
      if (known.includes(key)) kept[key] = walk(v, obj.shape[key] as z.ZodType, [...path, key]);
      else {
        const hint = hints[`${where(path)}.${key}`];
        const guess = closestName(key, known);
        const instead = hint ?? (guess ? `did you mean ${guess}?` : known.length <= 12 ? `it takes ${known.join(', ')}` : 'README.md, "The plan file", lists the settings it takes');
        lines.push(`${where(path)}: unknown setting "${key}" (${instead}).`);
      }
    }
    return kept;
  };
  const known = walk(raw, schema, []);
  return { lines, known };
}
