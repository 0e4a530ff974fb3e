/**
 * The parts list as CSV, one kind per file: the columns of each kind, in order, with the unit in
 * the header. A typed value is the stored one times `factor` (primary inductance typed in mH is
 * stored in H, duty typed in % is stored as a fraction). `label` is how a message names the column.
 */
import type { PartKind } from '../schema.js';

export type ColumnType = 'text' | 'number' | 'number-or-blank' | 'yes-no' | 'choice' | 'list';
export type Column = {
  /** The field in the part (a dotted path for the CD stage: `cd.capacitorUf`). */
  key: string;
  header: string;
  label: string;
  type: ColumnType;
  factor?: number;
  choices?: readonly string[];
  /** The column may be left out of the file altogether (a field added after the format). */
  optional?: boolean;
};

const name: Column = { key: 'name', header: 'name', label: 'name', type: 'text' };
const notes: Column = { key: 'notes', header: 'notes', label: 'notes', type: 'text' };
/** How many are on the shelf (added with store version 5): a file without the column, or a blank, means one. */
const quantity: Column = { key: 'quantity', header: 'how many', label: 'how many you have', type: 'number-or-blank', optional: true };

export const csvColumns: Record<PartKind, readonly Column[]> = {
  coil: [
    name,
    notes,
    { key: 'primaryResistanceOhm20C', header: 'primary resistance at 20 C (ohm)', label: 'primary resistance', type: 'number' },
    { key: 'primaryInductanceH', header: 'primary inductance (mH)', label: 'primary inductance', type: 'number', factor: 1000 },
    { key: 'secondaryResistanceOhm', header: 'secondary resistance (ohm)', label: 'secondary resistance', type: 'number' },
    { key: 'turnsRatio', header: 'turns ratio (secondary to primary)', label: 'turns ratio', type: 'number-or-blank' },
    { key: 'secondaryInductanceH', header: 'secondary inductance (H)', label: 'secondary inductance', type: 'number-or-blank' },
    { key: 'forBallast', header: 'for use with a ballast (yes/no)', label: 'for use with a ballast', type: 'yes-no' },
    { key: 'ratedVoltageV', header: 'rated voltage (V)', label: 'rated voltage', type: 'number' },
    { key: 'maxDissipationW', header: 'maximum dissipation (W)', label: 'maximum dissipation', type: 'number-or-blank' },
    { key: 'ratedSecondaryKv', header: 'rated secondary voltage (kV)', label: 'rated secondary voltage', type: 'number-or-blank', optional: true },
    quantity,
  ],
  ballast: [
    name,
    notes,
    { key: 'ballastType', header: 'ballast type', label: 'ballast type', type: 'choice', choices: ['iron-wire', 'ceramic', 'harness-wire'] },
    { key: 'coldResistanceOhm', header: 'cold resistance (ohm)', label: 'cold resistance', type: 'number' },
    { key: 'thermalResistanceKPerW', header: 'thermal resistance (K/W)', label: 'thermal resistance', type: 'number-or-blank' },
    quantity,
  ],
  module: [
    name,
    notes,
    {
      key: 'moduleType',
      header: 'module type',
      label: 'module type',
      type: 'choice',
      choices: ['transistor-points', 'breakerless-fixed-duty', 'breakerless-current-limited', 'capacitive-discharge'],
    },
    { key: 'supplyMinV', header: 'minimum supply (V)', label: 'minimum supply', type: 'number' },
    { key: 'supplyMaxV', header: 'maximum supply (V)', label: 'maximum supply', type: 'number' },
    { key: 'earthPolarities', header: 'earth polarities (negative; positive)', label: 'earth polarities', type: 'list', choices: ['negative', 'positive'] },
    { key: 'minCoilResistanceOhm', header: 'minimum coil resistance (ohm)', label: 'minimum coil resistance', type: 'number' },
    { key: 'maxCurrentA', header: 'maximum current (A)', label: 'maximum current', type: 'number' },
    { key: 'currentLimitA', header: 'current limit (A)', label: 'current limit', type: 'number-or-blank' },
    { key: 'switchSaturationV', header: 'switch saturation (V)', label: 'switch saturation', type: 'number' },
    { key: 'primaryClampV', header: 'primary clamp (V)', label: 'primary clamp', type: 'number-or-blank' },
    { key: 'fixedDutyFraction', header: 'fixed duty (%)', label: 'fixed duty', type: 'number-or-blank', factor: 100 },
    { key: 'maxDutyFraction', header: 'maximum duty (%)', label: 'maximum duty', type: 'number-or-blank', factor: 100 },
    { key: 'stallShutOff', header: 'shuts off when stalled (yes/no)', label: 'shuts off when stalled', type: 'yes-no' },
    { key: 'maxSparkRateHz', header: 'maximum spark rate (Hz)', label: 'maximum spark rate', type: 'number' },
    { key: 'tachOutput', header: 'tach output (yes/no)', label: 'tach output', type: 'yes-no' },
    { key: 'needsSuppressedLeads', header: 'needs suppressed leads (yes/no)', label: 'needs suppressed leads', type: 'yes-no' },
    { key: 'cd.capacitorUf', header: 'CD capacitor (uF)', label: 'CD capacitor', type: 'number-or-blank' },
    { key: 'cd.chargeVoltageV', header: 'CD charge voltage (V)', label: 'CD charge voltage', type: 'number-or-blank' },
    { key: 'cd.chargerPowerW', header: 'CD charger power (W)', label: 'CD charger power', type: 'number-or-blank' },
    { key: 'cd.multiSparkBelowRpm', header: 'CD multi-spark below (rpm)', label: 'CD multi-spark below', type: 'number-or-blank' },
    quantity,
  ],
  tach: [name, notes, { key: 'senses', header: 'senses', label: 'senses', type: 'choice', choices: ['coil-supply-current', 'coil-negative-pulses', 'module-output', 'cable'] }, quantity],
  leads: [
    name,
    notes,
    { key: 'core', header: 'core', label: 'core', type: 'choice', choices: ['copper', 'carbon', 'spiral'] },
    { key: 'resistancePerLeadOhm', header: 'resistance per lead (ohm)', label: 'resistance per lead', type: 'number' },
    quantity,
  ],
  plug: [
    name,
    notes,
    { key: 'resistor', header: 'resistor plug (yes/no)', label: 'resistor plug', type: 'yes-no' },
    { key: 'resistorOhm', header: 'resistor (ohm)', label: 'resistor', type: 'number' },
    { key: 'gapMinMm', header: 'smallest gap (mm)', label: 'smallest gap', type: 'number' },
    { key: 'gapMaxMm', header: 'largest gap (mm)', label: 'largest gap', type: 'number' },
    quantity,
  ],
};
