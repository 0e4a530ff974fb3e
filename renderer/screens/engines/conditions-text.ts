/**
 * The words beside each working-condition box in the engine editor: its label with the unit, the
 * context the defaults depend on (system voltage, air temperature typed), and where its value
 * comes from (the default with its label, this engine's own value, a measured reading).
 */
import { conditionByKey, conditionText, type ConditionContext, type ConditionDescriptor } from '../../../db/schema.js';
import { parseOptionalNumberText } from '../../app/numbers.js';
import type { EngineForm } from './form-model.js';

/** What the defaults depend on, read from the form: its system voltage and the air temperature typed (20 °C when blank or unreadable). */
export function defaultsContext(form: EngineForm): ConditionContext {
  const amb = conditionByKey.ambientC;
  const typed = parseOptionalNumberText(form.conditions.ambientC, amb.label);
  const ambientC = typed.ok && typed.value !== null && typed.value >= amb.min && typed.value <= amb.max ? typed.value : amb.byDefault({ systemVoltageV: 12, ambientC: 20 }).value;
  return { systemVoltageV: form.systemVoltageV === '6' ? 6 : 12, ambientC };
}

/** The label with its unit, or the plausible range for a plain ratio ("Volumetric efficiency (0.3 to 1.3)"). */
export function conditionLabel(d: ConditionDescriptor): string {
  return d.unit ? `${d.label} (${d.unit})` : `${d.label} (${d.min} to ${d.max})`;
}

/** The sentence beside a box: where its value comes from now, and the default it stands for or replaces. */
export function provenanceText(d: ConditionDescriptor, typed: string, ctx: ConditionContext): string {
  const def = d.byDefault(ctx);
  const defaultWords = `${conditionText(d, def.value)}, ${def.source}`;
  const own = typed.trim() !== '';
  const parts = [own ? `Set for this engine (engine override); blank gives ${defaultWords}.` : `Blank: ${defaultWords}.`];
  if (d.measurable) parts.push('A reading taken on a plan’s wiring sheet wins when that plan is weighed (measured).');
  if (d.usedWhen) parts.push(d.usedWhen);
  return parts.join(' ');
}
