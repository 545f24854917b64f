import { chainStageParts, type PreferredSeries, type StageParts } from '../../src/index';
import type { AmplifierView } from './amplifierChain';

/**
 * The parts of the amplifier's stages not on the bench (the bench's own come
 * from its analysis), each rated by the model from its own operating point
 * in the solved amplifier: every voltage stage off the bench, and the phase
 * splitter before a pair. The output stage's come from its own analysis.
 */
export function offBenchParts(view: AmplifierView, onBench: ReadonlySet<number>, series: PreferredSeries): StageParts[] {
  const amp = view.result;
  if (!amp.ok) return [];
  const out: StageParts[] = [];
  for (const [i, name] of view.names.entries()) {
    if (name.role === 'output' || onBench.has(i)) continue;
    const parts = chainStageParts(view.input, amp, i, series);
    if (parts) out.push(parts);
  }
  return out;
}
