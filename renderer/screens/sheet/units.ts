/** The units the reading entry offers for a step: its own first, then the ones the store converts. */
export type UnitChoice = { value: string; label: string };

const choices: Record<string, UnitChoice[]> = {
  ohm: [
    { value: 'ohm', label: 'Ω (ohm)' },
    { value: 'mohm', label: 'mΩ (milliohm)' },
    { value: 'kohm', label: 'kΩ (kilohm)' },
  ],
  kohm: [
    { value: 'kohm', label: 'kΩ (kilohm)' },
    { value: 'ohm', label: 'Ω (ohm)' },
  ],
  V: [
    { value: 'V', label: 'V' },
    { value: 'mV', label: 'mV' },
  ],
  A: [
    { value: 'A', label: 'A' },
    { value: 'mA', label: 'mA' },
  ],
  mm: [
    { value: 'mm', label: 'mm' },
    { value: 'in', label: 'inch' },
    { value: 'thou', label: 'thou' },
  ],
  deg: [{ value: 'deg', label: '° (degrees)' }],
  rpm: [{ value: 'rpm', label: 'rpm' }],
};

export function unitChoices(unit: string): UnitChoice[] {
  return choices[unit] ?? [{ value: unit, label: unit || 'no unit' }];
}
