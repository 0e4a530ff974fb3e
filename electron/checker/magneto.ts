/**
 * Magneto break current against rpm. The armature is a generator whose EMF rises in proportion to
 * speed while its impedance R + j w L also rises, so the current climbs and then levels off:
 * i ~ x / sqrt(1 + x^2), x = w L / R. We scale x so that 3 x (L/R) at the full-output rpm gives the
 * rated current (95 % of the plateau), hence weak when kicked or cranked (our model).
 */
const X_FULL = 3;
const SHAPE_FULL = X_FULL / Math.sqrt(1 + X_FULL * X_FULL);

export function magnetoBreakCurrentA(rpm: number, ratedCurrentA: number, fullOutputRpm: number): number {
  if (!(rpm > 0) || !(fullOutputRpm > 0) || !(ratedCurrentA > 0)) return 0;
  const x = (X_FULL * rpm) / fullOutputRpm;
  const shape = x / Math.sqrt(1 + x * x);
  return Math.min((ratedCurrentA * shape) / SHAPE_FULL, ratedCurrentA * 1.05);
}
