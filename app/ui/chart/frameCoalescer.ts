/**
 * At most one model update per animation frame: moves that arrive faster are
 * coalesced to the latest. `flush` runs a pending update at once (a release).
 */
export function frameCoalescer(): { schedule: (fn: () => void) => void; flush: () => void; cancel: () => void } {
  let frame = 0;
  let pending: (() => void) | null = null;
  const run = () => {
    frame = 0;
    const fn = pending;
    pending = null;
    fn?.();
  };
  return {
    schedule: (fn) => {
      pending = fn;
      if (!frame) frame = requestAnimationFrame(run);
    },
    flush: () => {
      if (frame) cancelAnimationFrame(frame);
      run();
    },
    cancel: () => {
      if (frame) cancelAnimationFrame(frame);
      frame = 0;
      pending = null;
    },
  };
}
