import { bplusWindingLoad, mainsFuse, type AmplifierOnSupplyResult, type FixedBiasSupply, type MainsAnswer, type Rectifier, type Result } from '../../src/index';
import { biasSupplyOf } from './biasSupply';
import { heaterWindingsOf, type HeaterWindingsView } from './heaterPlan';
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
  /** Where the B+ winding's fuse goes: its centre tap, or in series with it. */
  readonly htFuseAt: 'centre tap' | 'winding';
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
  // Read on every store change (a drag's frames among them): worked out again only when one of its inputs moves.
  const bias = biasSupplyOf(s);
  const rectifier = s.design.supply.rectifier.kind;
  const mainsVolts = s.design.supply.mainsVolts;
  if (last && last.r === r && last.heaters === heaters && last.bias === bias && last.rectifier === rectifier && last.mainsVolts === mainsVolts) return last.view;
  const made = mainsFrom(r, heaters, bias, rectifier, mainsVolts);
  last = { r, heaters, bias, rectifier, mainsVolts, view: made };
  return made;
}

let last: { r: object; heaters: object; bias: object | null; rectifier: string; mainsVolts: number; view: MainsView | null } | null = null;

function mainsFrom(r: AmplifierOnSupplyResult, heaters: Extract<HeaterWindingsView, { ok: true }>, bias: Result<FixedBiasSupply> | null, rectifier: Rectifier['kind'], mainsVolts: number): MainsView | null {
  const winding = bplusWindingLoad(rectifier, r.supply, r.loads, r.atFullPower?.loads ?? null);
  if (!winding) return null;
  // Every heater winding's VA as the model gives it; a DC heater supply at its output.
  const heaterVa = heaters.windings.reduce((a, w) => a + w.va, 0) + (heaters.dc ? heaters.dc.volts * heaters.dc.amps : 0);
  const biasVa = bias?.ok ? bias.windingVa : null;
  const answer = mainsFuse({ mainsVolts, bplusVa: winding.va, bplusVaFull: winding.vaFull, heaterVa, biasVa, htAmps: winding.fuseAmps });
  return { bplusVa: winding.va, bplusVaFull: winding.vaFull, heaterVa, biasVa, dcHeaters: heaters.dc !== null, htFuseAt: winding.fuseAt, answer };
}
