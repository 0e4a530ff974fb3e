/**
 * Key on, engine stopped. Points can come to rest closed, and a module without a stall shut-off may
 * hold the coil switched on; then the coil carries its full steady current for as long as the key
 * is on. We take the moment of switch-on (cold coil, the highest current) on the running supply
 * (the worst case: a battery just off charge), and the ballast at its self-heated equilibrium
 * (it warms within seconds).
 */
import { kelvin } from './conditions.js';
import { finalCurrentA } from './primary.js';
import { ironBallastResistanceOhm, selfHeatedTemperatureK } from './thermal.js';
import type { PreparedSetup } from './prepare.js';
import type { KeyOnReport, ResolvedConditions } from './types.js';

export function keyOnReport(p: PreparedSetup, c: ResolvedConditions): KeyOnReport {
  const spec = p.spec;
  const m = spec.module;
  let flows: boolean;
  switch (p.kind) {
    case 'points':
    case 'transistor-points':
      flows = true;
      break;
    case 'breakerless-fixed-duty':
    case 'breakerless-current-limited':
      flows = m ? !m.stallShutOff : true;
      break;
    default:
      // A magneto has no battery; a CD module does not pass current through the coil at rest.
      flows = false;
  }
  if (!flows) return { currentFlows: false, currentA: 0, coilDissipationW: 0, moduleDissipationW: 0, ballastDissipationW: 0 };
  const v = p.runningSupplyV;
  const rest = p.coilColdOhm + p.harnessOhm + p.contactOhm;
  const b = spec.ballast;
  let rb = 0;
  if (b) {
    if (b.ballastType === 'iron-wire') {
      const theta = b.thermalResistanceKPerW ?? c.ballastThermalResistanceKPerW.value;
      const t = selfHeatedTemperatureK(kelvin(c.underBonnetC.value), Math.max(0, theta), (tK) => {
        const r = ironBallastResistanceOhm(p.ballastColdOhm, tK);
        const i = finalCurrentA(v, p.switchDropV, rest + r);
        return i * i * r;
      });
      rb = ironBallastResistanceOhm(p.ballastColdOhm, t);
    } else {
      rb = p.ballastColdOhm;
    }
  }
  const total = rest + rb;
  let i = finalCurrentA(v, p.switchDropV, total);
  let moduleW = i * p.switchDropV;
  if (i > p.limitA) {
    // The module holds its limit and burns the difference itself.
    moduleW = p.limitA * Math.max(0, v - p.limitA * total);
    i = p.limitA;
  }
  return {
    currentFlows: true,
    currentA: i,
    coilDissipationW: i * i * p.coilColdOhm,
    ballastDissipationW: i * i * rb,
    moduleDissipationW: moduleW,
  };
}
