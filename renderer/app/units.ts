/**
 * Millimetres or inches for gaps. Stored values are always millimetres; the choice only changes
 * what is shown and how typed text is read, and it is remembered on this computer.
 */
import { useCallback, useSyncExternalStore } from 'react';

export type GapUnit = 'mm' | 'in';
const key = 'ignition-planner.gapUnit';
const listeners = new Set<() => void>();

/** 1 inch = 25.4 mm exactly (international yard and pound agreement, 1959). */
export const mmPerInch = 25.4;

function read(): GapUnit {
  try {
    return window.localStorage.getItem(key) === 'in' ? 'in' : 'mm';
  } catch {
    return 'mm';
  }
}

export function setGapUnit(unit: GapUnit): void {
  try {
    window.localStorage.setItem(key, unit);
  } catch {
    // Storage refused (private mode): the choice lasts for this page only.
  }
  for (const l of listeners) l();
}

export function useGapUnit(): [GapUnit, (u: GapUnit) => void] {
  const unit = useSyncExternalStore(
    (l) => {
      listeners.add(l);
      return () => listeners.delete(l);
    },
    read,
    () => 'mm' as GapUnit,
  );
  return [unit, useCallback((u: GapUnit) => setGapUnit(u), [])];
}

export function mmToUnit(mm: number, unit: GapUnit): number {
  return unit === 'mm' ? mm : mm / mmPerInch;
}

export function unitToMm(value: number, unit: GapUnit): number {
  return unit === 'mm' ? value : value * mmPerInch;
}

/** Gap text for display: mm to 3 decimals, inches to 4 (a feeler gauge reads thou). */
export function gapText(mm: number | null, unit: GapUnit): string {
  if (mm === null || !Number.isFinite(mm)) return '';
  const v = mmToUnit(mm, unit);
  return String(Number(v.toFixed(unit === 'mm' ? 3 : 4)));
}

export const unitLabel = (unit: GapUnit): string => (unit === 'mm' ? 'mm' : 'in');
