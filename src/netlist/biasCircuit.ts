import type { BiasSupplyDesign, BiasSupplySolution } from '../supply/biasSupply';
import type { ChainStage } from '../chain/chainTypes';

const g = (x: number) => x.toPrecision(12);

/** A fixed-bias output stage's grid supply as it was solved (solveBiasSupply, or the stage's own fixed-bias supply). */
export interface NetlistBias {
  readonly design: BiasSupplyDesign;
  readonly solved: BiasSupplySolution;
}

/** The amplifier's fixed-bias output stage, the one stage a bias supply feeds: its place, and how many grids it has (a pair's two); null when there is none. */
export function fixedBiasStage(stages: readonly ChainStage[]): { readonly index: number; readonly tubes: 1 | 2 } | null {
  const index = stages.findIndex((s) => (s.kind === 'single-ended-output' || s.kind === 'push-pull-output') && s.bias === 'fixed');
  return index < 0 ? null : { index, tubes: stages[index]!.kind === 'push-pull-output' ? 2 : 1 };
}

export interface BiasCircuit {
  readonly lines: readonly string[];
  /** The wiper of each of this channel's tubes' adjustments, in the stage's order. */
  readonly wipers: readonly string[];
}

/**
 * The negative grid supply in ngspice parts: the bias winding at its
 * open-circuit voltage behind its resistance, one silicon diode turned so
 * the reservoir charges negative (DSI, from the B+ supply's lines), the
 * reservoir, the filter resistor and the rail's capacitor, and from the rail
 * one adjustment string for each of this channel's `tubes` (ground-end
 * resistor, the trimmer split at its wiper where the law's own tube is set,
 * rail-end resistor); the other channels' strings draw their current as a
 * constant source. A start path like the B+ supply's holds the reservoir
 * for the operating point and lets go, on the same control, 1 µs into the
 * transient.
 */
export function biasCircuit(b: NetlistBias, tubes: number): BiasCircuit {
  const { design: d, solved: s } = b;
  const lines = [
    `VBIASW bwa 0 SIN(0 ${g(Math.SQRT2 * d.secondaryRms)} ${d.mainsHz})`,
    `RBIASW bwa bwa1 ${g(Math.max(d.windingOhms, 1e-6))}`,
    'DBIAS bres bwa1 DSI',
    `CBRES bres 0 ${g(d.reservoir)}`,
    `RBIASF bres brail ${g(d.r)}`,
    `CBRAIL brail 0 ${g(d.c)}`,
  ];
  const mine = s.taps.slice(0, tubes);
  const wipers = mine.map((tap, j) => {
    const { top, pot, bottom } = tap.string;
    const below = tap.travel * pot;
    lines.push(`RBB${j} 0 bb${j} ${g(bottom)}`, `RBPL${j} bb${j} bw${j} ${g(Math.max(below, 1e-3))}`, `RBPU${j} bw${j} bt${j} ${g(Math.max(pot - below, 1e-3))}`, `RBT${j} bt${j} brail ${g(top)}`);
    return `bw${j}`;
  });
  // The other channels' strings: the current each draws at the rail's voltage, from ground into the rail.
  const others = s.taps.slice(tubes).reduce((a, tap) => a + s.rail / (tap.string.top + tap.string.pot + tap.string.bottom), 0);
  if (others > 0) lines.push(`IBIASO 0 brail DC ${g(others)}`);
  // The reservoir's regulation as a resistance (its drop from no load over the strings' current), as the B+ start path takes it.
  const rs = s.load > 0 && s.noLoadVolts > s.reservoir ? (s.noLoadVolts - s.reservoir) / s.load : Math.max(d.windingOhms, 1e-3);
  lines.push(`VBSTART bsx 0 DC ${g(-(s.reservoir + s.load * rs))}`, `RBSTART bsx bsst ${g(rs)}`, 'SBSTART bsst bres sctl 0 SWSTART');
  return { lines, wipers };
}
