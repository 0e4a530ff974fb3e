/**
 * The editor's groups, one set per kind. Every field of the kind's schema is here, labelled with
 * the unit it is typed in; the module's dwell and CD fields appear only for the type that has them.
 */
import { useContext, type ReactNode } from 'react';
import { CheckField, FieldErrorsContext, fieldId, NotesField, SelectField, TextField } from '../../app/fields.js';
import { gapFromText } from '../../app/gaps.js';
import { Group } from '../../app/Group.js';
import { unitLabel, type GapUnit } from '../../app/units.js';
import type { PartForm } from './form-model.js';
import { ballastTypeChoices, coreChoices, kindChoices, moduleTypeChoices, ratedVoltageChoices, sensesChoices } from './labels.js';
import { NoticeMark } from '../../app/Notice.js';

export type Update = (fn: (f: PartForm) => PartForm) => void;
type Props = { form: PartForm; update: Update; unit: GapUnit };

/** Sets one field of one kind's group: `patch(update, 'coil', { turnsRatio: '90' })`. */
function patch<K extends 'coil' | 'ballast' | 'module' | 'tach' | 'leads' | 'plug'>(update: Update, kind: K, values: Partial<PartForm[K]>): void {
  update((f) => ({ ...f, [kind]: { ...f[kind], ...values } }));
}

export function IdentitySection({ form, update, kindLocked }: Props & { kindLocked: string | null }): ReactNode {
  return (
    <Group title="Which part" id="g-part" full fieldsClass="part-identity">
      <SelectField
        path="kind"
        label="Kind of part"
        value={form.kind}
        choices={kindChoices}
        onChange={(v) => update((f) => ({ ...f, kind: v }))}
        {...(kindLocked ? { hint: kindLocked } : {})}
      />
      <TextField path="name" label="Name" value={form.name} onChange={(v) => update((f) => ({ ...f, name: v }))} placeholder="What it says on the part, in your words" />
      <TextField path="quantity" label="How many you have" numeric value={form.quantity} onChange={(v) => update((f) => ({ ...f, quantity: v }))} hint="On the shelf or fitted; one module cannot go into two plans you mark as fitted" />
      <NotesField path="notes" label="Notes" value={form.notes} onChange={(v) => update((f) => ({ ...f, notes: v }))} />
    </Group>
  );
}

export function CoilSections({ form, update }: Props): ReactNode {
  const c = form.coil;
  const set = (key: keyof PartForm['coil']) => (v: string) => patch(update, 'coil', { [key]: v });
  return (
    <>
      <Group title="Primary winding" id="g-coil-primary">
        <TextField path="primaryResistanceOhm20C" label="Primary resistance at 20 °C (Ω)" numeric value={c.primaryResistanceOhm20C} onChange={set('primaryResistanceOhm20C')} hint="Read across + and − with the coil cold" />
        <TextField path="primaryInductanceH" label="Primary inductance (mH)" numeric value={c.primaryInductanceH} onChange={set('primaryInductanceH')} hint="Millihenries, e.g. 5.5" />
        <CheckField path="forBallast" label="Made to run behind a ballast resistor" checked={c.forBallast} onChange={(v) => patch(update, 'coil', { forBallast: v })} />
        <SelectField path="ratedVoltageV" label="Rated for" value={c.ratedVoltageV} choices={ratedVoltageChoices} onChange={(v) => patch(update, 'coil', { ratedVoltageV: v })} />
        <TextField path="maxDissipationW" label="Most heat it can shed (W, optional)" numeric value={c.maxDissipationW} onChange={set('maxDissipationW')} hint="Leave blank if not known" />
      </Group>
      <Group title="Secondary winding" id="g-coil-secondary">
        <TextField path="secondaryResistanceOhm" label="Secondary resistance (Ω)" numeric value={c.secondaryResistanceOhm} onChange={set('secondaryResistanceOhm')} hint="Read from + to the HT tower" />
        <TextField path="turnsRatio" label="Turns ratio (to 1)" numeric value={c.turnsRatio} onChange={set('turnsRatio')} hint="Give this or the secondary inductance" />
        <TextField path="secondaryInductanceH" label="Secondary inductance (H, optional)" numeric value={c.secondaryInductanceH} onChange={set('secondaryInductanceH')} hint="Henries; blank if the turns ratio is given" />
        <TextField
          path="ratedSecondaryKv"
          label="Rated secondary voltage (kV, optional)"
          numeric
          value={c.ratedSecondaryKv}
          onChange={set('ratedSecondaryKv')}
          hint="The most the coil's insulation is made for; blank uses the default for its kind (from memory)"
        />
        <TextField
          path="couplingK"
          label="Coupling between the windings (optional, 0.9 to 1)"
          numeric
          value={c.couplingK}
          onChange={set('couplingK')}
          hint="From the maker; it moves a capacitive-discharge spark by up to a quarter. Blank uses the engine's working condition (0.995, from memory)"
        />
      </Group>
    </>
  );
}

export function BallastSections({ form, update }: Props): ReactNode {
  const b = form.ballast;
  return (
    <Group title="Ballast resistor" id="g-ballast" full>
      <SelectField
        path="ballastType"
        label="Made of"
        value={b.ballastType}
        choices={ballastTypeChoices}
        onChange={(v) => patch(update, 'ballast', { ballastType: v })}
        hint="Iron wire gains resistance as it warms; a ceramic block stays nearly constant"
      />
      <TextField path="coldResistanceOhm" label="Cold resistance (Ω)" numeric value={b.coldResistanceOhm} onChange={(v) => patch(update, 'ballast', { coldResistanceOhm: v })} hint="Read at room temperature" />
      <TextField
        path="thermalResistanceKPerW"
        label="Warms by (K per W, optional)"
        numeric
        value={b.thermalResistanceKPerW}
        onChange={(v) => patch(update, 'ballast', { thermalResistanceKPerW: v })}
        hint="Degrees it rises for each watt; blank uses the usual figure"
      />
    </Group>
  );
}

/** Tick boxes for the earth polarities a module works with; at least one is needed. */
function EarthBoxes({ form, update }: Omit<Props, 'unit'>): ReactNode {
  const message = useContext(FieldErrorsContext).message('earthPolarities');
  const m = form.module;
  return (
    <fieldset className={`field earth-boxes${message ? ' has-error' : ''}`} aria-describedby={message ? 'e-earthPolarities' : undefined}>
      <legend>Works with</legend>
      <label>
        <input id={fieldId('earthPolarities')} type="checkbox" checked={m.earthNegative} onChange={(e) => patch(update, 'module', { earthNegative: e.target.checked })} /> Negative earth
      </label>
      <label>
        <input type="checkbox" checked={m.earthPositive} onChange={(e) => patch(update, 'module', { earthPositive: e.target.checked })} /> Positive earth
      </label>
      {message ? (
        <span className="field-error" id="e-earthPolarities" data-testid="error-earthPolarities">
          <NoticeMark kind="problem" />{message}
        </span>
      ) : null}
    </fieldset>
  );
}

export function ModuleSections({ form, update }: Props): ReactNode {
  const m = form.module;
  const t = m.moduleType;
  const set = (key: keyof Omit<PartForm['module'], 'cd'>) => (v: string) => patch(update, 'module', { [key]: v });
  const setCd = (key: keyof PartForm['module']['cd']) => (v: string) => patch(update, 'module', { cd: { ...m.cd, [key]: v } });
  return (
    <>
      <Group title="What it is" id="g-module-kind" full>
        <SelectField path="moduleType" label="Type of module" value={t} choices={moduleTypeChoices} onChange={(v) => patch(update, 'module', { moduleType: v })} />
        <EarthBoxes form={form} update={update} />
        <CheckField path="stallShutOff" label="Switches the coil off when the engine stalls" checked={m.stallShutOff} onChange={(v) => patch(update, 'module', { stallShutOff: v })} />
        <CheckField path="tachOutput" label="Has a tach output terminal" checked={m.tachOutput} onChange={(v) => patch(update, 'module', { tachOutput: v })} />
        <CheckField path="needsSuppressedLeads" label="Needs suppressed HT leads" checked={m.needsSuppressedLeads} onChange={(v) => patch(update, 'module', { needsSuppressedLeads: v })} />
      </Group>
      <Group title="Supply and switch" id="g-module-supply" full>
        <TextField path="supplyMinV" label="Works from (V)" numeric value={m.supplyMinV} onChange={set('supplyMinV')} hint="Lowest supply it keeps firing on" />
        <TextField path="supplyMaxV" label="Works up to (V)" numeric value={m.supplyMaxV} onChange={set('supplyMaxV')} />
        <TextField path="minCoilResistanceOhm" label="Smallest coil resistance (Ω)" numeric value={m.minCoilResistanceOhm} onChange={set('minCoilResistanceOhm')} hint="Including any ballast" />
        <TextField path="maxCurrentA" label="Maximum switched current (A)" numeric value={m.maxCurrentA} onChange={set('maxCurrentA')} />
        <TextField path="switchSaturationV" label="Voltage lost across the switch (V)" numeric value={m.switchSaturationV} onChange={set('switchSaturationV')} hint="Often 1 to 2 V" />
        <TextField path="primaryClampV" label="Primary clamp (V, optional)" numeric value={m.primaryClampV} onChange={set('primaryClampV')} hint="Leave blank if not known" />
        <TextField path="maxSparkRateHz" label="Maximum spark rate (sparks a second)" numeric value={m.maxSparkRateHz} onChange={set('maxSparkRateHz')} />
      </Group>
      {t === 'breakerless-fixed-duty' ? (
        <Group title="Dwell" id="g-module-dwell" full>
          <TextField path="fixedDutyFraction" label="Fixed duty (% of each firing period)" numeric value={m.fixedDutyFraction} onChange={set('fixedDutyFraction')} hint="The share of the time the coil is switched on, e.g. 60" />
        </Group>
      ) : null}
      {t === 'breakerless-current-limited' ? (
        <Group title="Dwell and current limit" id="g-module-dwell" full>
          <TextField path="currentLimitA" label="Current limit (A)" numeric value={m.currentLimitA} onChange={set('currentLimitA')} hint="Where it holds the coil current" />
          <TextField path="maxDutyFraction" label="Maximum duty (% of each firing period)" numeric value={m.maxDutyFraction} onChange={set('maxDutyFraction')} hint="The most it stretches the dwell, e.g. 75" />
        </Group>
      ) : null}
      {t === 'transistor-points' ? <p className="quiet part-note">The points still set the dwell, so there is no duty or current limit to enter.</p> : null}
      {t === 'capacitive-discharge' ? (
        <Group title="Capacitive-discharge stage" id="g-module-cd" full>
          <TextField path="cd.capacitorUf" label="Capacitor (µF)" numeric value={m.cd.capacitorUf} onChange={setCd('capacitorUf')} hint="Microfarads, e.g. 1" />
          <TextField path="cd.chargeVoltageV" label="Charged to (V)" numeric value={m.cd.chargeVoltageV} onChange={setCd('chargeVoltageV')} hint="e.g. 400" />
          <TextField path="cd.chargerPowerW" label="Charger power (W)" numeric value={m.cd.chargerPowerW} onChange={setCd('chargerPowerW')} />
          <TextField path="cd.multiSparkBelowRpm" label="Several sparks below (rpm, optional)" numeric value={m.cd.multiSparkBelowRpm} onChange={setCd('multiSparkBelowRpm')} hint="Blank if it fires one spark" />
        </Group>
      ) : null}
    </>
  );
}

/** What each way of sensing means at the car, so the choice can be made from the wiring. */
const sensesHints: Record<PartForm['tach']['senses'], string> = {
  'coil-supply-current': 'The coil feed wire loops through the instrument',
  'coil-negative-pulses': 'One thin wire to the coil negative terminal',
  'module-output': 'Wired to a tach terminal on the module',
  cable: 'Driven mechanically; no electrical connection',
};

export function TachSections({ form, update }: Props): ReactNode {
  return (
    <Group title="Rev counter" id="g-tach" full>
      <SelectField
        path="senses"
        label="Reads the engine speed from"
        value={form.tach.senses}
        choices={sensesChoices}
        onChange={(v) => patch(update, 'tach', { senses: v })}
        hint={sensesHints[form.tach.senses]}
      />
    </Group>
  );
}

export function LeadsSections({ form, update }: Props): ReactNode {
  const l = form.leads;
  return (
    <Group title="HT leads" id="g-leads" full>
      <SelectField path="core" label="Core" value={l.core} choices={coreChoices} onChange={(v) => patch(update, 'leads', { core: v })} hint="Carbon and spiral cores suppress radio interference" />
      <TextField path="resistancePerLeadOhm" label="Resistance per lead (Ω)" numeric value={l.resistancePerLeadOhm} onChange={(v) => patch(update, 'leads', { resistancePerLeadOhm: v })} hint="End to end, e.g. 12000 for carbon" />
    </Group>
  );
}

export function PlugSections({ form, update, unit }: Props): ReactNode {
  const p = form.plug;
  return (
    <Group title="Spark plug" id="g-plug" full>
      <CheckField path="resistor" label="Has a built-in suppression resistor" checked={p.resistor} onChange={(v) => patch(update, 'plug', { resistor: v })} />
      {p.resistor ? <TextField path="resistorOhm" label="Resistor (Ω)" numeric value={p.resistorOhm} onChange={(v) => patch(update, 'plug', { resistorOhm: v })} hint="e.g. 5000" /> : null}
      <TextField path="gapMinMm" label={`Smallest gap (${unitLabel(unit)})`} numeric value={p.gapMin.text} onChange={(v) => patch(update, 'plug', { gapMin: gapFromText(v, unit) })} />
      <TextField path="gapMaxMm" label={`Largest gap (${unitLabel(unit)})`} numeric value={p.gapMax.text} onChange={(v) => patch(update, 'plug', { gapMax: gapFromText(v, unit) })} />
    </Group>
  );
}
