import { type OutputTube, type PushPullDesign } from '../../src/index';
import { triodeSubckt } from './netlists';
import { pentodeSubckt } from './outputNetlist';
import { mismatchParts } from '../../src/pushpull/pushPullDesign';
import { scaledTube } from '../../src/pushpull/solvePushPull';

/**
 * A push-pull stage for ngspice: each tube by Koren's laws as behavioural
 * sources (the second with its currents scaled by the mismatch), the
 * transformer as one primary of coupled segments end 1 → (tap) → centre tap
 * → (tap) → end 2 with the secondary (100 H in all, k = 0.999999, as the
 * single-ended netlist), half the primary's DC resistance between each end
 * and its plate, a shared cathode resistor bypassed by 10 mF or fixed bias,
 * and the grids driven at 1 kHz in antiphase. The run lasts 60 ms and the
 * Fourier analysis reads the secondary over its last cycle: a shorter run
 * leaves the magnetising current's start-up offset (its time constant is
 * about 15 ms) in the core, which makes H2 a matched pair does not have.
 */
const g = (x: number) => x.toPrecision(12);
const L_PRIMARY = 100;
const K = 0.999999;

function subckt(tube: OutputTube, name: string): string {
  if (tube.law.kind === 'pentode') return pentodeSubckt(tube.law.params).replaceAll('.subckt pent ', `.subckt ${name} `).replaceAll('.ends pent', `.ends ${name}`);
  return triodeSubckt(name, tube.law.tube.model.params);
}

/**
 * Asked for a settled bias instead, the shared cathode resistor gets a real bypass (`ck`) and the run lasts `ms`
 * milliseconds, long enough for the cathode to settle where the resistor drops the average current; the cathode's
 * average over the last 10 ms is printed as vkavg and the Fourier analysis reads the last cycle as before.
 */
export interface SettleRun {
  readonly ck: number;
  readonly ms: number;
}

export function pushPullNetlist(tube: OutputTube, d: PushPullDesign, peak: number, offset2 = 0, settle?: SettleRun): string {
  const tube2 = scaledTube(tube, mismatchParts(d.mismatch).gm);
  const pentode = tube.law.kind === 'pentode';
  const ul = d.connection === 'ultralinear' && pentode;
  const lines: string[] = ['* push-pull transformer-coupled output stage', subckt(tube, 'one'), subckt(tube2, 'two')];
  lines.push(`VB bplus 0 DC ${g(d.bplus)}`, `RH1 end1 plate1 ${g(Math.max(d.rPrimary / 2, 1e-6))}`, `RH2 end2 plate2 ${g(Math.max(d.rPrimary / 2, 1e-6))}`);
  const quarter = L_PRIMARY / 4;
  const segments: string[] = [];
  if (ul) {
    const x = d.ulTap;
    lines.push(`LB1 end1 tap1 ${g(quarter * (1 - x) ** 2)}`, `LA1 tap1 bplus ${g(quarter * x * x)}`, `LA2 bplus tap2 ${g(quarter * x * x)}`, `LB2 tap2 end2 ${g(quarter * (1 - x) ** 2)}`);
    segments.push('LB1', 'LA1', 'LA2', 'LB2');
  } else {
    lines.push(`LH1 end1 bplus ${g(quarter)}`, `LH2 bplus end2 ${g(quarter)}`);
    segments.push('LH1', 'LH2');
  }
  lines.push(`LS sec 0 ${g((L_PRIMARY * d.speakerOhms) / d.raa)}`, `RSPK sec 0 ${g(d.speakerOhms)}`);
  const all = [...segments, 'LS'];
  all.forEach((a, i) => all.slice(i + 1).forEach((b) => lines.push(`K${a}${b} ${a} ${b} ${K}`)));
  const vbias = d.bias === 'fixed' ? d.vg : 0;
  lines.push(`VG1 grid1 0 DC ${g(vbias)} SIN(${g(vbias)} ${g(peak)} 1000)`, `VG2 grid2 0 DC ${g(vbias + offset2)} SIN(${g(vbias + offset2)} ${g(peak)} 1000 0 0 180)`);
  // A 10 F bypass holds the cathode at its idle voltage through the run, as the model takes it (its time constant is
  // thousands of seconds; a real one's is seconds, over which a class AB stage's rising average current lifts the bias).
  lines.push(d.bias === 'cathode' ? `RK cathode 0 ${g(d.rk)}\nCK cathode 0 ${settle ? g(settle.ck) : 10}` : 'VK cathode 0 DC 0');
  if (pentode) {
    const screen = (k: 1 | 2) => (d.connection === 'triode' ? `plate${k}` : ul ? `tap${k}` : 'screen');
    if (d.connection === 'pentode') lines.push(`VS screen 0 DC ${g(d.screenVolts)}`);
    lines.push(`X1 plate1 ${screen(1)} grid1 cathode one`, `X2 plate2 ${screen(2)} grid2 cathode two`);
  } else {
    lines.push('X1 plate1 grid1 cathode one', 'X2 plate2 grid2 cathode two');
  }
  lines.push('.control', 'set numdgt=12', 'op', 'print v(plate1) v(plate2) v(cathode) i(vb)', 'set nfreqs=10', 'set fourgridsize=16384', ...(settle
    ? [`tran 0.25u ${settle.ms}m ${settle.ms - 10}m 0.25u`, `meas tran vkavg avg v(cathode) from=${settle.ms - 10}m to=${settle.ms}m`, 'print vkavg']
    : ['tran 0.25u 60m 50m 0.25u']), ...(d.connection === 'pentode' && pentode ? [`meas tran isavg avg i(vs) from=${(settle?.ms ?? 60) - 1}m to=${settle?.ms ?? 60}m`, 'print isavg'] : []), 'fourier 1000 v(sec)', 'quit 0', '.endc', '.end');
  return lines.join('\n');
}
