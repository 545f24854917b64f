/**
 * One job at a time, and only the newest waiting: a job asked for while one
 * runs waits for it, and a newer ask replaces it ('cancelled' at once). The
 * running job's answer is 'cancelled' too when a newer one was asked for
 * meanwhile. A worker cannot drop a message it has queued: without this, a
 * burst of changes to a supply that takes seconds to solve had the worker
 * solve every one in turn before the newest.
 */
export function latestOnly<I, R>(job: (input: I) => Promise<R>): (input: I) => Promise<R | 'cancelled'> {
  let latest = 0;
  let running = false;
  let waiting: { input: I; mine: number; settle: (r: Promise<R | 'cancelled'>) => void } | null = null;
  const run = async (input: I, mine: number): Promise<R | 'cancelled'> => {
    running = true;
    try {
      const r = await job(input);
      return mine === latest ? r : 'cancelled';
    } finally {
      running = false;
      const next = waiting;
      waiting = null;
      if (next) next.settle(run(next.input, next.mine));
    }
  };
  return (input) => {
    const mine = ++latest;
    if (!running) return run(input, mine);
    waiting?.settle(Promise.resolve('cancelled'));
    return new Promise((settle) => (waiting = { input, mine, settle }));
  };
}
