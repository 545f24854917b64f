import { parallel } from './parallel';

/**
 * Small-signal formulas of the common-cathode triode stage and the cathode
 * follower, from the tube's equivalent circuit (a voltage source −mu·vgk in
 * series with rp). Source: F. Langford-Smith (ed.), Radiotron Designer's
 * Handbook, 4th ed., 1953, ch. 12 (resistance-capacitance coupled triodes)
 * and ch. 2 (cathode follower); the same results in M. Jones, Valve
 * Amplifiers, 4th ed., 2012, ch. 3.
 */

/** Common-cathode voltage gain, plate to grid, signed (negative: inverting). rLoad = Ra ∥ RL. */
export function commonCathodeGain(mu: number, rp: number, rLoad: number, rk: number, bypassed: boolean): number {
  const degeneration = bypassed ? 0 : (mu + 1) * rk;
  return (-mu * rLoad) / (rp + rLoad + degeneration);
}

/** Output impedance at the plate, RL excluded: Ra ∥ rp, or Ra ∥ (rp + (mu+1)·Rk) unbypassed. */
export function commonCathodeZout(mu: number, rp: number, ra: number, rk: number, bypassed: boolean): number {
  return parallel(ra, rp + (bypassed ? 0 : (mu + 1) * rk));
}

/**
 * Cathode voltage over grid voltage of an unbypassed stage (the part of vg
 * that Cgk does not see): the plate current mu·vg/(rp + RL + (mu+1)·Rk)
 * through Rk, as a cathode follower's gain (Langford-Smith, RDH4 ch. 12).
 */
export function cathodeFollowing(mu: number, rp: number, rLoad: number, rk: number): number {
  return (mu * rk) / (rp + rLoad + (mu + 1) * rk);
}

/**
 * Input capacitance by the Miller effect (J. M. Miller, "Dependence of the
 * input impedance of a three-electrode vacuum tube upon the load in the plate
 * circuit", Bureau of Standards Scientific Papers 15, no. 351, 1920):
 * Cin = Cgp·(1 − A) + Cgk·(1 − Ak), A the grid-to-plate gain (negative), Ak
 * the grid-to-cathode gain (0 when Rk is bypassed).
 */
export function millerInputCapacitance(cgk: number, cgp: number, gain: number, cathodeGain: number): number {
  return cgp * (1 - gain) + cgk * (1 - cathodeGain);
}

/** Cathode-follower gain, cathode to grid: mu·R / (rp + (mu+1)·R), R = Rk ∥ RL. */
export function followerGain(mu: number, rp: number, rLoad: number): number {
  return (mu * rLoad) / (rp + (mu + 1) * rLoad);
}

/** Cathode-follower output impedance: Rk ∥ rp/(mu+1), close to 1/gm for large mu. */
export function followerZout(mu: number, rp: number, rk: number): number {
  return parallel(rk, rp / (mu + 1));
}
