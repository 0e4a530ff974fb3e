/** Plain words for the schema's choices, as a restorer would say them. */
export const cycleChoices = [
  { value: 'four-stroke', label: 'Four-stroke' },
  { value: 'two-stroke', label: 'Two-stroke' },
] as const;

export const voltageChoices = [
  { value: '12', label: '12 V' },
  { value: '6', label: '6 V' },
] as const;

export const earthChoices = [
  { value: 'negative', label: 'Negative earth' },
  { value: 'positive', label: 'Positive earth' },
] as const;

export const chargingChoices = [
  { value: 'dynamo', label: 'Dynamo' },
  { value: 'alternator', label: 'Alternator' },
] as const;

export const triggerChoices = [
  { value: 'points', label: 'Points and coil' },
  { value: 'magneto', label: 'Magneto' },
] as const;

export const ballastChoices = [
  { value: 'none', label: 'No ballast' },
  { value: 'discrete', label: 'Separate ballast resistor' },
  { value: 'harness-wire', label: 'Resistive wire in the loom' },
] as const;

/** Short form for the list's Earth column. */
export const earthWords = (e: string): string => (e === 'positive' ? 'Positive' : e === 'negative' ? 'Negative' : e);

/**
 * Which coil terminal goes to the supply side, in the words of the car's earth: on negative earth
 * the terminal marked + (SW, 15) takes the feed, on positive earth the one marked - (CB, 1).
 */
export function coilWiringChoices(earth: 'negative' | 'positive'): ReadonlyArray<{ value: 'as-marked-for-earth' | 'reversed'; label: string }> {
  const marked = earth === 'negative' ? '+ (SW, 15)' : '- (CB, 1)';
  const other = earth === 'negative' ? '- (CB, 1)' : '+ (SW, 15)';
  return [
    { value: 'as-marked-for-earth', label: `As marked for ${earth} earth: ${marked} to the feed` },
    { value: 'reversed', label: `The other way round: ${other} to the feed` },
  ];
}
