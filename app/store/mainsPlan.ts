import { fullPowerVa, htFuseCurrent, mainsFuse, type MainsAnswer, type Result } from '../../src/index';
import { biasSupplyOf, needsBiasSupply } from './biasSupply';
import { heaterWindingsOf } from './heaterPlan';
import type { WorkbenchState } from './workbenchStore';

/** The mains voltages offered, V rms (the usual nominal mains the world over, IEC 60038 among them). */
export const MAINS_VOLTS: readonly number[] = [100, 110, 115, 120, 127, 200, 220, 230, 240];

/** What the transformer's secondaries deliver, winding by winding, VA, and the model's answer for the primary. */
export interface MainsView {
  readonly bplusVa: number;
  /** The B+ winding at full power, where the amplifier draws more there (fullPowerVa's estimate), VA. */
  readonly bplusVaFull: number | null;
  readonly heaterVa: number;
  /** A fixed-bias stage's bias winding, VA; null without one. */
  readonly biasVa: number | null;
  /** A DC heater supply counted at its output (its winding is not designed here, and delivers more). */
  readonly dcHeaters: boolean;
  /** Where the B+ winding's fuse goes (its centre tap, or in series with it); null where the model cannot say. */
  readonly htFuseAt: 'centre tap' | 'winding' | null;
  readonly answer: Result<MainsAnswer>;
}

/**
 * The mains transformer's load and primary fuse, once the supply is solved:
 * the B+ winding's VA (at idle and at full power), every heater winding's,
 * the bias winding's; null while the supply is off or not solved, or the
 * heaters do not add up.
 */
export function mainsOf(s: WorkbenchState): MainsView | null {
  const view = s.supplyView;
  const r = s.design.supply.on && view?.result.ok ? view.result : null;
  const heaters = heaterWindingsOf(s);
  if (!r || !heaters.ok) return null;
  const bplusVa = r.supply.secondaryVa;
  const bplusVaFull = fullPowerVa(bplusVa, r.loads, r.atFullPower?.loads ?? null);
  const heaterVa = heaters.windings.reduce((a, w) => a + w.va, 0) + (heaters.dc ? heaters.dc.volts * heaters.dc.amps : 0);
  const bias = needsBiasSupply(s) ? biasSupplyOf(s) : null;
  // Behind one diode the winding carries the diode's pulses: its rms current times its voltage.
  const biasVa = bias?.ok ? s.design.supply.bias.secondaryRms * bias.diodeRms : null;
  // The B+ fuse's current at full power, where the winding delivers more there, scaled as its VA is.
  const ht = htFuseCurrent(s.design.supply.rectifier.kind, r.supply.rectifierRms, r.supply.secondaryRmsCurrent);
  const htAmps = ht ? ht.amps * (bplusVaFull !== null && bplusVa > 0 ? bplusVaFull / bplusVa : 1) : null;
  return { bplusVa, bplusVaFull, heaterVa, biasVa, dcHeaters: heaters.dc !== null, htFuseAt: ht?.where ?? null, answer: mainsFuse({ mainsVolts: s.design.supply.mainsVolts, bplusVa, bplusVaFull, heaterVa, biasVa, htAmps }) };
}
