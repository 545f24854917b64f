import type { AmplifierOnSupply, AmplifierOnSupplyResult } from '../chain/solveOnSupply';
import { ladderOf } from '../chain/supplyLowEnd';
import { humOnSupply } from '../chain/humOnSupply';
import { openCircuitWinding } from '../supply/winding';
import type { SupplyDesign } from '../supply/supplyTypes';
import { supplyNode, type NetlistSupply } from './chainNetlist';
import { supplyCircuit } from './supplyCircuit';
import { biasCircuit, fixedBiasStage, type NetlistBias } from './biasCircuit';

const g = (x: number) => x.toPrecision(12);

/** Mains cycles the transient runs with a supply in the circuit: enough for its reservoir's ripple to settle (our choice; the header says how far the filter's slowest section has come). */
const MAINS_CYCLES = 10;
/** The lowest base frequency the Fourier analysis steps in, Hz: 60 Hz mains gives 20 (a 50 ms window); lower would ask a window longer than the run. */
const MIN_SPECTRUM_HZ = 20;

const gcd = (a: number, b: number): number => (b === 0 ? a : gcd(b, a % b));

/** A divisor of 1 kHz and of the mains frequency (so of the ripple's, at it or twice it), when the mains frequency is a whole number of hertz that has one of at least MIN_SPECTRUM_HZ. */
export function spectrumBase(mainsHz: number): number | undefined {
  if (!Number.isInteger(mainsHz) || mainsHz <= 0) return undefined;
  const base = gcd(1000, mainsHz);
  return base >= MIN_SPECTRUM_HZ ? base : undefined;
}

export interface BenchSupply {
  readonly supply: NetlistSupply;
  /** Comment lines for the file's head: what the supply part holds, and the model's figures to compare. */
  readonly header: readonly string[];
  /** The transient's length, s, and the `meas` lines reading every node's mean and ripple over its last mains cycle. */
  readonly seconds: number;
  /** The Fourier analysis's base frequency (BenchAnalysis.spectrumHz), or undefined where the mains frequency has no usable one with 1 kHz. */
  readonly spectrumHz: number | undefined;
  readonly measures: readonly string[];
}

/**
 * Where the run ends before the filter settles: an R–C section whose time
 * constant, or a choke and its capacitor whose ring's period, is more than a
 * third of the run (our threshold; in our runs a section of 0.18 s in a run
 * of 0.2 s left its node's ripple reading 65 % high) moves its node, and
 * those after it, still at the run's end, so their ripple reads high. The
 * first such node (null when none), and a note naming the part.
 */
export function settlingNote(d: SupplyDesign, seconds: number): { readonly from: number | null; readonly note: string | null } {
  const ring = (l: number, c: number) => 2 * Math.PI * Math.sqrt(l * c);
  const slow = [
    ...(d.input.kind === 'choke' ? [{ k: 0, s: ring(d.input.l, d.input.c), what: `LIN with CN0 rings with a period of ${ring(d.input.l, d.input.c).toPrecision(2)} s` }] : []),
    ...d.sections.map((x, i) => (x.kind === 'rc' ? { k: i + 1, s: x.r * x.c, what: `RN${i + 1}*CN${i + 1} is ${(x.r * x.c).toPrecision(2)} s` } : { k: i + 1, s: ring(x.l, x.c), what: `LN${i + 1} with CN${i + 1} rings with a period of ${ring(x.l, x.c).toPrecision(2)} s` })),
  ].filter((x) => x.s > seconds / 3);
  if (slow.length === 0) return { from: null, note: null };
  const first = slow[0]!;
  return { from: first.k, note: `* ${first.what}, against a run of ${seconds.toPrecision(2)} s: sn${first.k} and the nodes after it are still settling at its end, their ripple (and the hum they give) reading high. Lengthen the transient to read them.` };
}

/**
 * The amplifier's own supply in its netlist (the amplifier solved on it,
 * `r`): the secondary, rectifier and filter as the model solves them
 * (supplyCircuit), each stage's B+ drawn from its node, and at each node
 * a constant current for what this one channel's circuit does not draw
 * there (the other channels' stages at idle, and the supply's own loads).
 * The rectifier cannot hold an operating point (its secondary is at 0 V at
 * DC), so a start path does: the reservoir's voltage behind the supply's
 * source resistance (ladderOf: its regulation as a resistance, which the
 * model's low end also takes), through a switch that is closed for the
 * operating point and the AC sweep and opens 1 µs into the transient,
 * which then starts with every capacitor charged where the model puts it
 * and runs on the rectifier alone.
 */
export function benchSupply(on: AmplifierOnSupply, r: AmplifierOnSupplyResult, bias?: NetlistBias | null): BenchSupply {
  const d = on.supply;
  const circuit = supplyCircuit(d, supplyNode);
  const nodeCount = d.sections.length + 1;
  const channels = on.channels ?? 1;
  const own = d.loads;
  // r.loads holds every channel's stages, the supply's own loads and the bleeder (a resistor here): the circuit is one channel.
  const bleeder = on.bleederOhms !== undefined ? r.bleederAmps : 0;
  const extra = r.loads.map((total, k) => {
    const ownHere = (own[k] ?? 0) + (k === 0 ? bleeder : 0);
    return (own[k] ?? 0) + ((channels - 1) * (total - ownHere)) / channels;
  });
  const total = r.loads.reduce((a, x) => a + x, 0);
  const ladder = ladderOf(on, r);
  const sourceOhms = Math.max(Number.isFinite(ladder.sourceOhms) ? ladder.sourceOhms : openCircuitWinding(d).ohms, 1e-3);
  // A choke input's start goes in before its choke, whose resistance then drops the current too.
  const v0 = r.supply.nodes[0]!.dc + total * (sourceOhms + (d.input.kind === 'choke' ? d.input.rdc : 0));
  const lines = [
    ...circuit.lines,
    ...extra.flatMap((a, k) => (a > 0 ? [`ISUP${k} ${supplyNode(k)} 0 DC ${g(a)}`] : [])),
    ...(on.bleederOhms !== undefined ? [`RBLEED ${supplyNode(0)} 0 ${g(on.bleederOhms)}`] : []),
    `VSTART sx 0 DC ${g(v0)}`,
    `RSTART sx sst ${g(sourceOhms)}`,
    `SSTART sst ${circuit.rectified} sctl 0 SWSTART`,
    'VSTCTL sctl 0 PWL(0 1 1u 0)',
    '.model SWSTART SW(VT=0.5 VH=0.2 RON=1e-3 ROFF=1e12)',
  ];
  // A fixed-bias output stage: its grids on the bias supply's wipers when it is given, else on a DC source, as said.
  const fixed = fixedBiasStage(on.amplifier.stages);
  const grid = fixed && bias ? biasCircuit(bias, fixed.tubes) : null;
  if (grid) lines.push(...grid.lines);
  const hum = humOnSupply(on, r);
  const seconds = MAINS_CYCLES / d.mainsHz;
  const settling = settlingNote(d, seconds);
  const from = seconds - 1 / d.mainsHz;
  const nodes = Array.from({ length: nodeCount }, (_, k) => k);
  // Each reading over the run's last mains cycle.
  const meas = (name: string, how: 'AVG' | 'PP' | 'MAX', of: string) => `meas tran ${name} ${how} ${of} from=${g(from)} to=${g(seconds)}`;
  const measures = nodes.flatMap((k) => [meas(`sn${k}_avg`, 'AVG', `v(${supplyNode(k)})`), meas(`sn${k}_pp`, 'PP', `v(${supplyNode(k)})`)]);
  measures.push(meas('rect_peak', 'MAX', `i(${circuit.pulses})`));
  if (grid) measures.push(meas('brail_avg', 'AVG', 'v(brail)'), meas('brail_pp', 'PP', 'v(brail)'), ...grid.wipers.map((w) => meas(`${w}_avg`, 'AVG', `v(${w})`)));
  const header = [
    `* The supply: secondary, rectifier and filter (nodes sn0, the reservoir, to sn${nodeCount - 1}); each stage's B+ an ammeter (VB<n>) from its node.`,
    ...(channels > 1 || own.some((a) => a > 0) ? ['* ISUP<k>: what this one channel does not draw at node k (the other channels at idle, the supply\'s own loads).'] : []),
    ...(on.bleederOhms !== undefined ? [`* RBLEED: the bleeder across the reservoir; the model carries its ${(r.bleederAmps * 1e3).toPrecision(3)} mA at node 1.`] : []),
    '* A start path (VSTART, RSTART, SSTART) holds the reservoir for the operating point and the AC sweep, and opens 1 us into the transient.',
    "* The model's supply at idle (mean, ripple peak to peak), to compare with the transient's last mains cycle (meas sn<k>_avg, sn<k>_pp):",
    ...r.supply.nodes.map((n, k) => `*   sn${k}: ${n.dc.toPrecision(4)} V, ${n.ripplePp.toPrecision(3)} V${r.atFullPower ? `; at full power ${r.atFullPower.volts[k]!.toPrecision(4)} V` : ''}`),
    `*   the rectifier's peak current ${r.supply.rectifierPeak.toPrecision(3)} A (meas rect_peak)`,
    ...(hum.ok ? [`*   the hum at the output, at most ${hum.bound.toPrecision(3)} V rms (each stage's share of its node's ripple, added as if in phase): the Fourier rows below 1 kHz hold ngspice's`] : []),
    ...(settling.note ? [settling.note] : []),
    ...(grid && bias
      ? [
          `* The grid bias: its winding, diode, reservoir (bres) and filter to the rail (brail), one adjustment per output tube, each grid's leak to its wiper (${grid.wipers.join(', ')}), set where the law's own tube wants it.`,
          `*   the model's rail -${bias.solved.rail.toPrecision(4)} V, ripple ${bias.solved.railRipplePp.toPrecision(3)} V peak to peak (meas brail_avg, brail_pp); the grid at -${bias.solved.taps[0]!.nominal.toPrecision(4)} V`,
          `*   each leak returns through its wiper's ${(bias.solved.taps[0]!.sourceOhms / 1e3).toPrecision(3)} kOhm, which the figures above leave out (they take the leak alone): the gain here reads a little higher.`,
        ]
      : fixed
        ? [`* The output grids' bias is a DC source (VGB${fixed.index}): the bias supply is not in this file.`]
        : []),
  ];
  return { supply: { feeds: on.feeds, ...(on.screenFeeds ? { screenFeeds: on.screenFeeds } : {}), lines, ...(grid && fixed ? { biasWipers: { stage: fixed.index, wipers: grid.wipers } } : {}) }, header, seconds, spectrumHz: spectrumBase(d.mainsHz), measures };
}
