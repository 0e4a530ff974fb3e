/**
 * JSON out. Every number must be finite: JSON would silently print NaN or Infinity as null, and a
 * null where a figure belongs would mislead whoever reads the report. A non-finite number is a
 * fault of ours, reported with where it was, not printed.
 */
import { CliError } from './errors.js';

export function assertFinite(value: unknown, path = '$'): void {
  if (typeof value === 'number') {
    if (!Number.isFinite(value)) throw new CliError(`Internal fault: ${path} came out as ${String(value)}; please report this with the input file.`, 1);
  } else if (Array.isArray(value)) {
    value.forEach((v, i) => assertFinite(v, `${path}[${i}]`));
  } else if (typeof value === 'object' && value !== null) {
    for (const [k, v] of Object.entries(value)) assertFinite(v, `${path}.${k}`);
  }
}

export function toJson(value: unknown): string {
  assertFinite(value);
  return `${JSON.stringify(value, null, 2)}\n`;
}
