import type { ChainInput, ChainStage } from '../chain/chainTypes';
import type { SupplyLadder } from '../chain/chainResponse';
import { pentodeSubckt, triodeSubckt } from './tubeSubckts';
import { modelOf, recordOf } from '../tube/types';
import { CATHODE_THERMAL_VOLTS, GRID_CURRENT_ONSET, POWER_GRID_RESISTANCE } from '../tube/gridCurrent';

/**
 * A whole amplifier for ngspice, stage by stage from the same ChainInput the
 * model takes: Koren's laws as behavioural sources with the interelectrode
 * capacitances, every coupling capacitor and grid leak as given, a bias
 * supply behind each leak, and an output transformer as coupled inductors
 * large enough (10 kH, k = 1 − 10⁻¹⁰) to act as the ideal transformer the
 * model assumes across the audio band and well past it, unless the design
 * gives the transformer's inductances: then the primary is wound to its
 * primary inductance and each of its sections coupled to the secondary by
 * k = √(1 − L_leakage / L_primary), the coupling whose primary inductance
 * with the secondary shorted, L_primary·(1 − k²), is the leakage; the
 * primary's sections (an ultralinear tap, a push-pull primary's halves) stay
 * coupled among themselves as the near-ideal transformer's, the leakage the
 * model takes being the primary's to the secondary. Where the design
 * leaves a bypass ideal, a large capacitor stands for it: 1 F in the AC
 * sweep, 1 mF in the transient (ngspice's time step collapses with more).
 * The transient checks the midband large-signal figures, so there every
 * coupling capacitor is 10 µF and every bypass 1 mF: a real 15 nF would
 * still be settling from the sine's start over a 5 ms run and shift the
 * operating points the harmonics are read at. The AC sweep keeps every
 * capacitor as given.
 *
 * Every grid draws current by the law the model follows (src/tube/gridCurrent.ts):
 * a voltage stage's from its onset with the retarding tail, an output stage's
 * from 0 V (classA1GridCurrent), each a behavioural source from grid to cathode;
 * a long-tailed pair's and a push-pull pair's grids draw none (the model does
 * not follow theirs).
 */
const g = (x: number) => x.toPrecision(12);
const L_PRIMARY = 1e4;
const K = 1 - 1e-10;

/** The primary's inductance and the windings' coupling for an output stage: the design's where it gives them, else the near-ideal transformer's. */
function windingOf(s: { readonly primaryInductance?: number | null; readonly leakageInductance?: number | null }, settleLp?: number): { lp: number; k: number } {
  const lp = s.primaryInductance ?? settleLp ?? L_PRIMARY;
  const ll = s.leakageInductance ?? null;
  return { lp, k: ll === null ? K : Math.sqrt(1 - ll / lp) };
}

/**
 * `settle`: a transient of `ms` milliseconds, read on its last cycle, with a single-ended output primary of `lp` henries
 * (where the design gives none) and its cathode held by 10 F, so the primary's magnetising current settles where a
 * sustained drive puts it (its time constant is lp over the reflected load in parallel with the plate's resistance).
 * Inside the clean limit only: past it a grid in grid current would also charge its coupling capacitor over the run
 * (10 µF through its leak), a shift of bias the model does not follow.
 */
export type ChainAnalysis =
  | { readonly kind: 'op-ac' }
  | { readonly kind: 'sweep' }
  | { readonly kind: 'noise' }
  | { readonly kind: 'kick'; readonly seconds: number }
  | { readonly kind: 'tran'; readonly peak: number; readonly settle?: { readonly ms: number; readonly lp: number } }
  | BenchAnalysis;

/**
 * 'bench': the netlist a builder takes to a simulator, every capacitor as
 * designed (1 mF where one is left ideal, which keeps a transient's time
 * step), the source a 1 kHz sine of `peak` volts that is also the AC sweep's
 * unit source, and a control block that ngspice runs, in batch or when the
 * file is sourced: the operating point (every node printed), the response
 * from 1 Hz to 1 MHz (printed in dB and degrees), and a 40 ms transient
 * whose last cycle `fourier` reads for the output's harmonics.
 */
export interface BenchAnalysis {
  readonly kind: 'bench';
  readonly peak: number;
  /**
   * Global feedback: Rf (and Cf across it) from the speaker to the first
   * cathode, the secondary wound `reversed` when the speaker must be turned
   * round for the loop to be negative.
   */
  readonly feedback?: { readonly rf: number; readonly cf: number | null; readonly reversed: boolean };
  /** The transient's length, s (40 ms unless given: a supply in the circuit asks for its filter to settle). */
  readonly seconds?: number;
  /**
   * The Fourier analysis's base frequency, Hz, when the output carries a supply's hum: a divisor of both 1 kHz and
   * the ripple's frequency, so the window (its period, at the run's end) holds whole cycles of both and the hum's rows
   * stand apart from the signal's harmonics (at 1, 2, … 5 kHz). Absent: the last millisecond, at 1 kHz.
   */
  readonly spectrumHz?: number;
  /** More lines for the control block, after the transient's Fourier analysis (say, `meas` lines on the supply's nodes). */
  readonly after?: readonly string[];
}

/** The output transformer's secondary and the speaker across it; `reversed` swaps the secondary's ends (its dot at ground). */
const secondaryLines = (ls: number, speakerOhms: number, reversed: boolean): string[] => [`LS ${reversed ? '0 sec' : 'sec 0'} ${g(ls)}`, `RSPK sec 0 ${g(speakerOhms)}`];

/** Node names the checks read: each stage's plate, cathode and B+ source, and the output. */
/** The operating point's other electrodes a meter reads: a capacitor-coupled grid (on its leak) and a single-ended output's screen (its tap, or its own supply). */
function opExtras(s: ChainStage, i: number): string {
  const grid = s.coupling.kind === 'capacitor' ? ` v(g${i})` : '';
  const screen = s.kind === 'single-ended-output' && s.tube.law.kind === 'pentode' && s.connection !== 'triode' ? ` v(${s.connection === 'ultralinear' ? 'tap' : 'screen'})` : '';
  return grid + screen;
}

export const nodes = { plate: (i: number) => `p${i}`, cathode: (i: number) => `k${i}`, supply: (i: number) => `vb${i}`, output: 'out' } as const;

function stageLines(s: ChainStage, i: number, input: string, large: number, midband: boolean, input2: string | null, settle: { readonly lp: number } | undefined, reversed: boolean, fed: NetlistSupply | undefined): { lines: string[]; output: string; output2?: string } {
  const p = nodes.plate(i);
  const k = nodes.cathode(i);
  // A grid stopper (a gain stage's, a follower's, a splitter's first grid's): the coupling (or the output before, direct) ends at its
  // far side, the grid behind it.
  const stopper = s.kind !== 'single-ended-output' && s.kind !== 'push-pull-output' && (s.rstopper ?? 0) > 0 ? s.rstopper! : 0;
  const gnode = s.coupling.kind === 'direct' && stopper === 0 ? input : `g${i}`;
  const leakTop = stopper > 0 ? (s.coupling.kind === 'direct' ? input : `g${i}x`) : gnode;
  const lines: string[] = stopper > 0 ? [`RST${i} ${leakTop} ${gnode} ${g(stopper)}`] : [];
  if (s.coupling.kind === 'capacitor') {
    const vbias = s.kind === 'single-ended-output' || s.kind === 'push-pull-output' ? (s.bias === 'fixed' ? s.vg : 0) : (s.vbias ?? 0);
    // A gain stage's volume control: the capacitor into the pot's top, the track above the wiper to it, below it to the bias.
    const volume = s.kind === 'common-cathode' ? s.volume : undefined;
    if (volume !== undefined && volume < 1) {
      lines.push(`CC${i} ${input} g${i}t ${midband ? '10u' : g(s.coupling.cc)}`, `RGU${i} g${i}t ${leakTop} ${g((1 - volume) * s.coupling.rg)}`, `RG${i} ${leakTop} gb${i} ${g(volume * s.coupling.rg)}`, `VGB${i} gb${i} 0 DC ${g(vbias)}`);
    } else {
      // A bias supply in the circuit takes the leaks to its wipers; else they return to a DC source.
      const wipers = fed?.biasWipers?.stage === i ? fed.biasWipers.wipers : null;
      lines.push(`CC${i} ${input} ${leakTop} ${midband ? '10u' : g(s.coupling.cc)}`, `RG${i} ${leakTop} ${wipers?.[0] ?? `gb${i}`} ${g(s.coupling.rg)}`);
      if (!wipers) lines.push(`VGB${i} gb${i} 0 DC ${g(vbias)}`);
      // A push-pull stage's second grid: the splitter's other output through its own capacitor and leak, alike.
      if (s.kind === 'push-pull-output' && input2) lines.push(`CC${i}b ${input2} ${gnode}b ${midband ? '10u' : g(s.coupling.cc)}`, `RG${i}b ${gnode}b ${wipers?.[1] ?? `gb${i}`} ${g(s.coupling.rg)}`);
    }
  }
  if (s.kind === 'push-pull-output') return { lines: [...lines, ...pushPullLines(s, i, gnode, `${gnode}b`, large, reversed, fed)], output: 'sec' };
  if (s.kind === 'single-ended-output') {
    const t = s.tube;
    const n2 = s.zPrimary / s.speakerOhms;
    const ul = s.connection === 'ultralinear' && t.law.kind === 'pentode';
    lines.push(t.law.kind === 'pentode' ? pentodeSubckt(t.law.params) : triodeSubckt('outtri', t.law.tube.model.params));
    lines.push(bplusSource(i, `bp${i}`, s.bplus, fed), `RPRI bottom ${p} ${g(Math.max(s.rPrimary, 1e-6))}`);
    const { lp, k: kw } = windingOf(s, settle?.lp);
    if (ul) {
      const x = s.ulTap;
      lines.push(`LA bp${i} tap ${g(lp * x * x)}`, `LB tap bottom ${g(lp * (1 - x) * (1 - x))}`, `KAB LA LB ${K}`, `KAS LA LS ${g(kw)}`, `KBS LB LS ${g(kw)}`);
    } else {
      lines.push(`LP bp${i} bottom ${g(lp)}`, `KPS LP LS ${g(kw)}`);
    }
    lines.push(...secondaryLines(lp / n2, s.speakerOhms, reversed));
    lines.push(s.bias === 'cathode' ? `RK${i} ${k} 0 ${g(s.rk)}\nCK${i} ${k} 0 ${g(settle ? 10 : midband ? large : (s.ck ?? large))}` : `VK${i} ${k} 0 DC 0`);
    const rgrid = t.law.kind === 'triode' ? t.law.tube.model.gridResistance : POWER_GRID_RESISTANCE;
    lines.push(`BG${i} ${gnode} ${k} I = pwr(max(v(${gnode},${k}),0),1.5)/${g(rgrid)}`);
    if (t.law.kind === 'pentode') {
      const screen = s.connection === 'triode' ? p : ul ? 'tap' : 'screen';
      if (s.connection === 'pentode') lines.push(screenSource(`VSCR${i}`, i, s.screenVolts, fed));
      lines.push(`X${i} ${p} ${screen} ${gnode} ${k} pent`, `CGK${i} ${gnode} ${k} ${g(t.capacitances.cgk)}`, `CGP${i} ${gnode} ${p} ${g(t.capacitances.cgp)}`, `CPK${i} ${p} ${k} ${g(t.capacitances.cpk)}`);
    } else {
      lines.push(`X${i} ${p} ${gnode} ${k} outtri`, `CGK${i} ${gnode} ${k} ${g(t.capacitances.cgk)}`, `CGP${i} ${gnode} ${p} ${g(t.capacitances.cgp)}`, `CPK${i} ${p} ${k} ${g(t.capacitances.cpk)}`);
    }
    return { lines, output: 'sec' };
  }
  const caps = recordOf(s.tube)?.capacitances;
  const model = modelOf(s.tube);
  const gridLaw = { onset: GRID_CURRENT_ONSET, vt: CATHODE_THERMAL_VOLTS, rgrid: model.gridResistance };
  lines.push(triodeSubckt(`tri${i}`, model.params, caps ? { cgk: caps.cgk, cgp: caps.cgp, cpk: caps.cpk } : undefined, s.kind === 'long-tailed-pair' ? undefined : gridLaw));
  lines.push(`X${i} ${p} ${gnode} ${k} tri${i}`);
  if (s.kind === 'split-load') {
    lines.push(bplusSource(i, `bp${i}`, s.bplus, fed), `RA${i} bp${i} ${p} ${g(s.ra)}`, `RK${i} ${k} 0 ${g(s.rk)}`);
    return { lines, output: p, output2: k };
  }
  if (s.kind === 'long-tailed-pair') {
    // The second grid at the first's DC voltage through a leak, held at signal ground by a capacitor.
    const vgrid = s.coupling.kind === 'capacitor' ? `gb${i}` : `gd${i}`;
    if (s.coupling.kind === 'direct') lines.push(`EGD${i} gd${i} 0 ${input} 0 1`);
    lines.push(
      `X${i}b ${p}b ${gnode}b ${k} tri${i}`,
      `RG${i}b ${gnode}b ${vgrid} 1e6`,
      `CG${i}b ${gnode}b 0 1`,
      bplusSource(i, `bp${i}`, s.bplus, fed),
      `RA${i} bp${i} ${p} ${g(s.ra)}`,
      `RA${i}b bp${i} ${p}b ${g(s.ra2 ?? s.ra)}`,
      s.rk > 0 ? `RK${i} ${k} t${i} ${g(s.rk)}` : `VK${i} ${k} t${i} DC 0`,
      `RT${i} t${i} 0 ${g(s.rtail)}`,
    );
    return { lines, output: p, output2: `${p}b` };
  }
  if (s.kind === 'common-cathode') {
    lines.push(bplusSource(i, `bp${i}`, s.bplus, fed), `RA${i} bp${i} ${p} ${g(s.ra)}`);
    lines.push(s.rk > 0 ? `RK${i} ${k} 0 ${g(s.rk)}` : `VK${i} ${k} 0 DC 0`);
    if (s.rk > 0 && s.bypassed) lines.push(`CK${i} ${k} 0 ${g(midband ? large : (s.ck ?? large))}`);
    return { lines, output: p };
  }
  lines.push(bplusSource(i, p, s.bplus, fed), `RK${i} ${k} 0 ${g(s.rk)}`);
  return { lines, output: k };
}

/**
 * A push-pull stage: the two tubes on a centre-tapped primary of coupled
 * segments (as pushPullNetlist, at this file's inductance), half the
 * primary's DC resistance before each plate, a shared cathode resistor
 * bypassed (by a large capacitor) or fixed bias. Node names: the first
 * plate and the cathode are the stage's own; the second plate ends in b.
 */
function pushPullLines(s: Extract<ChainStage, { kind: 'push-pull-output' }>, i: number, grid1: string, grid2: string, large: number, reversed: boolean, fed: NetlistSupply | undefined): string[] {
  const t = s.tube;
  const p = nodes.plate(i);
  const k = nodes.cathode(i);
  const pentode = t.law.kind === 'pentode';
  const ul = s.connection === 'ultralinear' && pentode;
  const lines = [pentode ? pentodeSubckt(t.law.params) : triodeSubckt('outtri', t.law.tube.model.params)];
  lines.push(bplusSource(i, `bp${i}`, s.bplus, fed), `RH1 end1 ${p} ${g(Math.max(s.rPrimary / 2, 1e-6))}`, `RH2 end2 ${p}b ${g(Math.max(s.rPrimary / 2, 1e-6))}`);
  const { lp, k: kw } = windingOf(s);
  const quarter = lp / 4;
  const segments: string[] = [];
  if (ul) {
    const x = s.ulTap;
    lines.push(`LB1 end1 tap1 ${g(quarter * (1 - x) ** 2)}`, `LA1 tap1 bp${i} ${g(quarter * x * x)}`, `LA2 bp${i} tap2 ${g(quarter * x * x)}`, `LB2 tap2 end2 ${g(quarter * (1 - x) ** 2)}`);
    segments.push('LB1', 'LA1', 'LA2', 'LB2');
  } else {
    lines.push(`LH1 end1 bp${i} ${g(quarter)}`, `LH2 bp${i} end2 ${g(quarter)}`);
    segments.push('LH1', 'LH2');
  }
  lines.push(...secondaryLines((lp * s.speakerOhms) / s.raa, s.speakerOhms, reversed));
  const all = [...segments, 'LS'];
  all.forEach((a, j) => all.slice(j + 1).forEach((b) => lines.push(`K${a}${b} ${a} ${b} ${g(b === 'LS' ? kw : K)}`)));
  lines.push(s.bias === 'cathode' ? `RK${i} ${k} 0 ${g(s.rk)}\nCK${i} ${k} 0 ${g(large)}` : `VK${i} ${k} 0 DC 0`);
  const screen = (n: 1 | 2) => (s.connection === 'triode' ? (n === 1 ? p : `${p}b`) : ul ? `tap${n}` : 'screen');
  if (pentode) {
    if (s.connection === 'pentode') lines.push(screenSource('VSCR', i, s.screenVolts, fed));
    lines.push(`X${i} ${p} ${screen(1)} ${grid1} ${k} pent`, `X${i}b ${p}b ${screen(2)} ${grid2} ${k} pent`);
  } else {
    lines.push(`X${i} ${p} ${grid1} ${k} outtri`, `X${i}b ${p}b ${grid2} ${k} outtri`);
  }
  const c = t.capacitances;
  for (const [x, gn, pn] of [['a', grid1, p], ['b', grid2, `${p}b`]] as const) lines.push(`CGK${i}${x} ${gn} ${k} ${g(c.cgk)}`, `CGP${i}${x} ${gn} ${pn} ${g(c.cgp)}`, `CPK${i}${x} ${pn} ${k} ${g(c.cpk)}`);
  return lines;
}

/**
 * A supply behind the stages: each stage's B+ source becomes a 0 V ammeter
 * from its plate load (a follower's plate) to the node feeding it, and a
 * pentode output stage's screens with a node of their own (`screenFeeds`)
 * draw from it the same way; `lines` are the supply's own parts, on the
 * nodes `supplyNode(k)`.
 */
export interface NetlistSupply {
  readonly feeds: readonly number[];
  readonly screenFeeds?: readonly (number | null)[];
  readonly lines: readonly string[];
  /** A fixed-bias output stage's grid leaks returned to its bias adjustments' wipers (a pair's second grid to the second) instead of a DC source. */
  readonly biasWipers?: { readonly stage: number; readonly wipers: readonly string[] };
}

export const supplyNode = (k: number) => `sn${k}`;

/** Stage i's B+ at `top`: a DC source of `bplus`, or an ammeter to the node feeding it. */
function bplusSource(i: number, top: string, bplus: number, fed: NetlistSupply | undefined): string {
  const name = nodes.supply(i).toUpperCase();
  return fed ? `${name} ${top} ${supplyNode(fed.feeds[i]!)} DC 0` : `${name} ${top} 0 DC ${g(bplus)}`;
}

/** A pentode-connected stage's screens: their own DC source, or an ammeter to the node feeding them. */
function screenSource(name: string, i: number, volts: number, fed: NetlistSupply | undefined): string {
  const k = fed?.screenFeeds?.[i];
  return typeof k === 'number' ? `${name} screen ${supplyNode(k)} DC 0` : `${name} screen 0 DC ${g(volts)}`;
}

/**
 * The supply's filter ladder as the signal sees it (SupplyLadder), fed from `v0` (the reservoir's DC under the
 * stages' current plus the drop in the source resistance, so the nodes sit where the supply put them) through the
 * source resistance (and a choke input's choke), each node's capacitor to ground and each section's resistor (or
 * choke with its resistance) to the next. Screens stay on their own DC sources, as the ladder's model takes them.
 */
export interface NetlistLadder {
  readonly ladder: SupplyLadder;
  readonly v0: number;
}

export function ladderSupply(n: NetlistLadder): NetlistSupply {
  const { ladder, v0 } = n;
  const choke = ladder.choke;
  const lines = [`VSUP sx 0 DC ${g(v0)}`, choke ? `RSRC sx sy ${g(ladder.sourceOhms + choke.r)}` : `RSRC sx ${supplyNode(0)} ${g(ladder.sourceOhms)}`];
  if (choke) lines.push(`LCH sy ${supplyNode(0)} ${g(choke.l)}`);
  ladder.caps.forEach((c, k) => lines.push(`CN${k} ${supplyNode(k)} 0 ${g(c)}`));
  if (ladder.bleederOhms !== undefined) lines.push(`RBLEED ${supplyNode(0)} 0 ${g(ladder.bleederOhms)}`);
  ladder.links.forEach((link, k) => {
    if (link.l > 0) lines.push(`RLK${k} ${supplyNode(k)} sl${k} ${g(Math.max(link.r, 1e-6))}`, `LLK${k} sl${k} ${supplyNode(k + 1)} ${g(link.l)}`);
    else lines.push(`RLK${k} ${supplyNode(k)} ${supplyNode(k + 1)} ${g(Math.max(link.r, 1e-6))}`);
  });
  return { feeds: ladder.feeds, lines };
}

export function chainNetlist(c: ChainInput, analysis: ChainAnalysis, supply?: NetlistSupply): string {
  const large = analysis.kind === 'tran' || analysis.kind === 'bench' ? 1e-3 : 1;
  // 'kick': a 20 ms, 50 mV pulse at the input 0.2 s in, every capacitor as given, to watch what the circuit does after it.
  const source =
    analysis.kind === 'tran' ? `DC 0 SIN(0 ${g(analysis.peak)} 1000)` : analysis.kind === 'bench' ? `DC 0 AC 1 SIN(0 ${g(analysis.peak)} 1000)` : analysis.kind === 'kick' ? 'DC 0 PULSE(0 0.05 0.2 1m 1m 20m 1000)' : 'DC 0 AC 1';
  const lines = ['* amplifier chain', `VS src 0 ${source}`, `RS src a ${g(Math.max(c.source.rsource, 1e-3))}`];
  let input = 'a';
  let input2: string | null = null;
  c.stages.forEach((s, i) => {
    const reversed = analysis.kind === 'bench' && analysis.feedback?.reversed === true;
    const st = stageLines(s, i, input, large, analysis.kind === 'tran', input2, analysis.kind === 'tran' ? analysis.settle : undefined, reversed, supply);
    lines.push(...st.lines);
    input = st.output;
    input2 = st.output2 ?? null;
  });
  // The load's own coupling capacitor in the sweeps (an ideal one when none is given). The transient checks midband
  // levels: a 10 µF output capacitor there holds its charge over the run (RL·C ≥ 0.1 s); more collapses the time step.
  if (c.load && Number.isFinite(c.load.rl)) lines.push(`CO ${input} lo ${analysis.kind === 'tran' ? '10u' : c.load.cc !== undefined ? g(c.load.cc) : g(large)}`, `RL lo 0 ${g(c.load.rl)}`);
  // The output is read across the load (across the last stage's own output with none).
  lines.push(`EOUT ${nodes.output} 0 ${c.load && Number.isFinite(c.load.rl) ? 'lo' : input} 0 1`);
  if (analysis.kind === 'bench') {
    const fb = analysis.feedback;
    if (fb) lines.push(`RF sec ${nodes.cathode(0)} ${g(fb.rf)}`, ...(fb.cf !== null ? [`CF sec ${nodes.cathode(0)} ${g(fb.cf)}`] : []));
    const tran = `tran 20u ${analysis.seconds !== undefined ? g(analysis.seconds) : '40m'} 0 2u`;
    const base = analysis.spectrumHz;
    const fourier = base === undefined
      ? ['fourier 1k v(out)']
      : [
          `* The output over the run's last ${Number((1000 / base).toPrecision(3))} ms in steps of ${Number(base.toPrecision(3))} Hz: the signal's harmonics at 1 to 5 kHz, the supply's hum at its ripple's multiples. The THD ngspice prints is against the first row: read the rows.`,
          `set nfreqs=${Math.round(5000 / base) + 1}`,
          'set fourgridsize=16384',
          `fourier ${g(base)} v(out)`,
        ];
    return [...lines, ...(supply?.lines ?? []), '.control', 'op', 'print all', 'ac dec 20 1 1meg', 'print vdb(out) vp(out)', tran, ...fourier, ...(analysis.after ?? []), '.endc', '.end'].join('\n');
  }
  const control =
    analysis.kind === 'op-ac'
      ? ['op', `print ${c.stages.map((st, i) => `v(${nodes.plate(i)}) v(${nodes.cathode(i)}) i(${nodes.supply(i)})${opExtras(st, i)}`).join(' ')}`, 'ac lin 1 1000 1000', 'print vr(out) vi(out)']
      : analysis.kind === 'sweep'
        ? ['ac dec 50 0.01 1e8', 'wrdata {data} vm(out)']
        : analysis.kind === 'noise'
          ? ['noise v(out) vs dec 50 20 20000', 'print onoise_total', 'setplot noise1', 'wrdata {data} onoise_spectrum']
        : analysis.kind === 'kick'
          ? [`tran 2m ${analysis.seconds} 0 2m`, 'wrdata {data} v(out)']
        : analysis.settle
          ? ['set nfreqs=10', 'set fourgridsize=16384', `tran 0.5u ${analysis.settle.ms}m ${analysis.settle.ms - 10}m 0.5u`, 'fourier 1000 v(out)']
          : ['set nfreqs=10', 'set fourgridsize=16384', 'tran 0.25u 5m 0 0.25u', 'fourier 1000 v(out)'];
  // Noise at the IEEE reference temperature, 290 K, as the model takes it (ngspice's default is 300.15 K).
  if (analysis.kind === 'noise') lines.push('.options temp=16.85');
  return [...lines, ...(supply?.lines ?? []), '.control', 'set numdgt=12', ...control, 'quit 0', '.endc', '.end'].join('\n');
}
