import { wrap, type Remote } from 'comlink';
import type { RegionSolver } from '../store/regionSlice';
import type { ModelWorkerApi } from './modelWorker';
import { WORKER_SCRIPT } from './offThread';

/**
 * The target region and the tube ranking, worked out in a Web Worker of
 * their own (the model worker's script, a second instance), so a drag never
 * waits for them and a long fit never holds them up. The region watcher
 * sends one job at a time, so nothing queues here.
 */
export function regionThread(): RegionSolver {
  let remote: Remote<ModelWorkerApi> | null = null;
  const worker = () => (remote ??= wrap<ModelWorkerApi>(new Worker(new URL(WORKER_SCRIPT, import.meta.url), { type: 'module' })));
  return {
    region: (stage, targets, grid) => worker().feasibleRegion(stage, targets, grid),
    rank: (targets, stage, tubes) => worker().rankTubes(targets, stage, tubes),
    followerRegion: (stage, targets, samples, rkRange) => worker().followerRegion(stage, targets, samples, rkRange),
    rankFollowers: (targets, stage, tubes) => worker().rankFollowers(targets, stage, tubes),
    outputRegion: (stage, targets, grid) => worker().outputRegion(stage, targets, grid),
    rankOutputs: (targets, stage) => worker().rankOutputTubes(targets, stage),
  };
}
