import { partKinds, type PartKind } from '../../db/schema.js';

/**
 * Where the person is in the app. The address keeps it after the access key is taken out
 * (`#/parts/12`, see `routeToHash`), so a reload returns to the same screen; the store's settings
 * keep the last screen for the next start (`lastScreen`).
 */
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

const idOf = (text: string | undefined): number | null => (text !== undefined && /^[1-9][0-9]{0,15}$/.test(text) ? Number(text) : null);

/** The route as the address's hash: `#/engines`, `#/engine/3`, `#/parts/new/coil`, `#/sheet/5`. */
export function routeToHash(route: Route): string {
  switch (route.to) {
    case 'engine':
      return `#/engine/${route.id}`;
    case 'parts':
      if (!route.part) return '#/parts';
      return 'id' in route.part ? `#/parts/${route.part.id}` : `#/parts/new/${route.part.newKind}`;
    case 'sheet':
      return route.planId === undefined ? '#/sheet' : `#/sheet/${route.planId}`;
    default:
      return `#/${route.to}`;
  }
}

/** The route an address's hash names, or null when it names none (then the last screen is used). */
export function routeFromHash(hash: string): Route | null {
  if (!hash.startsWith('#/')) return null;
  const [head, a, b, ...rest] = hash.slice(2).split('/');
  if (rest.length > 0) return null;
  switch (head) {
    case 'engines':
    case 'new-engine':
    case 'combination':
    case 'records':
      return a === undefined ? { to: head } : null;
    case 'engine': {
      const id = idOf(a);
      return id !== null && b === undefined ? { to: 'engine', id } : null;
    }
    case 'parts': {
      if (a === undefined) return { to: 'parts' };
      if (a === 'new') return (partKinds as readonly string[]).includes(b ?? '') ? { to: 'parts', part: { newKind: b as PartKind } } : null;
      const id = idOf(a);
      return id !== null && b === undefined ? { to: 'parts', part: { id } } : null;
    }
    case 'sheet': {
      if (a === undefined) return { to: 'sheet' };
      const id = idOf(a);
      return id !== null && b === undefined ? { to: 'sheet', planId: id } : null;
    }
    default:
      return null;
  }
}
