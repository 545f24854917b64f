import type { TriodeModel } from './types';

/**
 * Where grid current begins, V to the cathode. A grid collects electrons
 * before it reaches the cathode's potential: the contact potential between
 * grid and cathode surfaces and the electrons' emission velocities let them
 * land against a small retarding field (K. R. Spangenberg, *Vacuum Tubes*,
 * McGraw-Hill 1948, on grid current and contact potential). About −0.5 to
 * −1 V is common practice; −0.7 V is taken for every tube here.
 */
export const GRID_CURRENT_ONSET = -0.7;

/**
 * kT/e of an oxide cathode at about 1,100 K, V: the width of the retarding-field
 * tail below the onset (the Maxwell–Boltzmann energy spread of the emitted
 * electrons; I. Langmuir, Phys. Rev. 21, 419, 1923). 1,100 K is an oxide
 * cathode's usual working temperature (from memory).
 */
export const CATHODE_THERMAL_VOLTS = 0.095;

/** ln(1 + eˣ), without overflow. */
function softplus(x: number): number {
  return x > 30 ? x + Math.log1p(Math.exp(-x)) : Math.log1p(Math.exp(x));
}

/**
 * Grid current, A, at grid–cathode voltage vgk:
 *
 *   Ig = (Vt · ln(1 + exp((Vgk − Von)/Vt)))^1.5 / Rgrid
 *
 * Above the onset Von it is the Child–Langmuir 3/2-power law (Child 1911,
 * Langmuir 1913) measured from the onset, with the tube's constant: 1 V past
 * the onset draws 1 V / Rgrid (Koren's table gives Rgrid of 2 kΩ for
 * small-signal triodes, 1 kΩ for power triodes). Below it the softplus turns
 * into Langmuir's exponential retarding-field tail, exp(1.5(Vgk − Von)/Vt):
 * for a 12AX7 0.17 µA at −1 V, where data sheets specify the grid-current
 * start as at most 0.3 µA at −1 V (ECC83, from memory). Smooth and rising
 * everywhere, so a grid loop has exactly one solution. Never NaN: 0 for
 * input that is not a number.
 */
export function gridCurrent(model: TriodeModel, vgk: number): number {
  if (typeof model !== 'object' || model === null || !(model.gridResistance > 0) || !Number.isFinite(vgk)) return 0;
  const s = CATHODE_THERMAL_VOLTS * softplus((vgk - GRID_CURRENT_ONSET) / CATHODE_THERMAL_VOLTS);
  const ig = (s * Math.sqrt(s)) / model.gridResistance;
  return Number.isFinite(ig) ? ig : 0;
}

/** Grid voltages this far below the onset draw less than 1e-8 of the current 1 V past it: the grid loop is skipped there. */
export const GRID_LOOP_FLOOR = GRID_CURRENT_ONSET - 20 * CATHODE_THERMAL_VOLTS;

/**
 * An output tube's grid current, A: the Child–Langmuir 3/2-power law from
 * 0 V, with no retarding tail. Data sheets rate an output stage's class A1
 * figures with the grid driven to 0 V and take it to draw no current up to
 * there; starting the law at 0 V keeps every figure up to that limit as they
 * define it, while a stage driven past it is held back by its driver as a
 * real one is. 0 for input that is not a number.
 */
export function classA1GridCurrent(gridResistance: number, vgk: number): number {
  if (!(gridResistance > 0) || !(vgk > 0) || !Number.isFinite(vgk)) return 0;
  return (vgk * Math.sqrt(vgk)) / gridResistance;
}

/**
 * Rgrid for an output pentode or beam tetrode, Ω: the power triodes' 1 kΩ of
 * Koren's table (from memory; no pentode grid-current data is held here).
 */
export const POWER_GRID_RESISTANCE = 1000;

/** Half the step of gridSlope's central difference, V: far below the tail's thermal volt, far above rounding. */
const SLOPE_STEP = 1e-4;

/**
 * The grid current's slope at vgk, S: the grid's small-signal input
 * conductance at its bias (a few microsiemens at −1 V for a high-mu triode,
 * on the retarding-field tail). Never NaN: 0 for input that is not a number.
 */
export function gridSlope(law: (vgk: number) => number, vgk: number): number {
  const g = (law(vgk + SLOPE_STEP) - law(vgk - SLOPE_STEP)) / (2 * SLOPE_STEP);
  return Number.isFinite(g) && g > 0 ? g : 0;
}

/** Below this, S (a teraohm: more than the leakage of any board or socket, common practice), a grid's slope is left out. */
export const MIN_GRID_CONDUCTANCE = 1e-12;
