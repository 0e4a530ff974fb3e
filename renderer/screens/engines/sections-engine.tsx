/**
 * The engine's own facts, in the groups a workshop manual uses: identity, geometry, speeds,
 * electrics and the contact-breaker settings.
 */
import type { ReactNode } from 'react';
import { NotesField, SelectField, TextField } from '../../app/fields.js';
import { gapFromText } from '../../app/gaps.js';
import { Group } from '../../app/Group.js';
import { unitLabel, type GapUnit } from '../../app/units.js';
import type { EngineForm } from './form-model.js';
import { chargingChoices, cycleChoices, earthChoices, voltageChoices } from './labels.js';

export type Update = (fn: (f: EngineForm) => EngineForm) => void;
type SectionProps = { form: EngineForm; update: Update; unit: GapUnit };

type TopKey = { [K in keyof EngineForm]: EngineForm[K] extends string ? K : never }[keyof EngineForm];
const setter = (update: Update, key: TopKey) => (v: string) => update((f) => ({ ...f, [key]: v }));

export function IdentitySection({ form, update }: SectionProps): ReactNode {
  return (
    <Group title="Which engine" id="g-identity" full fieldsClass="identity-fields">
      <TextField path="name" label="Name" value={form.name} onChange={setter(update, 'name')} placeholder="What you call it in the workshop" />
      <TextField path="yearText" label="Year" value={form.yearText} onChange={setter(update, 'yearText')} placeholder="e.g. 1962" />
      <TextField path="modelText" label="Model or engine type" value={form.modelText} onChange={setter(update, 'modelText')} />
      <NotesField path="notes" label="Notes" value={form.notes} onChange={setter(update, 'notes')} />
    </Group>
  );
}

export function GeometrySection({ form, update }: SectionProps): ReactNode {
  return (
    <Group title="Geometry" id="g-geometry" full>
      <TextField path="cylinders" label="Cylinders" numeric value={form.cylinders} onChange={setter(update, 'cylinders')} />
      <SelectField path="cycle" label="Cycle" value={form.cycle} choices={cycleChoices} onChange={(v) => update((f) => ({ ...f, cycle: v }))} />
      <TextField path="firingOrder" label="Firing order" value={form.firingOrder} onChange={setter(update, 'firingOrder')} hint="e.g. 1-3-4-2" />
      <TextField path="boreMm" label="Bore (mm)" numeric value={form.boreMm} onChange={setter(update, 'boreMm')} />
      <TextField path="strokeMm" label="Stroke (mm)" numeric value={form.strokeMm} onChange={setter(update, 'strokeMm')} />
      <TextField path="conRodMm" label="Connecting rod, centre to centre (mm)" numeric value={form.conRodMm} onChange={setter(update, 'conRodMm')} />
      <TextField path="compressionRatio" label="Compression ratio (to 1)" numeric value={form.compressionRatio} onChange={setter(update, 'compressionRatio')} hint="e.g. 8.5" />
    </Group>
  );
}

export function SpeedsSection({ form, update }: SectionProps): ReactNode {
  return (
    <Group title="Speeds" id="g-speeds">
      <TextField path="crankingRpm" label="Cranking speed (rpm)" numeric value={form.crankingRpm} onChange={setter(update, 'crankingRpm')} />
      <TextField path="idleRpm" label="Idle speed (rpm)" numeric value={form.idleRpm} onChange={setter(update, 'idleRpm')} />
      <TextField path="redlineRpm" label="Redline (rpm)" numeric value={form.redlineRpm} onChange={setter(update, 'redlineRpm')} />
    </Group>
  );
}

export function ElectricsSection({ form, update }: SectionProps): ReactNode {
  return (
    <Group title="Electrics" id="g-electrics">
      <SelectField path="systemVoltageV" label="System voltage" value={form.systemVoltageV} choices={voltageChoices} onChange={(v) => update((f) => ({ ...f, systemVoltageV: v }))} />
      <SelectField path="earthPolarity" label="Earth" value={form.earthPolarity} choices={earthChoices} onChange={(v) => update((f) => ({ ...f, earthPolarity: v }))} />
      <SelectField path="charging" label="Charging" value={form.charging} choices={chargingChoices} onChange={(v) => update((f) => ({ ...f, charging: v }))} />
    </Group>
  );
}

export function PointsSection({ form, update, unit }: SectionProps): ReactNode {
  return (
    <Group title="Points settings" id="g-points" full>
      <TextField path="pointsDwellDeg" label="Dwell angle (distributor degrees)" numeric value={form.pointsDwellDeg} onChange={setter(update, 'pointsDwellDeg')} />
      <TextField
        path="pointsGapMm"
        label={`Points gap (${unitLabel(unit)})`}
        numeric
        value={form.pointsGap.text}
        onChange={(v) => update((f) => ({ ...f, pointsGap: gapFromText(v, unit) }))}
      />
      <TextField path="staticTimingDegBtdc" label="Static timing (degrees before TDC)" numeric value={form.staticTimingDegBtdc} onChange={setter(update, 'staticTimingDegBtdc')} hint="After TDC: type a minus sign" />
      <TextField path="pointsFloatRpm" label="Points start to float at (rpm, optional)" numeric value={form.pointsFloatRpm} onChange={setter(update, 'pointsFloatRpm')} hint="Leave blank if not known" />
    </Group>
  );
}

