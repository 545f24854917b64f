import { wrap, type Remote } from 'comlink';
import type { AmplifierOnSupply, AmplifierOnSupplyResult, Result } from '../../src/index';
import type { LowEndSolver, SupplySolver } from '../store/supplySlice';
import type { ModelWorkerApi } from './modelWorker';
import { latestOnly } from './latestOnly';
import { WORKER_SCRIPT } from './offThread';

/**
 * Solves the amplifier on its supply in a Web Worker of its own (the model
 * worker's script, which also works out its low end: lowEndInWorker), so the page's thread never spends the rounds of stages
 * and supply (tens of milliseconds each) while a drag or typing goes on. The
 * worker shares the page's chunk of model code (vite.config.ts), so this
 * costs no second download. A newer solve makes an older one's answer
 * 'cancelled' (the worker finishes the one it is on, unseen), and replaces
 * any still waiting for it (latestOnly).
 */
export function supplyInWorker(): SupplySolver {
  return latestOnly((input: AmplifierOnSupply): Promise<Result<AmplifierOnSupplyResult>> => supplyWorker().solveOnSupply(input));
}

/** The amplifier's low end on its solved supply, in the same worker (its sweeps take tens of milliseconds). */
export function lowEndInWorker(): LowEndSolver {
  return (input, solved) => supplyWorker().supplyLowEnd(input, solved);
}

/** The one worker both use, started on first need. */
let remote: Remote<ModelWorkerApi> | null = null;
function supplyWorker(): Remote<ModelWorkerApi> {
  remote ??= wrap<ModelWorkerApi>(new Worker(new URL(WORKER_SCRIPT, import.meta.url), { type: 'module' }));
  return remote;
}
