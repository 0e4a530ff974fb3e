/**
 * The engine's working conditions: every condition the checker's report lists, in its groups,
 * one box each in the unit a workshop uses (kPa, pF, ms ...). A blank box means the checker's
 * default, shown beside it with where it comes from; a typed value is this engine's own and says
 * so, with the default it replaces. Supply voltages measured on a plan's wiring sheet win over
 * both when that plan is weighed. The list, units and ranges come from db/conditions.ts.
 */
import { useContext, useEffect, useState, type ReactNode } from 'react';
import { conditionDescriptors, conditionGroupTitles, type ConditionGroup } from '../../../db/schema.js';
import { FieldErrorsContext, TextField } from '../../app/fields.js';
import { conditionLabel, defaultsContext, provenanceText } from './conditions-text.js';
import type { EngineForm } from './form-model.js';
import type { Update } from './sections-engine.js';

const groups = Object.keys(conditionGroupTitles) as ConditionGroup[];

export function ConditionsSection({ form, update }: { form: EngineForm; update: Update }): ReactNode {
  const ctx = useContext(FieldErrorsContext);
  const setCount = conditionDescriptors.filter((d) => form.conditions[d.key].trim() !== '').length;
  const [open, setOpen] = useState(() => setCount > 0);
  const hasMessage = conditionDescriptors.some((d) => ctx.message(`conditions.${d.key}`) !== undefined);
  // A message inside must never be out of sight: open the panel when one appears.
  useEffect(() => {
    if (hasMessage) setOpen(true);
  }, [hasMessage]);
  const defaults = defaultsContext(form);
  return (
    <details className="group conditions" open={open} onToggle={(e) => setOpen(e.currentTarget.open)} data-testid="conditions-editor">
      <summary>
        Working conditions (optional: a blank box uses the default shown beside it)
        {setCount > 0 ? ` · ${setCount} set for this engine` : ''}
      </summary>
      {groups.map((g) => (
        <div key={g} className="conditions-group" role="group" aria-labelledby={`cg-${g}`}>
          <h3 id={`cg-${g}`}>{conditionGroupTitles[g]}</h3>
          <div className="group-fields">
            {conditionDescriptors
              .filter((d) => d.group === g)
              .map((d) => {
                const typed = form.conditions[d.key];
                const def = d.byDefault(defaults).value;
                return (
                  <TextField
                    key={d.key}
                    path={`conditions.${d.key}`}
                    label={conditionLabel(d)}
                    numeric
                    value={typed}
                    placeholder={String(Number((def / d.perUnit).toPrecision(6)))}
                    hint={provenanceText(d, typed, defaults)}
                    onChange={(v) => update((f) => ({ ...f, conditions: { ...f.conditions, [d.key]: v } }))}
                  />
                );
              })}
          </div>
        </div>
      ))}
    </details>
  );
}
