import type { KorenTriodeParams } from '../../src/index';

/**
 * Netlists for the simulator cross-checks. Koren's triode law as a B-source,
 * in the signed form (1 + sgn E1)·|E1|^ex / kg1 that his SPICE models write as
 * (PWR + PWRS)/KG1. Where a stage gives no capacitor, 1 F stands for "large"
 * (bypass, coupling): at 1 Hz its reactance is 0.16 Ω, far under any resistor
 * here, and over a transient it holds its DC voltage, as the model assumes.
 */
const g = (x: number) => x.toPrecision(12);

export { triodeSubckt, type SpiceCaps, type SpiceGridCurrent } from '../../src/netlist/tubeSubckts';
import { triodeSubckt, type SpiceCaps, type SpiceGridCurrent } from '../../src/netlist/tubeSubckts';

export interface SpiceStage {
  readonly params: KorenTriodeParams;
  readonly bplus: number;
  readonly ra: number;
  readonly rk: number;
  readonly bypassed: boolean;
  readonly rl: number;
  readonly vbias: number;
  readonly caps?: SpiceCaps;
  readonly rsource?: number;
  readonly cin?: number;
  readonly rg?: number;
  /** Grid stopper, Ω, between the grid leak's top and the grid. */
  readonly rstopper?: number;
  /** A volume control in the leak's place: Cin feeds the pot's top, the grid side hangs from its wiper, this share up its track. */
  readonly volume?: number;
  readonly ck?: number;
  readonly cout?: number;
  /** The grid-current law, when the stage's grid draws current (absent: none, as Koren's plate law alone). */
  readonly grid?: SpiceGridCurrent;
}

/**
 * The stage's parts, driven at node "src" by `source` (a SPICE source spec
 * such as "DC 0 AC 1"). Output at node "out": across RL through Cout, or a
 * unity buffer of the plate when there is no RL.
 */
function stageElements(s: SpiceStage, source: string, large = { bypass: 1, coupling: 1 }): string[] {
  const stopped = (s.rstopper ?? 0) > 0;
  const hasInputNetwork = s.rsource !== undefined || s.cin !== undefined || stopped;
  const leakTop = stopped ? 'x' : 'grid';
  const potted = s.volume !== undefined && s.volume < 1 && s.rg !== undefined;
  return [
    triodeSubckt('tri', s.params, s.caps, s.grid),
    `VB bplus 0 DC ${g(s.bplus)}`,
    `RA bplus plate ${g(s.ra)}`,
    s.rk > 0 ? `RK cathode 0 ${g(s.rk)}` : 'VK cathode 0 DC 0',
    s.rk > 0 && (s.ck !== undefined || s.bypassed) ? `CK cathode 0 ${g(s.ck ?? large.bypass)}` : '',
    hasInputNetwork ? `VS src 0 ${source}` : `VG grid 0 ${source}`,
    hasInputNetwork ? `RS src a ${g(Math.max(s.rsource ?? 0, 1e-3))}` : '',
    hasInputNetwork ? `CIN a ${potted ? 'top' : leakTop} ${g(s.cin ?? large.coupling)}` : '',
    potted ? `RGU top ${leakTop} ${g((1 - s.volume!) * s.rg!)}` : '',
    hasInputNetwork ? `RG ${leakTop} gbias ${g((s.rg ?? 1e12) * (potted ? s.volume! : 1))}\nVGB gbias 0 DC ${g(s.vbias)}` : '',
    stopped ? `RST ${leakTop} grid ${g(s.rstopper!)}` : '',
    'X1 plate grid cathode tri',
    Number.isFinite(s.rl) ? `CO plate out ${g(s.cout ?? large.coupling)}\nRL out 0 ${g(s.rl)}` : 'EO out 0 plate 0 1',
  ].filter((l) => l !== '');
}

function control(lines: string[]): string[] {
  // ngspice -b exits 1 after a .control block that does not quit.
  return ['.control', 'set numdgt=12', ...lines, 'quit 0', '.endc', '.end'];
}

/** One common-cathode stage: DC operating point, 1 kHz gain into RL, and output impedance at the plate (RL removed). */
export function stageNetlist(s: SpiceStage, measure: 'gain' | 'zout'): string {
  const driven = measure === 'gain';
  const elements = stageElements({ ...s, rl: driven ? s.rl : Infinity }, `DC ${g(s.vbias)} AC ${driven ? 1 : 0}`);
  return [
    '* common-cathode triode stage',
    ...elements,
    driven ? '' : 'IZ 0 plate DC 0 AC 1',
    ...control(['op', 'print v(plate) v(cathode) i(vb)', 'ac lin 1 1000 1000', driven ? 'print vr(out) vi(out)' : 'print vr(plate) vi(plate)']),
  ]
    .filter((l) => l !== '')
    .join('\n');
}

/**
 * A sine of `peak` volts at 1 kHz on the grid, simulated over three cycles with
 * a fine fixed step, then a Fourier analysis of the output's last cycle
 * (`fourier`, 10 harmonics, a 16384-point interpolation grid).
 */
export function distortionNetlist(s: SpiceStage, peak: number): string {
  return [
    '* stage driven by a sine, for harmonics',
    // Large capacitors that ngspice's transient handles well: 1 mF across Rk, 10 µF into RL (RL·C ≥ 0.1 s
    // against a 3 ms run, so each holds its DC voltage as the model assumes). With 100 µF or more on the
    // plate the time step collapses. The capacitors start charged at the operating point: nothing to settle.
    ...stageElements(s, `DC ${g(s.vbias)} SIN(${g(s.vbias)} ${g(peak)} 1000)`, { bypass: 1e-3, coupling: 1e-5 }),
    ...control(['set nfreqs=10', 'set fourgridsize=16384', 'tran 0.25u 3m 0 0.25u', 'fourier 1000 v(out)']),
  ].join('\n');
}

/** AC sweep from 0.1 Hz to 100 MHz, 100 points a decade, written as (frequency, |H|) pairs to `dataFile`. */
export function responseNetlist(s: SpiceStage, dataFile: string): string {
  return [
    '* stage frequency response',
    ...stageElements(s, `DC ${g(s.vbias)} AC 1`),
    ...control(['ac dec 100 0.1 1e8', `wrdata ${dataFile} vm(out)`]),
  ].join('\n');
}

export interface SpiceChain {
  readonly stage: SpiceStage;
  readonly follower: { readonly params: KorenTriodeParams; readonly bplus: number; readonly rk: number };
}

/** A gain stage direct-coupled into a cathode follower: chain gain at 1 kHz and the follower's output impedance. */
export function chainNetlist(c: SpiceChain, measure: 'gain' | 'zout'): string {
  const s = c.stage;
  return [
    '* gain stage + direct-coupled cathode follower',
    triodeSubckt('tri1', s.params),
    triodeSubckt('tri2', c.follower.params),
    `VB bplus 0 DC ${g(s.bplus)}`,
    `VB2 bplus2 0 DC ${g(c.follower.bplus)}`,
    `RA bplus plate ${g(s.ra)}`,
    `RK cathode 0 ${g(s.rk)}`,
    s.bypassed ? 'CK cathode 0 1' : '',
    `VG grid 0 DC ${g(s.vbias)} AC ${measure === 'gain' ? 1 : 0}`,
    'X1 plate grid cathode tri1',
    'X2 bplus2 plate out tri2',
    `RK2 out 0 ${g(c.follower.rk)}`,
    measure === 'zout' ? 'IZ 0 out DC 0 AC 1' : '',
    ...control(['op', 'print v(plate) v(cathode) v(out) i(vb2)', 'ac lin 1 1000 1000', 'print vr(out) vi(out)']),
  ]
    .filter((l) => l !== '')
    .join('\n');
}
