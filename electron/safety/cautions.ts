/**
 * The cautions shown with every report or checklist that tells someone to work on the ignition.
 * They are common workshop practice, written in our own words; they defer to the vehicle's
 * service data, local codes and licensed practice, which always win over anything this app says.
 */
export type Caution = { id: string; text: string };

export const ignitionCautions: readonly Caution[] = [
  {
    id: 'battery-off',
    text: 'Disconnect the battery earth lead before changing any ignition wiring, and reconnect it last.',
  },
  {
    id: 'high-voltage',
    text: 'The coil and HT leads carry tens of kilovolts when the engine turns or the ignition is switched on: never hold a lead, plug or coil tower while cranking or running, and keep clear if you have a heart pacemaker or other implant.',
  },
  {
    id: 'stored-charge',
    text: 'A capacitive-discharge module stores several hundred volts in its capacitor and can hold it after switch-off: wait for it to discharge as its instructions say before touching its terminals.',
  },
  {
    id: 'fuel-and-fire',
    text: 'A spark tested in the open can ignite fuel vapour: earth a test plug firmly away from the carburettor and fuel lines, have a fire extinguisher to hand, and never test with a fuel leak present.',
  },
  {
    id: 'key-on-heat',
    text: 'Do not leave the ignition switched on with the engine stopped for long: with the points closed or a module without stall shut-off, the coil and ballast heat up and can burn out.',
  },
  {
    id: 'fuse-the-feed',
    text: 'Fuse any new feed you add close to its source, sized to the wire, and route wires away from the exhaust and moving parts.',
  },
  {
    id: 'defer',
    text: "This app's figures are planning estimates. The vehicle's service data, the module maker's instructions, local regulations and licensed practice take precedence; if in doubt, have the work checked by a qualified auto electrician.",
  },
];
