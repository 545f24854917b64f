import type { Capacitances } from '../tube/types';

/** A bare model gives no interelectrode capacitances: the response then has no Miller roll-off of its own. */
export const NO_CAPACITANCES: Capacitances = { cgk: 0, cgp: 0, cpk: 0, source: 'none: a bare model' };
