/** One table per kind of part, each with the columns a restorer compares that kind by. */
import type { ReactNode } from 'react';
import type { Part, PartKind } from '../../../db/schema.js';
import { ActionsHead, RowActions } from '../../app/list-screen.js';
import type { GapUnit } from '../../app/units.js';
import { ballastFigures, coilFigures, leadsFigures, moduleFigures, plugFigures, tachFigures } from './figures.js';
import { kindWords } from './labels.js';

type Of<K extends PartKind> = Extract<Part, { kind: K }>;
type Column<K extends PartKind> = { head: string; cell: (p: Of<K>, unit: GapUnit) => string; num?: boolean; wrap?: boolean };

const columns: { [K in PartKind]: Column<K>[] } = {
  coil: [
    { head: 'Primary at 20 °C', cell: (p) => coilFigures(p).primary, num: true },
    { head: 'Inductance', cell: (p) => coilFigures(p).inductance, num: true },
    { head: 'Secondary', cell: (p) => coilFigures(p).secondary, num: true },
    { head: 'Turns ratio', cell: (p) => coilFigures(p).ratio, num: true },
    { head: 'Fed', cell: (p) => coilFigures(p).feed },
    { head: 'Rated', cell: (p) => coilFigures(p).rated, num: true },
  ],
  ballast: [
    { head: 'Type', cell: (p) => ballastFigures(p).type },
    { head: 'Cold resistance', cell: (p) => ballastFigures(p).cold, num: true },
    { head: 'Warms by', cell: (p) => ballastFigures(p).thermal, num: true },
  ],
  module: [
    { head: 'Type', cell: (p) => moduleFigures(p).type, wrap: true },
    { head: 'Supply', cell: (p) => moduleFigures(p).supply, num: true },
    { head: 'Smallest coil', cell: (p) => moduleFigures(p).minCoil, num: true },
    { head: 'Max current', cell: (p) => moduleFigures(p).maxCurrent, num: true },
    { head: 'Dwell or CD stage', cell: (p) => moduleFigures(p).dwell, wrap: true },
    { head: 'Earth', cell: (p) => moduleFigures(p).earth, wrap: true },
  ],
  tach: [{ head: 'Reads the engine speed from', cell: (p) => tachFigures(p).senses }],
  leads: [
    { head: 'Core', cell: (p) => leadsFigures(p).core },
    { head: 'Resistance per lead', cell: (p) => leadsFigures(p).perLead, num: true },
  ],
  plug: [
    { head: 'Suppression resistor', cell: (p) => plugFigures(p, 'mm').resistor },
    { head: 'Gap range', cell: (p, unit) => plugFigures(p, unit).gaps, num: true },
  ],
};

type Props<K extends PartKind> = {
  kind: K;
  parts: readonly Part[];
  unit: GapUnit;
  onEdit: (p: Part) => void;
  onDelete: (p: Part) => void;
};

export function KindTable<K extends PartKind>({ kind, parts, unit, onEdit, onDelete }: Props<K>): ReactNode {
  const cols = columns[kind] as Column<K>[];
  return (
    <table className={`list parts-table parts-${kind}`} aria-label={`${kindWords[kind].many} on the shelf`} data-testid={`parts-table-${kind}`}>
      <thead>
        <tr>
          <th scope="col">Name</th>
          {cols.map((c) => (
            <th scope="col" key={c.head} className={c.num ? 'num' : undefined}>
              {c.head}
            </th>
          ))}
          <th scope="col" className="num">
            How many
          </th>
          <ActionsHead />
        </tr>
      </thead>
      <tbody>
        {parts.map((p) => (
          <tr key={p.id} data-testid={`part-row-${p.id}`}>
            <th scope="row">
              <button type="button" className="link" onClick={() => onEdit(p)}>
                {p.name}
              </button>
              {p.notes.trim() !== '' ? <span className="part-notes">{p.notes}</span> : null}
            </th>
            {cols.map((c) => (
              <td key={c.head} className={[c.num ? 'num' : '', c.wrap ? 'wrap' : ''].join(' ').trim() || undefined}>
                {c.cell(p as Of<K>, unit)}
              </td>
            ))}
            <td className="num" data-testid={`part-quantity-${p.id}`}>
              {p.quantity}
            </td>
            <RowActions name={p.name} onEdit={() => onEdit(p)} onDelete={() => onDelete(p)} />
          </tr>
        ))}
      </tbody>
    </table>
  );
}
