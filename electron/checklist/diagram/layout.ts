/**
 * The fixed grid the diagram is laid out on (coordinate box 1000 x 620, about an A4 or Letter
 * page width). Every part has its own slot, so the drawing of a plan is always the same and
 * parts never overlap; wires run in lanes between the slots.
 *
 *   battery  switch   [tach in feed]   ballast        coil ------------- 4 -> cap
 *   earth    starter solenoid ------ bypass lane ----> 15 (from below)   |
 *                                                       1 (below)        distributor -> plugs
 *   condenser  points/pickup   module                 tach adaptor / tach
 */
import type { Box } from './geometry.js';

export const WIDTH = 1000;
export const HEIGHT = 620;

export const SLOT = {
  battery: { x: 30, y: 30, width: 120, height: 100 },
  batteryEarth: { x: 70, y: 170, width: 40, height: 24 },
  ignitionSwitch: { x: 200, y: 35, width: 100, height: 50 },
  solenoid: { x: 160, y: 150, width: 120, height: 50 },
  feedTach: { x: 360, y: 35, width: 100, height: 50 },
  ballast: { x: 520, y: 35, width: 100, height: 50 },
  coil: { x: 700, y: 110, width: 120, height: 120 },
  module: { x: 440, y: 300, width: 180, height: 120 },
  moduleEarth: { x: 450, y: 456, width: 40, height: 24 },
  trigger: { x: 220, y: 440, width: 120, height: 60 },
  triggerEarth: { x: 260, y: 536, width: 40, height: 24 },
  condenser: { x: 40, y: 440, width: 100, height: 60 },
  condenserEarth: { x: 70, y: 536, width: 40, height: 24 },
  tachUpper: { x: 690, y: 490, width: 120, height: 45 },
  tachLower: { x: 690, y: 560, width: 120, height: 45 },
} as const satisfies Record<string, Box>;

/** Lanes wires run in (x for vertical runs, y for horizontal ones). */
export const LANE = {
  feedY: 60,
  feedDropX: 660,
  bypassY: 175,
  moduleSupplyY: 270,
  triggerX: 400,
  pointsY: 470,
  tachRiseY: 420,
  tachOuterX: 835,
  tachToModuleY: 445,
  tachToModuleX: 645,
  coilHtY: 150,
  capCentreX: 875,
} as const;

/** The distributor and the plugs: one row per cylinder, top to bottom in firing order. */
export function distributorRows(cylinders: number): { box: Box; rowY: number[]; plugHeight: number; plugX: number; plugWidth: number } {
  const top = 300;
  const spacing = Math.min(40, Math.floor(290 / cylinders));
  const box: Box = { x: 845, y: top, width: 60, height: spacing * cylinders };
  const rowY = Array.from({ length: cylinders }, (_, i) => top + spacing * (i + 0.5));
  return { box, rowY, plugHeight: Math.max(8, Math.min(28, spacing - 8)), plugX: 935, plugWidth: 60 };
}
