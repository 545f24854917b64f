import { fail, type Result } from '../result';
import { csolveFlat } from '../signal/complex';
import { aWeighting } from './aWeighting';
import { chainGainAt, fillChain, REFERENCE_HZ, scratchFor, type ChainNetwork, type NoiseCurrent } from './chainResponse';

/** The band the noise is summed over, Hz: the audio band (common practice for a hi-fi noise figure), plain and A-weighted. */
export const NOISE_BAND_HZ = [20, 20e3] as const;
/** Points per decade of the sum (an even count of steps across the band, for Simpson's rule): the integrand is smooth in ln f, so four give both figures within half a percent of ngspice's 50 (and cost a sixth of a millisecond on a four-stage amplifier). */
const PER_DECADE = 4;

export interface ChainNoise {
  /** Noise at the output (the load, or the last stage's output), V rms, over NOISE_BAND_HZ. */
  readonly outputRms: number;
  /** The same referred to the source: over the midband gain at 1 kHz, V rms. */
  readonly inputRms: number;
  /** The output's noise A-weighted (IEC 61672-1), V rms: the figure hi-fi specifications quote. */
  readonly weightedRms: number;
}

/**
 * The amplifier's own white noise at its output: the thermal noise of
 * every resistance in its network (Nyquist, 4kT·Re(Y) as a current across
 * it) and each tube's plate-current noise (its equivalent noise resistance
 * 2.5/gm at the grid), each carried to the output through the network at
 * its frequency and the powers added (they are uncorrelated), summed over
 * 20 Hz to 20 kHz, plain and A-weighted (IEC 61672-1). One solve per frequency gives every transfer at once: the
 * output's row of the network's inverse, from the transposed equations
 * (the adjoint network). Left out: flicker noise (a tube's rises below a
 * few hundred hertz), the grid current's shot noise, a pentode's partition
 * noise, hum. Checked against ngspice's noise analysis
 * (tests/spice/chainNoise.spice.test.ts).
 */
export function chainNoise(net: ChainNetwork): Result<ChainNoise> {
  const scratch = scratchFor(net);
  const n = scratch.xr.length;
  const w = n + 1;
  const tr = new Float64Array(n * w);
  const ti = new Float64Array(n * w);
  const yr = new Float64Array(n);
  const yi = new Float64Array(n);
  const sources: NoiseCurrent[] = [];
  const [lo, hi] = NOISE_BAND_HZ;
  const count = Math.round(Math.log10(hi / lo) * PER_DECADE) + 1;
  let total = 0;
  let weighted = 0;
  for (let k = 0; k < count; k++) {
    const f = lo * Math.pow(hi / lo, k / (count - 1));
    sources.length = 0;
    const filled = fillChain(net, f, scratch, sources);
    // The transposed equations with the output's unit vector on the right: y·b is the output for any injected currents b.
    for (let r = 0; r < n; r++) {
      for (let c = 0; c < n; c++) {
        tr[r * w + c] = scratch.re[c * w + r]!;
        ti[r * w + c] = scratch.im[c * w + r]!;
      }
      tr[r * w + n] = r === filled.out ? filled.scale : r === filled.outRef ? -filled.scale : 0;
      ti[r * w + n] = 0;
    }
    if (!csolveFlat(tr, ti, n, yr, yi)) return fail('unreachable', 'The amplifier\'s network cannot be solved for its noise: check the values');
    // A current into the equation row (the feedback's source) would change its equation, not flow: the source absorbs it.
    const at = (node: number): [number, number] => (node < 0 || node === filled.equationRow ? [0, 0] : [yr[node]!, yi[node]!]);
    let density = 0;
    for (const s of sources) {
      const [ar, ai] = at(s.a);
      const [br, bi] = at(s.b);
      density += s.psd * ((ar - br) ** 2 + (ai - bi) ** 2);
    }
    // Simpson's rule in ln f, where the points are evenly spaced and the integrand (density times f) is smooth.
    const simpson = k === 0 || k === count - 1 ? 1 : k % 2 === 1 ? 4 : 2;
    total += simpson * density * f;
    weighted += simpson * density * f * aWeighting(f) ** 2;
  }
  const step = Math.log(hi / lo) / (count - 1);
  total *= step / 3;
  weighted *= step / 3;
  const gain = chainGainAt(net, REFERENCE_HZ, scratch);
  const outputRms = Math.sqrt(total);
  if (!Number.isFinite(outputRms) || !(gain > 0)) return fail('unreachable', 'The amplifier passes no signal at 1 kHz, so its noise cannot be referred to its input', 'stages');
  return { ok: true, outputRms, inputRms: outputRms / gain, weightedRms: Math.sqrt(weighted) };
}

/** The noise as a result carries it beside its other figures: null where it cannot be found (the band's edges are null alike). */
export function noiseFigures(net: ChainNetwork): ChainNoise | null {
  const n = chainNoise(net);
  return n.ok ? { outputRms: n.outputRms, inputRms: n.inputRms, weightedRms: n.weightedRms } : null;
}
