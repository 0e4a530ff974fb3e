/** "Parts on the shelf": the list, or the editor for one part when the route names one. */
import type { ReactNode } from 'react';
import type { Navigate, Route } from '../../app/routes.js';
import { PartEditor } from './PartEditor.js';
import { PartsList } from './PartsList.js';

type Props = {
  route: Extract<Route, { to: 'parts' }>;
  navigate: Navigate;
  leave: Navigate;
  /** Bumped when the demo loader adds parts, so the list reads the shelf again. */
  version: number;
};

export function PartsScreen({ route, navigate, leave, version }: Props): ReactNode {
  const target = route.part;
  if (!target) return <PartsList navigate={navigate} version={version} />;
  const key = 'id' in target ? `p${target.id}` : `new-${target.newKind}`;
  return <PartEditor key={key} target={target} navigate={navigate} leave={leave} />;
}
