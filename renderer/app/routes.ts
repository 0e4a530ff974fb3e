import type { PartKind } from '../../db/schema.js';

/** Where the person is in the app. Kept in memory: the address bar carries only the access key. */
export type Route =
  | { to: 'engines' }
  | { to: 'engine'; id: number }
  | { to: 'new-engine' }
  | { to: 'parts'; part?: { id: number } | { newKind: PartKind } }
  | { to: 'combination' }
  | { to: 'sheet'; planId?: number }
  | { to: 'records' };

export type Navigate = (route: Route) => void;

/** The screens in the side list, in the order the work is done. */
export const screens = [
  { to: 'engines', label: 'Engines' },
  { to: 'parts', label: 'Parts on the shelf' },
  { to: 'combination', label: 'Weigh a combination' },
  { to: 'sheet', label: 'Wiring sheet' },
  { to: 'records', label: 'Records and backups' },
] as const;

export function screenOf(route: Route): (typeof screens)[number]['to'] {
  return route.to === 'engine' || route.to === 'new-engine' ? 'engines' : route.to;
}
