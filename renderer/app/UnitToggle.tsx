/** The mm / inch choice for gaps, as a pair of radio buttons (arrow keys move between them). */
import type { ReactNode } from 'react';
import { useGapUnit } from './units.js';

export function UnitToggle(): ReactNode {
  const [unit, setUnit] = useGapUnit();
  return (
    <fieldset className="unit-toggle">
      <legend>Gaps in</legend>
      <label>
        <input type="radio" name="gap-unit" value="mm" checked={unit === 'mm'} onChange={() => setUnit('mm')} /> mm
      </label>
      <label>
        <input type="radio" name="gap-unit" value="in" checked={unit === 'in'} onChange={() => setUnit('in')} /> inch
      </label>
    </fieldset>
  );
}
