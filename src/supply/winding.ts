import type { SupplyDesign } from './supplyTypes';

/**
 * The secondary as the solver wants it: its open-circuit (no-load) rms
 * voltage behind its resistance. A transformer is rated by its voltage at
 * its rated current; the winding's resistance drops I·R of it, so the open
 * circuit voltage is higher by that (the resistance taken as all of the
 * regulation: leakage reactance is ignored). Given the regulation instead
 * (the rise from rated load to no load, a fraction of the rated-load
 * voltage), the resistance is V·regulation / I. Without a rated current the
 * stated voltage is taken as the open-circuit one.
 */
export function openCircuitWinding(d: SupplyDesign): { readonly emfRms: number; readonly ohms: number } {
  const amps = d.ratedAmps;
  if (amps === undefined) return { emfRms: d.secondaryRms, ohms: d.windingOhms };
  const ohms = d.regulation !== undefined ? (d.secondaryRms * d.regulation) / amps : d.windingOhms;
  return { emfRms: d.secondaryRms + amps * ohms, ohms };
}
