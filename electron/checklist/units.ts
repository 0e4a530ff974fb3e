/**
 * The one workshop unit of each reading quantity (the contract's table; the store's `readingUnits`
 * in db/schema.ts holds the same table, and readings are matched to steps in this unit).
 */
import type { ReadingQuantity, WorkshopUnit } from './types.js';

export const QUANTITY_UNITS: Readonly<Record<ReadingQuantity, WorkshopUnit>> = {
  'battery-voltage-resting': 'V',
  'coil-primary-resistance': 'ohm',
  'coil-secondary-resistance': 'kohm',
  'ballast-resistance': 'ohm',
  'ht-lead-resistance': 'kohm',
  'key-on-current': 'A',
  'coil-feed-voltage-key-on': 'V',
  'coil-switch-voltage-key-on': 'V',
  'coil-voltage-after-shut-off': 'V',
  'supply-voltage-cranking': 'V',
  'coil-feed-voltage-cranking': 'V',
  'module-supply-voltage-cranking': 'V',
  'supply-voltage-running': 'V',
  'dwell-angle': 'deg',
  'tach-idle-rpm': 'rpm',
  'timing-idle': 'deg',
  'timing-advanced': 'deg',
  'plug-gap': 'mm',
  other: '',
};
