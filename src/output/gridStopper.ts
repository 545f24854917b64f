import { millerInputCapacitance } from '../splitter/solveSplitter';
import { parallel } from '../stage/parallel';
import type { Capacitances } from '../tube/types';

/**
 * The resistor at an output tube's grid pin, Ω: it damps the parasitic
 * oscillation a power tube's grid wiring can start at tens of megahertz
 * (common practice: 1 kΩ to 10 kΩ; 1 kΩ for output tubes, from memory).
 */
export const OUTPUT_GRID_STOPPER = 1e3;

/** Above this the stopper's corner is far enough over the audio band (a decade past 20 kHz) to leave out of the figures (our threshold). */
export const STOPPER_CORNER_CLEAR_HZ = 200e3;

export interface GridStopper {
  readonly ohms: number;
  /** The grid's input capacitance with the Miller effect, F. */
  readonly inputCapacitance: number;
  /** The stopper with that capacitance: a first-order corner, Hz. */
  readonly cornerHz: number;
}

/**
 * The stopper's low-pass corner with the grid's input capacitance by the
 * Miller effect (millerInputCapacitance: Cgk + Cgp·(1 + A), A = gm·(rp ∥
 * Zload), the plate's gain into its load), f = 1/(2π·R·Cin). With the source
 * before it the grid sees more resistance still; the corner here is the
 * stopper's own, an upper bound on what it alone takes away.
 */
export function gridStopperFor(caps: Capacitances, gm: number, rp: number, zLoad: number, ohms = OUTPUT_GRID_STOPPER): GridStopper {
  const load = parallel(rp, zLoad);
  const gain = Number.isFinite(gm) && gm > 0 && Number.isFinite(load) && load > 0 ? gm * load : 0;
  const cin = millerInputCapacitance(caps, gain);
  const cornerHz = cin > 0 && ohms > 0 ? 1 / (2 * Math.PI * ohms * cin) : Number.MAX_VALUE;
  return { ohms, inputCapacitance: cin, cornerHz: Number.isFinite(cornerHz) ? cornerHz : Number.MAX_VALUE };
}
