import { fail, type Result } from '../result';
import { shown } from '../shown';

/** One period of a square wave's steady state through a linear response, from the rising edge. */
export interface SquareWave {
  /** The square wave's frequency, Hz. */
  readonly hz: number;
  /** Instants across one period, s, evenly spaced from the rising edge. */
  readonly t: readonly number[];
  /** The output at each instant, the midband gain taken out: a response flat everywhere gives ±1. */
  readonly v: readonly number[];
}

/** Odd harmonics summed: up to the 199th, so a 10 kHz square wave is followed to 2 MHz. */
const HARMONICS = 199;
const SAMPLES = 320;
/** A square wave's frequency, Hz: any a bench could set, its harmonics and instants finite. */
const HZ_LIMITS = { min: 1e-3, max: 1e9 } as const;

/** The midband gains a square wave may be referred to: past any amplifier either way, yet their squares stay finite. */
const REFERENCE_LIMITS = { min: 1e-30, max: 1e30 } as const;

/**
 * The steady-state response to a square wave of ±1, by its Fourier series
 * (4/π)·Σ sin(2πkft)/k over odd k, each harmonic through the response
 * G(kf) = H(kf)/±|H(reference)| (against midband's gain and sign). What
 * the response still passes at the 199th harmonic goes through as the exact
 * square wave, and only the rest as the series cut there: that rest has died
 * away by then, so cutting it adds no ripple of its own (Gibbs') and what
 * rings is the response's. Checked against the textbook's exponentials for a first-order low
 * and high pass (tests/signal/squareWave.test.ts).
 */
export function squareWave(response: (hz: number) => readonly [number, number] | null, hz: number, reference: readonly [number, number]): Result<SquareWave> {
  if (typeof response !== 'function') return fail('invalid-input', 'A response to put the square wave through is needed', 'response');
  if (!(typeof hz === 'number' && hz >= HZ_LIMITS.min && hz <= HZ_LIMITS.max)) return fail('invalid-input', `The square wave's frequency must be from 1 mHz to 1 GHz (got ${shown(hz)} Hz)`, 'hz');
  const refMag = Array.isArray(reference) ? Math.hypot(reference[0], reference[1]) : NaN;
  if (!(refMag >= REFERENCE_LIMITS.min && refMag <= REFERENCE_LIMITS.max)) return fail('invalid-input', `The midband gain to refer the square wave to must be from ${REFERENCE_LIMITS.min} to ${REFERENCE_LIMITS.max} (got ${shown(refMag)})`, 'reference');
  // The midband gain's size and sign only: its few degrees of phase at 1 kHz belong to the response (a constant phase
  // turn added to every harmonic would bend the square wave, not delay it).
  const rr = (reference[0] < 0 ? -1 : 1) * refMag;
  const ri = 0;
  const gains: [number, number][] = [];
  for (let k = 1; k <= HARMONICS; k += 2) {
    const h = response(k * hz);
    if (!Array.isArray(h) || !Number.isFinite(h[0]) || !Number.isFinite(h[1])) return fail('unreachable', `The response could not be worked out at ${shown(k * hz)} Hz`, 'hz');
    // G = H / H_ref.
    const g: [number, number] = [(h[0] * rr + h[1] * ri) / (refMag * refMag), (h[1] * rr - h[0] * ri) / (refMag * refMag)];
    if (!Number.isFinite(g[0]) || !Number.isFinite(g[1])) return fail('unreachable', `The response at ${shown(k * hz)} Hz is out of all proportion to the midband gain`, 'reference');
    gains.push(g);
  }
  // What the response still passes at the last harmonic passes the edges whole: that share is drawn as the exact square
  // wave, and only the rest as the series (a 1/k series converges slowly near an edge; the rest dies away fast).
  const through = gains[gains.length - 1]![0];
  const terms = gains.map(([gr, gi], j) => {
    const k = 2 * j + 1;
    const [dr, di] = [gr - through, gi];
    return { k, amp: ((4 / Math.PI) * Math.hypot(dr, di)) / k, phase: Math.atan2(di, dr) };
  });
  const t = Array.from({ length: SAMPLES }, (_, j) => j / (SAMPLES * hz));
  const half = SAMPLES / 2;
  const v = t.map((s, j) => (j === 0 || j === half ? 0 : j < half ? through : -through) + terms.reduce((sum, { k, amp, phase }) => sum + amp * Math.sin(2 * Math.PI * k * hz * s + phase), 0));
  return { ok: true, hz, t, v };
}
