/**
 * The ignition the engine has today, which every candidate combination is weighed against. (The
 * working conditions are in sections-conditions.tsx.)
 */
import type { ReactNode } from 'react';
import type { Part, PartKind } from '../../../db/schema.js';
import { CheckField, PartPicker, SelectField, TextField } from '../../app/fields.js';
import { gapFromText } from '../../app/gaps.js';
import { Group } from '../../app/Group.js';
import { unitLabel, type GapUnit } from '../../app/units.js';
import type { EngineForm } from './form-model.js';
import { ballastChoices, coilWiringChoices, triggerChoices } from './labels.js';
import type { Update } from './sections-engine.js';

type Existing = EngineForm['existing'];
type Props = { form: EngineForm; update: Update; unit: GapUnit; parts: Record<PartKind, Part[]> };

const setExisting = (update: Update, patch: Partial<Existing>): void => update((f) => ({ ...f, existing: { ...f.existing, ...patch } }));

export function ExistingSection({ form, update, unit, parts }: Props): ReactNode {
  const x = form.existing;
  const text = (key: keyof Existing) => (v: string) => setExisting(update, { [key]: v } as Partial<Existing>);
  const ballastParts = x.ballast === 'harness-wire' ? parts.ballast.filter((b) => b.kind === 'ballast' && b.ballastType === 'harness-wire') : parts.ballast;
  return (
    <Group title="The ignition fitted now" id="g-existing" full>
      <SelectField path="existing.trigger" label="Fitted ignition" value={x.trigger} choices={triggerChoices} onChange={(v) => setExisting(update, { trigger: v })} />
      <PartPicker path="existing.coilPartId" label="Coil" value={x.coilPartId} parts={parts.coil} onChange={text('coilPartId')} />
      {x.trigger !== 'magneto' ? (
        <SelectField
          path="existing.coilWiring"
          label="Coil terminal on the supply side"
          value={x.coilWiring}
          choices={coilWiringChoices(form.earthPolarity)}
          onChange={(v) => setExisting(update, { coilWiring: v })}
          hint="Wired the other way round, the plug fires the wrong way and needs about 10 % more voltage"
        />
      ) : null}
      <SelectField path="existing.ballast" label="Ballast" value={x.ballast} choices={ballastChoices} onChange={(v) => setExisting(update, { ballast: v })} />
      {x.ballast !== 'none' ? (
        <>
          <PartPicker path="existing.ballastPartId" label="Ballast resistor fitted" value={x.ballastPartId} parts={ballastParts} onChange={text('ballastPartId')} noneLabel="Not chosen" />
          <CheckField
            path="existing.crankingBypass"
            label="Cranking bypass (the starter feeds the coil direct, past the ballast)"
            checked={x.crankingBypass}
            onChange={(v) => setExisting(update, { crankingBypass: v })}
          />
        </>
      ) : null}
      <TextField path="existing.condenserUf" label="Condenser (µF)" numeric value={x.condenserUf} onChange={text('condenserUf')} hint="Leave blank if not known" />
      <PartPicker path="existing.tachPartId" label="Rev counter" value={x.tachPartId} parts={parts.tach} onChange={text('tachPartId')} />
      <PartPicker path="existing.leadsPartId" label="HT leads" value={x.leadsPartId} parts={parts.leads} onChange={text('leadsPartId')} />
      <PartPicker path="existing.plugPartId" label="Spark plugs" value={x.plugPartId} parts={parts.plug} onChange={text('plugPartId')} />
      <TextField
        path="existing.plugGapMm"
        label={`Plug gap (${unitLabel(unit)})`}
        numeric
        value={x.plugGap.text}
        onChange={(v) => setExisting(update, { plugGap: gapFromText(v, unit) })}
      />
      {x.trigger === 'magneto' ? (
        <>
          <TextField path="existing.magnetoRatedCurrentA" label="Magneto break current at full output (A)" numeric value={x.magnetoRatedCurrentA} onChange={text('magnetoRatedCurrentA')} />
          <TextField path="existing.magnetoFullOutputRpm" label="Magneto reaches full output at (rpm)" numeric value={x.magnetoFullOutputRpm} onChange={text('magnetoFullOutputRpm')} />
        </>
      ) : null}
    </Group>
  );
}
