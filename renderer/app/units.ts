/**
 * Millimetres or inches for gaps. Stored values are always millimetres; the choice only changes
 * what is shown and how typed text is read. It is kept in the store's settings (`lengthUnit`,
 * 'mm' | 'inch'), so it survives a new start of the browser host on another port.
 */
import { useCallback } from 'react';
import { saveSettings, settingsNow, useSettings } from './settings.js';

export type GapUnit = 'mm' | 'in';

/** 1 inch = 25.4 mm exactly (international yard and pound agreement, 1959). */
export const mmPerInch = 25.4;

/** The choice as it is now (outside React). */
export function gapUnitNow(): GapUnit {
  return settingsNow().lengthUnit === 'inch' ? 'in' : 'mm';
}

export function setGapUnit(unit: GapUnit): void {
  void saveSettings({ lengthUnit: unit === 'in' ? 'inch' : 'mm' });
}

export function useGapUnit(): [GapUnit, (u: GapUnit) => void] {
  const unit: GapUnit = useSettings().lengthUnit === 'inch' ? 'in' : 'mm';
  return [unit, useCallback((u: GapUnit) => setGapUnit(u), [])];
}

export function mmToUnit(mm: number, unit: GapUnit): number {
  return unit === 'mm' ? mm : mm / mmPerInch;
}

export function unitToMm(value: number, unit: GapUnit): number {
  return unit === 'mm' ? value : value * mmPerInch;
}

/**
 * Gap text for display: mm to at most 3 decimals (trailing zeros dropped); inches to exactly 3
 * decimals, as a feeler gauge is marked in thou (0.025, 0.030).
 */
export function gapText(mm: number | null, unit: GapUnit): string {
  if (mm === null || !Number.isFinite(mm)) return '';
  const v = mmToUnit(mm, unit);
  return unit === 'mm' ? String(Number(v.toFixed(3))) : v.toFixed(3);
}

export const unitLabel = (unit: GapUnit): string => (unit === 'mm' ? 'mm' : 'in');
