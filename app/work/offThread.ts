import { proxy, wrap, type Remote } from 'comlink';
import type { ModelWorkerApi } from './modelWorker';
import type { FitOutcome } from './fitJob';
import type { readTubesFile } from '../keep/customTubes';

/**
 * Runs the heavy jobs off the page's thread, one at a time, each cancellable:
 * cancelling ends the worker outright (a fit cannot be interrupted from
 * outside), and the next job starts a fresh one. Where the platform has no
 * workers (tests in jsdom) the same job runs in place; production builds
 * leave that path out (every browser the workbench runs in has module
 * workers), so the fit's code is downloaded once, in the worker.
 */
type TubesRead = ReturnType<typeof readTubesFile>;

export interface OffThread {
  fit(csv: string, typicalCsv: string, onProgress: (done: number, of: number) => void): Promise<FitOutcome | 'cancelled'>;
  readTubes(text: string, maxTubes: number): Promise<TubesRead | 'cancelled'>;
  cancel(): void;
}

/**
 * The worker's script. Built, it is an entry of the page's own build
 * (vite.config.ts), beside the page's chunk in assets/, so the model code
 * both use is downloaded once, in chunks they share; in development the
 * server compiles the source as it is asked for.
 */
export const WORKER_SCRIPT = import.meta.env.PROD ? './modelWorker.js' : './modelWorker.ts';

export function createOffThread(): OffThread {
  let worker: Worker | null = null;
  let remote: Remote<ModelWorkerApi> | null = null;
  let cancelPending: (() => void) | null = null;
  const hasWorkers = typeof Worker !== 'undefined';
  const ensure = () => {
    if (!remote) {
      worker = new Worker(new URL(WORKER_SCRIPT, import.meta.url), { type: 'module' });
      remote = wrap<ModelWorkerApi>(worker);
    }
    return remote;
  };
  const run = <T>(job: () => Promise<T>): Promise<T | 'cancelled'> =>
    new Promise((resolve, reject) => {
      cancelPending = () => resolve('cancelled');
      job().then(resolve, reject).finally(() => (cancelPending = null));
    });
  const inPlace = async () => {
    if (import.meta.env.PROD) throw new Error('This browser cannot run background jobs (Web Workers): fitting and importing tubes need them.');
    const [{ fitJob }, { readTubesFile }] = await Promise.all([import('./fitJob'), import('../keep/customTubes')]);
    return { fitJob, readTubesFile };
  };
  return {
    fit: (csv, typicalCsv, onProgress) =>
      hasWorkers ? run(() => ensure().fitJob(csv, typicalCsv, proxy(onProgress))) : run(async () => (await inPlace()).fitJob(csv, typicalCsv, onProgress)),
    readTubes: (text, maxTubes) => run<TubesRead>(hasWorkers ? () => ensure().readTubesFile(text, maxTubes) as Promise<TubesRead> : async () => (await inPlace()).readTubesFile(text, maxTubes)),
    cancel: () => {
      worker?.terminate();
      worker = null;
      remote = null;
      cancelPending?.();
    },
  };
}
