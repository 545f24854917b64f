import { CUTOFF_FRACTION } from '../tube/koren';
import { GRID_CURRENT_ONSET } from '../tube/gridCurrent';
import { modelOf, type TubeLike } from '../tube/types';
import { fail, type Result } from '../result';
import { solveFollower, type FollowerSolution } from '../stage/solveFollower';
import { solveStage, type StageSolution } from '../stage/solveStage';
import { normalizeStage, type StageDesign } from '../stage/stageDesign';
import { parallel } from '../stage/parallel';
import { sineLevel, type Level } from './levels';
import { followerTransfer } from './followerTransfer';
import { stageTransfer } from './stageTransfer';

/** A link of a chain: a common-cathode stage, or a cathode follower direct-coupled to the plate before it. */
export type ChainLink =
  | ({ readonly kind: 'common-cathode' } & StageDesign)
  | { readonly kind: 'follower'; readonly tube: TubeLike; readonly bplus: number; readonly rk: number; readonly rl?: number; readonly heaterVolts?: number };

export type LinkResult = ({ readonly kind: 'common-cathode' } & StageSolution) | ({ readonly kind: 'follower' } & FollowerSolution);

export interface LinkChainResult {
  readonly links: readonly LinkResult[];
  /** Overall voltage gain, signed: negative means the chain inverts. */
  readonly gain: number;
  readonly inverting: boolean;
  /** Output impedance of the last link, Ω. */
  readonly zout: number;
  /** Largest clean input peak for the whole chain, V, the output peak there, and which link limits it. */
  readonly inputPeak: number;
  readonly input: Level;
  readonly outputPeak: number;
  readonly output: Level;
  readonly limitedBy: { readonly link: number; readonly by: 'grid-current' | 'cutoff' };
}

/**
 * Solves a one- or two-link chain (the first version's input, kept working:
 * `solveChain` answers an array with this). A common-cathode second link is coupled
 * through a capacitor, so its grid leak Rg loads the first plate; a follower
 * is direct-coupled, its grid at the first plate's voltage, and loads it not
 * at all (no grid current below 0 V). The combined clean swing comes from the
 * large-signal transfers composed sample by sample.
 */
export function solveLinks(links: readonly ChainLink[]): Result<LinkChainResult> {
  if (!Array.isArray(links) || links.length < 1 || links.length > 2) return fail('invalid-input', 'A chain has one or two links');
  if (!links.every((l) => typeof l === 'object' && l !== null)) return fail('invalid-input', 'Every link of a chain must be a stage design', 'links');
  const first = links[0]!;
  if (first.kind !== 'common-cathode') return fail('invalid-input', 'The first link must be a common-cathode stage', 'links');
  const second = links[1];
  let loadOnFirst = first.rl ?? Infinity;
  if (second?.kind === 'common-cathode') {
    if (second.rg === undefined) return fail('invalid-input', 'A capacitor-coupled second stage needs its grid leak Rg', 'rg');
    loadOnFirst = parallel(loadOnFirst, second.rg);
  }
  const firstDesign: StageDesign = { ...first, rl: loadOnFirst };
  const s1 = solveStage(firstDesign);
  if (!s1.ok) return { ...s1, message: `Stage 1: ${s1.message}` };
  const c1 = normalizeStage(firstDesign);
  if (!c1.ok) return c1;
  const t1 = stageTransfer(c1, s1.op);
  const results: LinkResult[] = [{ kind: 'common-cathode', ...s1 }];

  // Each link's output at an input peak, and the tests that end its clean swing.
  let output: (vin: number) => number = (vin) => t1.at(vin).vout;
  const limits: { link: number; by: 'grid-current' | 'cutoff'; hit: (vin: number) => boolean }[] = [
    { link: 0, by: 'grid-current', hit: (v) => t1.at(v).vgk >= GRID_CURRENT_ONSET },
    { link: 0, by: 'cutoff', hit: (v) => t1.at(-v).ia <= CUTOFF_FRACTION * s1.op.ia },
  ];
  let gain = s1.gain;
  let zout = s1.zout;

  if (second?.kind === 'follower') {
    const f = solveFollower({ tube: second.tube, bplus: second.bplus, vgrid: s1.op.va, rk: second.rk, rl: second.rl, heaterVolts: second.heaterVolts });
    if (!f.ok) return { ...f, message: `Follower: ${f.message}` };
    results.push({ kind: 'follower', ...f });
    const tf = followerTransfer(modelOf(second.tube), second.bplus, second.rk, second.rl ?? Infinity, f.op);
    const at = (v: number) => tf(s1.op.va + t1.at(v).vout);
    output = (v) => at(v).vk - f.op.vk;
    limits.push({ link: 1, by: 'grid-current', hit: (v) => at(-v).vgk >= GRID_CURRENT_ONSET || at(v).vgk >= GRID_CURRENT_ONSET });
    limits.push({ link: 1, by: 'cutoff', hit: (v) => at(v).ia <= CUTOFF_FRACTION * f.op.ia || at(-v).ia <= CUTOFF_FRACTION * f.op.ia });
    gain *= f.gain;
    zout = f.zout;
  } else if (second?.kind === 'common-cathode') {
    const s2 = solveStage(second);
    if (!s2.ok) return { ...s2, message: `Stage 2: ${s2.message}` };
    const c2 = normalizeStage(second);
    if (!c2.ok) return c2;
    results.push({ kind: 'common-cathode', ...s2 });
    const t2 = stageTransfer(c2, s2.op);
    const at = (v: number) => t2.at(t1.at(v).vout);
    output = (v) => at(v).vout;
    limits.push({ link: 1, by: 'grid-current', hit: (v) => at(v).vgk >= GRID_CURRENT_ONSET || at(-v).vgk >= GRID_CURRENT_ONSET });
    limits.push({ link: 1, by: 'cutoff', hit: (v) => at(v).ia <= CUTOFF_FRACTION * s2.op.ia || at(-v).ia <= CUTOFF_FRACTION * s2.op.ia });
    gain *= s2.gain;
    zout = s2.zout;
  }

  // Each limit's input peak by bisection (each test is monotone in the peak); the chain is clean below the smallest.
  let best = { peak: Infinity, link: 0, by: 'grid-current' as 'grid-current' | 'cutoff' };
  for (const lim of limits) {
    let hi = Math.max(1e-3, -s1.op.vgk);
    for (let k = 0; k < 60 && !lim.hit(hi); k++) hi *= 2;
    if (!lim.hit(hi)) continue;
    let lo = 0;
    for (let k = 0; k < 60; k++) {
      const mid = 0.5 * (lo + hi);
      if (lim.hit(mid)) hi = mid;
      else lo = mid;
    }
    if (hi < best.peak) best = { peak: hi, link: lim.link, by: lim.by };
  }
  const inputPeak = best.peak;
  const outputPeak = Math.abs(output(inputPeak) - output(-inputPeak)) / 2;
  return {
    ok: true,
    links: results,
    gain,
    inverting: gain < 0,
    zout,
    inputPeak,
    input: sineLevel(inputPeak),
    outputPeak,
    output: sineLevel(outputPeak),
    limitedBy: { link: best.link, by: best.by },
  };
}
