import { bracketedRoot } from '../numeric/bracketedRoot';

/**
 * The reservoir's DC behind the winding's resistance, a first guess at the
 * supply's steady state: an ideal diode (with a fixed drop) into a
 * reservoir held steady conducts while the winding's instantaneous voltage
 * is above it, from angle a to π − a with sin a = (Vc + Vd) / Vpk, and the
 * average of (Vpk·sin θ − Vc − Vd) / R over each mains cycle must carry the
 * load: I = pulses / (2πR) · [2·Vpk·cos a − (Vc + Vd)(π − 2a)] (the
 * conduction-angle integral, worked here). A stiff winding gives the peak
 * less the drop; one behind tens of kilohms (a bias tap fed through a
 * dropping resistor) sits far below it, where a guess at the peak leaves
 * shooting too far out to converge.
 */
export function reservoirGuess(peak: number, diodeDrop: number, ohms: number, load: number, pulsesPerCycle: 1 | 2): number {
  const top = Math.max(peak - diodeDrop, 0);
  if (!(ohms > 0) || !(load > 0) || !(top > 0)) return top;
  const averageCurrent = (vc: number): number => {
    const a = Math.asin(Math.min((vc + diodeDrop) / peak, 1));
    return (pulsesPerCycle / (2 * Math.PI * ohms)) * (2 * peak * Math.cos(a) - (vc + diodeDrop) * (Math.PI - 2 * a));
  };
  // The current falls as the reservoir rises, to none at the top; a winding that cannot carry the load even into 0 V gives 0.
  if (averageCurrent(0) <= load) return 0;
  return bracketedRoot((vc) => averageCurrent(vc) - load, 0, top, 1e-9 * top).x;
}
