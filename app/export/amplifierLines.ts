import { plain, rmsLevel, watts } from '../format';
import type { WorkbenchState } from '../store/workbenchStore';

/**
 * The whole amplifier on the card, when it is more than one stage: the chain
 * input to output, its gain and band, its clean limit and the input for it,
 * and the input and THD at the working level. Null for a single stage (its
 * own sections say it all) or when the chain did not solve.
 */
export function amplifierSection(s: WorkbenchState): { heading: string; lines: string[] } | null {
  const view = s.amplifier;
  if (!view || !view.result.ok || view.result.stages.length < 2) return null;
  const r = view.result;
  const hz = (f: number | null, none: string) => (f === null ? none : f >= 1000 ? `${plain(f / 1000)} kHz` : `${plain(f)} Hz`);
  const chain = view.names.map((n, i) => `${n.tube} ${view.kinds[i]!.toLowerCase()}`).join(' → ');
  const first = r.clipsFirst;
  const lines = [
    chain,
    `Gain ${plain(Math.abs(r.gain))} × (${(20 * Math.log10(Math.abs(r.gain))).toFixed(1)} dB${r.inverting ? ', inverting' : ''}), −3 dB ${hz(r.lowHz, 'DC')} to ${hz(r.highHz, 'beyond 100 MHz')}`,
    `Clean to ${r.outputPower !== null ? `${watts(r.outputPower)} (${plain(r.speakerRms ?? 0)} V rms at the speaker)` : rmsLevel(r.output, 'dBu')} from ${rmsLevel(r.input, 'dBu')} in; ${view.names[first.stage]!.title.toLowerCase()} clips first (${first.by === 'grid-current' ? 'grid current' : 'cutoff'})`,
  ];
  if (view.atLevel?.ok) lines.push(`At ${view.levelLabel}: ${rmsLevel(view.atLevel.input, 'dBu')} in, THD ${plain(view.atLevel.thd * 100, 2)} %`);
  return { heading: 'Amplifier', lines };
}
