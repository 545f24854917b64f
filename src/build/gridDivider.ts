import { nearestPreferred } from '../parts/nearestPreferred';
import type { PreferredSeries } from '../parts/preferredValues';
import { capacitorForCorner, capacitorLine, resistorLine, type CapacitorLine, type ResistorLine } from './partsList';

/** The lower resistor of a divider that holds a grid, Ω (common practice: a few hundred kΩ, so it wastes little current). */
const DIVIDER_LOWER = 220e3;
/** The divider's decoupling sets its corner this low, Hz (common practice: well under the band, so no signal rides on the grid return). */
const DIVIDER_CORNER_HZ = 2;

/**
 * The divider that holds a capacitor-coupled grid at `vgrid` from its B+,
 * decoupled so no signal rides on the grid's return: the lower resistor a
 * few hundred kΩ, the upper the nearest preferred value for the voltage
 * (Ohm's law), the decoupling capacitor the next E12 value up from its
 * corner's. `refs` names its parts (a splitter's Rd1, Rd2, Cd; stage 3's
 * Rd3a, Rd3b, Cd3); `holds` names what it holds (the heaters, for an
 * elevation divider).
 */
export function gridDivider(refs: { readonly upper: string; readonly lower: string; readonly cap: string }, bplus: number, vgrid: number, series: PreferredSeries, holds = 'the grid'): { resistors: ResistorLine[]; capacitor: CapacitorLine } {
  const upper = nearestPreferred((DIVIDER_LOWER * (bplus - vgrid)) / Math.max(vgrid, 1e-3), series);
  const lower = nearestPreferred(DIVIDER_LOWER, series);
  const dividerAmps = bplus / (upper + lower);
  const shunt = (upper * lower) / (upper + lower);
  return {
    resistors: [
      resistorLine(refs.upper, `divider upper, with ${refs.lower} setting ${holds} near ${vgrid} V`, upper, dividerAmps, series),
      resistorLine(refs.lower, 'divider lower', lower, dividerAmps, series),
    ],
    // Ordered at the next E12 value up (capacitors come in E12 values, common practice): the corner lands at or below the one asked.
    capacitor: capacitorLine(refs.cap, 'divider decoupling', capacitorForCorner(shunt, DIVIDER_CORNER_HZ, 'E12').preferred, vgrid, (bplus * lower) / (upper + lower), '+ to the divider'),
  };
}
