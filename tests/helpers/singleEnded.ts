import type { OutputBench, SingleEndedBench } from '../../app/store/outputAnalysis';

/** The bench's output stage as the single-ended one these tests design; fails loudly if it is a pair. */
export function singleEnded(b: OutputBench): SingleEndedBench {
  if (b.pair !== 'single-ended') throw new Error('expected the single-ended output stage on the bench');
  return b;
}
