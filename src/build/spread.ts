import { fail, type Result } from '../result';
import { solveStage, type StageSolution } from '../stage/solveStage';
import type { CheckedStage } from '../stage/stageDesign';
import { SERIES_TOLERANCE, type PreferredSeries } from '../parts/preferredValues';
import { triode } from '../tube/triode';
import { modelOf } from '../tube/types';
import { recordOf } from '../tube/types';
import { TUBE_CURRENT_SPREAD } from './partsList';
import { shown } from '../shown';

/** A small fast seeded generator (mulberry32, T. Ettinger, public domain), so a spread repeats exactly under one seed. */
export function seededRandom(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

export interface SpreadSample {
  readonly vpk: number;
  readonly ia: number;
  readonly va: number;
  readonly gain: number;
  readonly pa: number;
}

export interface Spread {
  readonly samples: readonly SpreadSample[];
  readonly nominal: SpreadSample;
  readonly range: { readonly [K in keyof SpreadSample]: readonly [number, number] };
}

/**
 * Production spread by Monte Carlo: resistors uniform within their series'
 * tolerance, the tube's current within ±20 % of the model (common practice),
 * applied by scaling Koren's kg1 (current ∝ 1/kg1). Seeded, so a design's
 * spread repeats exactly. Resistor tolerances are the series' own (IEC 60063
 * pairs E12 with ±10 %, E24 ±5 %, E96 ±1 %).
 */
export function productionSpread(d: CheckedStage, nominal: StageSolution, series: PreferredSeries, options: { runs?: number; seed?: number; tubeSpread?: number } = {}): Result<Spread> {
  const { runs = 200, seed = 1, tubeSpread = TUBE_CURRENT_SPREAD } = options;
  if (!(Number.isFinite(tubeSpread) && tubeSpread >= 0 && tubeSpread < 1)) return fail('invalid-input', `The tube's current spread must be from 0 % to under 100 % (got ${shown(tubeSpread * 100)} %)`, 'tubeSpread');
  if (!(Number.isInteger(runs) && runs >= 1 && runs <= 10_000)) return fail('invalid-input', `Runs must be a whole number from 1 to 10000 (got ${shown(runs)})`, 'runs');
  const rnd = seededRandom(seed);
  const tol = (t: number) => 1 + t * (2 * rnd() - 1);
  const base = modelOf(d.tube);
  const rec = recordOf(d.tube);
  const rTol = SERIES_TOLERANCE[series];
  const samples: SpreadSample[] = [];
  for (let k = 0; k < runs; k++) {
    const currentFactor = tol(tubeSpread);
    const model = triode({ ...base.params, kg1: base.params.kg1 / currentFactor }, base.gridResistance);
    const tube = rec ? { ...rec, model } : model;
    const s = solveStage({ tube, bplus: d.bplus, ra: d.ra * tol(rTol), rk: d.rk * tol(rTol), bypassed: d.bypassed, rl: d.rl, vbias: d.vbias });
    if (s.ok) samples.push({ vpk: s.op.vpk, ia: s.op.ia, va: s.op.va, gain: s.gain, pa: s.op.pa });
  }
  const nom = { vpk: nominal.op.vpk, ia: nominal.op.ia, va: nominal.op.va, gain: nominal.gain, pa: nominal.op.pa };
  const all = [nom, ...samples];
  const span = (k: keyof SpreadSample) => [Math.min(...all.map((x) => x[k])), Math.max(...all.map((x) => x[k]))] as const;
  return { ok: true, samples, nominal: nom, range: { vpk: span('vpk'), ia: span('ia'), va: span('va'), gain: span('gain'), pa: span('pa') } };
}
