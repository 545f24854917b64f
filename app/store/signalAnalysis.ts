import { followerProblem, stageSignal, type ChainLink, type Failure, type SolvedStage, type StageDesign, type StageSignal } from '../../src/index';
import { lookupTube } from '../keep/customTubes';
import type { BenchDesign } from './analysis';
import { loadAfterBench } from './stagePlans';

/** What the signal views show; the model works it all out (stageSignal), the store only names the stages. */
export type SignalAnalysis = StageSignal;

/** The bench's second stage as the model's chain link: a follower, or a gain stage kept from a design before version 3. */
function secondLink(d: BenchDesign): ChainLink | null {
  const s2 = d.stage2;
  const tube = lookupTube(s2.tubeId);
  if (s2.kind === 'none' || !tube) return null;
  // The second stage drives the next gain stage's grid, or the amplifier's own load.
  const { rl } = loadAfterBench(d);
  if (s2.kind === 'follower') return { kind: 'follower', tube, bplus: d.bplus, rk: s2.rk, rl };
  return { kind: 'common-cathode', tube, bplus: d.bplus, ra: s2.ra, rk: s2.rk, rg: s2.rg, bypassed: true, rl };
}

/** The second stage at DC on the first's plate, for a drag's light pass (see followerProblem). */
export const secondStageProblem = (va: number, d: BenchDesign): Failure | null => followerProblem(va, secondLink(d));

export function analyzeSignal(s: SolvedStage, stage1: StageDesign, d: BenchDesign, prev: SignalAnalysis | null, light: boolean): SignalAnalysis {
  return stageSignal(s, stage1, secondLink(d), { levelRms: d.levelRms, thdLimit: d.thdLimit }, prev, light);
}
