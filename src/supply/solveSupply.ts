import { fail, type Result } from '../result';
import { checkSupply } from './checkSupply';
import { dropLaw } from './rectifierLaw';
import { reservoirGuess } from './reservoirGuess';
import { shootSteadyState } from './shootSteadyState';
import { supplyFindings } from './supplyFindings';
import { openCircuitWinding } from './winding';
import { supplyStepper, type SupplyStepper } from './supplyStepper';
import type { SupplyDesign, SupplyNode, SupplySolution } from './supplyTypes';

/** Steps a mains cycle while marching to the steady state, and for the cycles that are measured. */
const SETTLE_STEPS = 400;
const MEASURE_STEPS = 4000;
const MAX_SETTLE_CYCLES = 5000;
const MAX_FINE_CYCLES = 400;
/** One in this many measured steps is kept for the waveform (400 points a rectified period). */
const WAVE_EVERY = 5;

/**
 * The supply in the time domain, at its periodic steady state: backward
 * Euler with the rectifier's law (supplyStepper), the steady state found by
 * shooting (shootSteadyState), or where that does not converge by marching
 * cycle after cycle until it settles; then one period measured at 4,000
 * steps a mains cycle.
 */
export interface SupplySolveOptions {
  /** Node voltages to start from (a nearby solution), V. */
  readonly start?: readonly number[];
  /** 'marching' skips shooting: the slower fallback, selectable so tests hold both paths to an outside reference. */
  readonly steady?: 'shooting' | 'marching';
}

export function solveSupply(asked: SupplyDesign, options: SupplySolveOptions | null = {}): Result<SupplySolution> {
  const problem = checkSupply(asked);
  if (problem) return problem;
  // From here on the secondary is its open-circuit voltage behind its resistance.
  const winding = openCircuitWinding(asked);
  const d: SupplyDesign = { ...asked, secondaryRms: winding.emfRms, windingOhms: winding.ohms };
  const law = dropLaw(d.rectifier)!;
  const st = supplyStepper(d, law);
  const n = st.nodes;
  const v = st.v;
  const caps = st.caps;
  const peak = Math.SQRT2 * d.secondaryRms;
  const omega = 2 * Math.PI * d.mainsHz;
  const period = 1 / d.mainsHz;
  const choke = d.input.kind === 'choke' ? d.input : null;
  // The rectified source repeats every half mains cycle, or every cycle behind a half-wave rectifier.
  const halfWave = d.rectifier.kind === 'silicon-half-wave';
  const rectified = halfWave ? period : period / 2;
  const measured = halfWave ? MEASURE_STEPS : MEASURE_STEPS / 2;
  const totalLoad = d.loads.reduce((a, b) => a + b, 0);

  // A first guess at the steady state: the peak less the rectifier's drop at the pulses' current (behind a reservoir,
  // less what the winding's resistance takes at the load: reservoirGuess) and each section's IR drop.
  const guess = new Float64Array(st.stateSize);
  const diodeDrop = law.drop(Math.max(totalLoad, 1e-6) * 3);
  const top = choke ? peak - diodeDrop : reservoirGuess(peak, diodeDrop, d.windingOhms, totalLoad, halfWave ? 1 : 2);
  let drop = 0;
  for (let k = 0; k < n; k++) {
    guess[k] = Math.max(top - drop, 0);
    const downstream = d.loads.slice(k + 1).reduce((a, b) => a + b, 0);
    const sec = d.sections[k];
    if (sec) drop += downstream * (sec.kind === 'rc' ? sec.r : sec.rdc);
  }
  let j = n;
  d.sections.forEach((sec, i) => {
    if (sec.kind === 'lc') guess[j++] = d.loads.slice(i + 1).reduce((a, b) => a + b, 0);
  });
  if (choke) {
    guess[st.stateSize - 1] = totalLoad;
    const shift = guess[0]! - Math.max((2 / Math.PI) * peak - totalLoad * (d.windingOhms + choke.rdc), 0);
    for (let k = 0; k < n; k++) guess[k] = Math.max(guess[k]! - shift, 0);
  }
  // A caller solving again with nearby loads (the amplifier on its supply) starts from the last node voltages.
  const start = options?.start;
  if (Array.isArray(start) && start.length === n && start.every((x) => typeof x === 'number' && Number.isFinite(x) && x >= 0 && x <= peak)) guess.set(start);

  const shot = options?.steady === 'marching' ? null : shootSteadyState(st, guess, rectified, measured);
  let cycles: number;
  if (shot) {
    st.writeState(shot.state);
    cycles = (shot.periods * rectified) / period;
  } else {
    st.writeState(guess);
    const marched = marchToSteadyState(st, peak, period);
    if (marched === null) return fail('no-convergence', 'The supply did not settle within 5,000 mains cycles: check the filter values', 'sections');
    cycles = marched;
  }
  const means = new Float64Array(n);

  // Measure one period of the rectified source (half a mains cycle, both halves alike; a whole one behind half-wave) at the fine step.
  const lo = new Float64Array(n).fill(Infinity);
  const hi = new Float64Array(n).fill(-Infinity);
  const sq = new Float64Array(n);
  const capSq = new Float64Array(n);
  let iPeak = 0;
  let iSq = 0;
  let conducting = 0;
  const prev = new Float64Array(n);
  const h = rectified / measured;
  const samples: number[][] = Array.from({ length: n }, () => []);
  const waveT: number[] = [];
  const waveI: number[] = [];
  const waveV: number[] = [];
  for (let k = 0; k < measured; k++) {
    prev.set(v);
    const t = (k + 1) * h;
    st.step(t, h);
    const inflow = st.inflow();
    for (let m = 0; m < n; m++) {
      const x = v[m]!;
      means[m] = means[m]! + x / measured;
      lo[m] = Math.min(lo[m]!, x);
      hi[m] = Math.max(hi[m]!, x);
      samples[m]!.push(x);
      const ic = (caps[m]! * (x - prev[m]!)) / h;
      capSq[m] = capSq[m]! + (ic * ic) / measured;
    }
    iPeak = Math.max(iPeak, inflow);
    iSq += (inflow * inflow) / measured;
    if ((k + 1) % WAVE_EVERY === 0) {
      waveT.push(t);
      waveI.push(inflow);
      waveV.push(v[0]!);
    }
    if (inflow > 1e-9) conducting++;
  }
  for (let m = 0; m < n; m++) for (const x of samples[m]!) sq[m] = sq[m]! + ((x - means[m]!) * (x - means[m]!)) / measured;
  const nodes: SupplyNode[] = Array.from({ length: n }, (_, m) => ({
    dc: means[m]!,
    ripplePp: hi[m]! - lo[m]!,
    rippleRms: Math.sqrt(sq[m]!),
    capacitorRippleRms: Math.sqrt(capSq[m]!),
  }));
  const rectifierRms = Math.sqrt(iSq);
  // Each half of a centre-tapped winding carries every other pulse; a bridge's and a half-wave's winding carries them all.
  const centreTapped = d.rectifier.kind !== 'silicon-bridge' && !halfWave;
  const secondaryRmsCurrent = centreTapped ? rectifierRms / Math.SQRT2 : rectifierRms;
  const dcAtInput = nodes[0]!.dc;
  const solution: SupplySolution = {
    nodes,
    rectifierPeak: iPeak,
    rectifierRms,
    conductionDegrees: (conducting / measured) * (halfWave ? 360 : 180),
    secondaryRmsCurrent,
    // Rated as a transformer is: its rated-load voltage times the current.
    secondaryVa: (centreTapped ? 2 : 1) * asked.secondaryRms * secondaryRmsCurrent,
    noLoadVolts: peak,
    // Common practice (full wave, from memory of the handbooks' rule): L ≥ R/(3ω) keeps a choke input conducting.
    criticalInductance: choke && totalLoad > 0 ? dcAtInput / totalLoad / (3 * omega) : null,
    cycles,
    wave: { t: waveT, rectifierAmps: waveI, reservoirVolts: waveV },
    findings: [],
  };
  return { ok: true, ...solution, findings: supplyFindings(asked, solution) };
}

/**
 * The fallback when shooting does not converge: march from the stepper's
 * state with coarse steps until a cycle's mean changes by less than a part
 * in 10⁷ of the secondary's peak, then at ten times the resolution until
 * every node's ripple holds to 0.1 % from one cycle to the next. Answers the
 * mains cycles it took, or null when it did not settle.
 */
function marchToSteadyState(st: SupplyStepper, peak: number, period: number): number | null {
  const n = st.nodes;
  const v = st.v;
  let t = 0;
  let cycles = 0;
  let last = Infinity;
  const means = new Float64Array(n);
  const runCycle = (steps: number) => {
    const h = period / steps;
    means.fill(0);
    for (let k = 0; k < steps; k++) {
      t += h;
      st.step(t, h);
      for (let m = 0; m < n; m++) means[m] = means[m]! + v[m]! / steps;
    }
    cycles++;
  };
  /** One cycle at `steps` a cycle, answering each node's ripple peak to peak. */
  const ripplesOfCycle = (steps: number): Float64Array => {
    const h = period / steps;
    const lo = new Float64Array(n).fill(Infinity);
    const hi = new Float64Array(n).fill(-Infinity);
    for (let k = 0; k < steps; k++) {
      t += h;
      st.step(t, h);
      for (let m = 0; m < n; m++) {
        lo[m] = Math.min(lo[m]!, v[m]!);
        hi[m] = Math.max(hi[m]!, v[m]!);
      }
    }
    cycles++;
    return hi.map((x, m) => x - lo[m]!);
  };
  for (;;) {
    runCycle(SETTLE_STEPS);
    const change = Math.abs(means[0]! - last);
    last = means[0]!;
    if (change < 1e-7 * peak && cycles > 3) break;
    if (cycles >= MAX_SETTLE_CYCLES) return null;
  }
  // At the finer step the slow nodes' ripple settles again (measured: after a coarse settle, three fine cycles left the
  // ripple behind an L–C section 30 % high); run fine cycles until every node's ripple holds to 0.1 %.
  let prevPp: Float64Array | null = null;
  for (let k = 0; k < MAX_FINE_CYCLES; k++) {
    const pp = ripplesOfCycle(MEASURE_STEPS);
    const steady = prevPp !== null && pp.every((x, m) => Math.abs(x - prevPp![m]!) <= 1e-3 * x + 1e-9 * peak);
    prevPp = pp;
    if (steady) break;
  }
  // Whole cycles, so the measured cycle that follows starts where the source does.
  return cycles;
}
