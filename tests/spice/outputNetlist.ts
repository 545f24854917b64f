import type { OutputDesign, OutputTube } from '../../src/index';
import { pentodeSubckt, triodeSubckt } from '../../src/netlist/tubeSubckts';

export { pentodeSubckt };

/**
 * A transformer-coupled single-ended stage for ngspice: Koren's pentode law
 * as two behavioural current sources (plate and screen), the transformer as
 * coupled inductors (100 H primary, k = 0.999999: at 1 kHz the magnetising
 * reactance is 630 kΩ and the leakage about 1 Ω, so it acts as the ideal
 * transformer the model assumes) with the primary's DC resistance in series
 * between the winding and the plate, where the model puts it. An
 * ultralinear primary is two coupled windings split at the tap. Cathode bias is bypassed by 10 mF. The grid is driven by a 1 kHz sine
 * of `peak` volts; ngspice's Fourier analysis reads the secondary.
 */
const g = (x: number) => x.toPrecision(12);
const L_PRIMARY = 100;
const K = 0.999999;

/** A settling run: its length, the cathode bypass, and the primary's inductance where not the 100 H (H). */
export interface Settle {
  readonly ck: number;
  readonly ms: number;
  readonly lp?: number;
}

/**
 * `measureScreen`: also print a pentode screen supply's current averaged over the last cycle (isavg; negative: into
 * the screen). `settle`: a run of `ms` milliseconds (and the cathode bypass `ck`), long enough for the primary's
 * magnetising current (and a bypassed cathode) to settle under the drive (its time constant is Lp over the
 * reflected load in parallel with the plate's resistance: `lp` shortens it for a triode's low rp); the cathode's average over the last 10 ms
 * is printed as vkavg, and the Fourier analysis reads the last cycle.
 */
export function outputNetlist(tube: OutputTube, d: OutputDesign, peak: number, measureScreen = false, settle?: Settle): string {
  const lPrimary = settle?.lp ?? L_PRIMARY;
  const n2 = d.zPrimary / d.speakerOhms;
  const ul = d.connection === 'ultralinear' && tube.law.kind === 'pentode';
  const lines: string[] = ['* single-ended transformer-coupled output stage'];
  if (tube.law.kind === 'pentode') lines.push(pentodeSubckt(tube.law.params));
  else lines.push(triodeSubckt('tri', tube.law.tube.model.params));
  lines.push(`VB bplus 0 DC ${g(d.bplus)}`, `RPRI bottom plate ${g(Math.max(d.rPrimary, 1e-6))}`);
  if (ul) {
    const x = d.ulTap;
    lines.push(`LA bplus tap ${g(lPrimary * x * x)}`, `LB tap bottom ${g(lPrimary * (1 - x) * (1 - x))}`, `KAB LA LB ${K}`, `KAS LA LS ${K}`, `KBS LB LS ${K}`);
  } else {
    lines.push(`LP bplus bottom ${g(lPrimary)}`, `KPS LP LS ${K}`);
  }
  lines.push(`LS sec 0 ${g(lPrimary / n2)}`, `RSPK sec 0 ${g(d.speakerOhms)}`);
  const vbias = d.bias === 'fixed' ? d.vg : 0;
  lines.push(`VG grid 0 DC ${g(vbias)} SIN(${g(vbias)} ${g(peak)} 1000)`);
  lines.push(d.bias === 'cathode' ? `RK cathode 0 ${g(d.rk)}\nCK cathode 0 ${settle ? g(settle.ck) : '10m'}` : 'VK cathode 0 DC 0');
  if (tube.law.kind === 'pentode') {
    const screen = d.connection === 'triode' ? 'plate' : ul ? 'tap' : 'screen';
    if (d.connection === 'pentode') lines.push(`VS screen 0 DC ${g(d.screenVolts)}`);
    lines.push(`X1 plate ${screen} grid cathode pent`);
  } else {
    lines.push('X1 plate grid cathode tri');
  }
  lines.push('.control', 'set numdgt=12', 'op', 'print v(plate) v(cathode) i(vb)', 'set nfreqs=10', 'set fourgridsize=16384', ...(settle
    ? [`tran 0.5u ${settle.ms}m ${settle.ms - 10}m 0.5u`, `meas tran vkavg avg v(cathode) from=${settle.ms - 10}m to=${settle.ms}m`, 'print vkavg']
    : ['tran 0.25u 5m 0 0.25u']), ...(measureScreen ? [`meas tran isavg avg i(vs) from=${(settle?.ms ?? 5) - 1}m to=${settle?.ms ?? 5}m`, 'print isavg'] : []), 'fourier 1000 v(sec)', 'quit 0', '.endc', '.end');
  return lines.join('\n');
}
