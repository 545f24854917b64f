import { fail, type Result } from '../result';
import { checkSupply } from './checkSupply';
import { dropLaw, rectifierCurrent } from './rectifierLaw';
import { supplyFindings } from './supplyFindings';
import type { SupplyDesign, SupplyNode, SupplySolution } from './supplyTypes';

/** Steps a mains cycle while the supply settles, and for the cycles that are measured. */
const SETTLE_STEPS = 400;
const MEASURE_STEPS = 4000;
const MAX_SETTLE_CYCLES = 5000;
const MAX_FINE_CYCLES = 400;

/**
 * The supply in the time domain, to its periodic steady state: backward
 * Euler (stiff-stable: the rectifier's pulses are far shorter than the
 * filter's time constants) on the ladder's node voltages and choke
 * currents, with the rectifier's law at the reservoir (a diode or a tube
 * plate) solved by Newton inside each step. The ladder is a chain, so each
 * step is one tridiagonal solve per Newton iteration. It runs with coarse
 * steps until a cycle's mean changes by less than a part in 10⁷ of the
 * secondary's peak, then at ten times the resolution until every node's
 * ripple holds to 0.1 % from one cycle to the next, and measures the next.
 * The transformer is a sine source behind its winding resistance (no
 * leakage inductance); the loads draw constant currents.
 */
export function solveSupply(d: SupplyDesign, options: { readonly start?: readonly number[] } | null = {}): Result<SupplySolution> {
  const problem = checkSupply(d);
  if (problem) return problem;
  const law = dropLaw(d.rectifier)!;
  const n = d.sections.length + 1;
  const caps = [d.input.c, ...d.sections.map((s) => s.c)];
  const peak = Math.SQRT2 * d.secondaryRms;
  const omega = 2 * Math.PI * d.mainsHz;
  const period = 1 / d.mainsHz;
  const rw = d.windingOhms;
  const choke = d.input.kind === 'choke' ? d.input : null;
  const totalLoad = d.loads.reduce((a, b) => a + b, 0);

  // State: node voltages, section currents (into node k from k−1; an RC section's follows its voltages), the input choke's current.
  const v = new Float64Array(n);
  const iSec = new Float64Array(n);
  let iChoke = 0;
  let drop = 0;
  for (let k = 0; k < n; k++) {
    v[k] = Math.max(peak - law.drop(Math.max(totalLoad, 1e-6) * 3) - drop, 0);
    const downstream = d.loads.slice(k + 1).reduce((a, b) => a + b, 0);
    const sec = d.sections[k];
    if (sec) drop += downstream * (sec.kind === 'rc' ? sec.r : sec.rdc);
    if (k > 0) iSec[k] = d.loads.slice(k).reduce((a, b) => a + b, 0);
  }
  if (choke) {
    iChoke = totalLoad;
    v[0] = Math.max((2 / Math.PI) * peak - totalLoad * (rw + choke.rdc), 0);
  }
  // A caller solving again with nearby loads (the amplifier on its supply) starts from the last node voltages.
  const start = options?.start;
  if (Array.isArray(start) && start.length === n && start.every((x) => typeof x === 'number' && Number.isFinite(x) && x >= 0 && x <= peak)) v.set(start);

  // Scratch for the tridiagonal solve.
  const lower = new Float64Array(n);
  const diag = new Float64Array(n);
  const upper = new Float64Array(n);
  const rhs = new Float64Array(n);
  const g = new Float64Array(n); // section conductances (index k: between k−1 and k)
  const a = new Float64Array(n); // section current sources
  const next = new Float64Array(n);
  let inflow = 0;

  /** Current into node 0 from the rectifier (through the input choke if any) for node-0 voltage v0, with its slope. */
  const inflowAt = (e: number, v0: number, h: number): { i: number; di: number } => {
    if (!choke) return rectifierCurrent(law, e, v0, rw);
    // Backward Euler on the choke: j = a0 + g0·(vr − v0), vr = e − rw·j − drop(j) while the rectifier conducts (j > 0).
    const g0 = 1 / (choke.l / h + choke.rdc);
    const a0 = (choke.l / h) * iChoke * g0;
    const push = a0 + g0 * (e - v0);
    if (!(push > 0)) return { i: 0, di: 0 };
    let lo = 0;
    let hi = push;
    let j = Math.min(iChoke > 0 ? iChoke : push, push);
    for (let k = 0; k < 60; k++) {
      const f = j * (1 + g0 * rw) + g0 * law.drop(j) - push;
      if (f > 0) hi = j;
      else lo = j;
      const nextJ = j - f / (1 + g0 * rw + g0 * law.slope(j));
      const stepJ = nextJ > lo && nextJ < hi ? nextJ : 0.5 * (lo + hi);
      if (Math.abs(stepJ - j) <= 1e-13 + 1e-11 * j) {
        j = stepJ;
        break;
      }
      j = stepJ;
    }
    return { i: j, di: -g0 / (1 + g0 * rw + g0 * law.slope(j)) };
  };

  const step = (t: number, h: number): void => {
    const e = peak * Math.abs(Math.sin(omega * t));
    for (let k = 1; k < n; k++) {
      const s = d.sections[k - 1]!;
      if (s.kind === 'rc') {
        g[k] = 1 / s.r;
        a[k] = 0;
      } else {
        g[k] = 1 / (s.l / h + s.rdc);
        a[k] = (s.l / h) * iSec[k]! * g[k]!;
      }
    }
    let guess = v[0]!;
    for (let iter = 0; iter < 30; iter++) {
      const flow = inflowAt(e, guess, h);
      for (let k = 0; k < n; k++) {
        const gIn = k > 0 ? g[k]! : 0;
        const gOut = k + 1 < n ? g[k + 1]! : 0;
        lower[k] = -gIn;
        upper[k] = -gOut;
        diag[k] = caps[k]! / h + gIn + gOut;
        rhs[k] = (caps[k]! / h) * v[k]! + (k > 0 ? a[k]! : 0) - (k + 1 < n ? a[k + 1]! : 0) - d.loads[k]!;
      }
      diag[0] = diag[0]! - flow.di;
      rhs[0] = rhs[0]! + flow.i - flow.di * guess;
      // Thomas algorithm: the matrix is diagonally dominant (every conductance and C/h positive).
      for (let k = 1; k < n; k++) {
        const m = lower[k]! / diag[k - 1]!;
        diag[k] = diag[k]! - m * upper[k - 1]!;
        rhs[k] = rhs[k]! - m * rhs[k - 1]!;
      }
      next[n - 1] = rhs[n - 1]! / diag[n - 1]!;
      for (let k = n - 2; k >= 0; k--) next[k] = (rhs[k]! - upper[k]! * next[k + 1]!) / diag[k]!;
      const moved = Math.abs(next[0]! - guess);
      guess = next[0]!;
      if (moved <= 1e-10 * peak) break;
    }
    const flow = inflowAt(e, next[0]!, h);
    inflow = flow.i;
    if (choke) iChoke = flow.i;
    for (let k = 1; k < n; k++) iSec[k] = a[k]! + g[k]! * (next[k - 1]! - next[k]!);
    v.set(next);
  };

  // Settle.
  let t = 0;
  let cycles = 0;
  let last = Infinity;
  const means = new Float64Array(n);
  const runCycle = (steps: number) => {
    const h = period / steps;
    means.fill(0);
    for (let k = 0; k < steps; k++) {
      t += h;
      step(t, h);
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
      step(t, h);
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
    if (cycles >= MAX_SETTLE_CYCLES) return fail('no-convergence', 'The supply did not settle within 5,000 mains cycles: check the filter values', 'sections');
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

  // Measure one cycle finely.
  const lo = new Float64Array(n).fill(Infinity);
  const hi = new Float64Array(n).fill(-Infinity);
  const sq = new Float64Array(n);
  const capSq = new Float64Array(n);
  let iPeak = 0;
  let iSq = 0;
  let conducting = 0;
  const prev = new Float64Array(n);
  const h = period / MEASURE_STEPS;
  means.fill(0);
  const samples: number[][] = Array.from({ length: n }, () => []);
  for (let k = 0; k < MEASURE_STEPS; k++) {
    prev.set(v);
    t += h;
    step(t, h);
    for (let m = 0; m < n; m++) {
      const x = v[m]!;
      means[m] = means[m]! + x / MEASURE_STEPS;
      lo[m] = Math.min(lo[m]!, x);
      hi[m] = Math.max(hi[m]!, x);
      samples[m]!.push(x);
      const ic = (caps[m]! * (x - prev[m]!)) / h;
      capSq[m] = capSq[m]! + (ic * ic) / MEASURE_STEPS;
    }
    iPeak = Math.max(iPeak, inflow);
    iSq += (inflow * inflow) / MEASURE_STEPS;
    if (inflow > 1e-9) conducting++;
  }
  for (let m = 0; m < n; m++) for (const x of samples[m]!) sq[m] = sq[m]! + ((x - means[m]!) * (x - means[m]!)) / MEASURE_STEPS;
  const nodes: SupplyNode[] = Array.from({ length: n }, (_, m) => ({
    dc: means[m]!,
    ripplePp: hi[m]! - lo[m]!,
    rippleRms: Math.sqrt(sq[m]!),
    capacitorRippleRms: Math.sqrt(capSq[m]!),
  }));
  const rectifierRms = Math.sqrt(iSq);
  const centreTapped = d.rectifier.kind !== 'silicon-bridge';
  const secondaryRmsCurrent = centreTapped ? rectifierRms / Math.SQRT2 : rectifierRms;
  const dcAtInput = nodes[0]!.dc;
  const solution: SupplySolution = {
    nodes,
    rectifierPeak: iPeak,
    rectifierRms,
    conductionDegrees: (conducting / MEASURE_STEPS) * 180,
    secondaryRmsCurrent,
    secondaryVa: (centreTapped ? 2 : 1) * d.secondaryRms * secondaryRmsCurrent,
    noLoadVolts: peak,
    // Common practice (full wave, from memory of the handbooks' rule): L ≥ R/(3ω) keeps a choke input conducting.
    criticalInductance: choke && totalLoad > 0 ? dcAtInput / totalLoad / (3 * omega) : null,
    cycles,
    findings: [],
  };
  return { ok: true, ...solution, findings: supplyFindings(d, solution) };
}
