import { plain, rmsLevel, voltsRms, watts } from '../../format';
import type { AmplifierView } from '../../store/amplifierChain';

/**
 * The amplifier at its working level in words: the input it needs and the
 * THD, and, past the clean limit, which stage is past its own and by what
 * (the figures there are of a stage in grid current or cut off). The
 * model's message when the level cannot be had.
 */
export function atLevelWords(view: AmplifierView): string | null {
  const at = view.atLevel;
  if (!at) return null;
  if (!at.ok) return at.message;
  const base = `${rmsLevel(at.input, 'dBu')} in, THD ${plain(at.thd * 100, 2)} %`;
  if (!at.pastClean) return base;
  const stage = view.names[at.pastClean.stage];
  const by = at.pastClean.by === 'grid-current' ? 'drawing grid current' : 'cut off';
  return `${base}: past the clean limit, ${stage ? stage.title.toLowerCase() : `stage ${at.pastClean.stage + 1}`} ${by}`;
}

/**
 * The amplifier's clean limit in words: the power (and the speaker's volts)
 * or the output level, and the input it takes; when there is none (a stage
 * already in grid current or cut off with no signal, say a direct-coupled
 * follower whose grid sits above its cathode), which stage and why, not a
 * power of some 10⁻¹⁴ W from "none" in.
 */
export function cleanLimitWords(r: Extract<AmplifierView['result'], { ok: true }>, names: AmplifierView['names']): string {
  if (r.input.dBu === null) {
    const title = names[r.clipsFirst.stage]?.title ?? `Stage ${r.clipsFirst.stage + 1}`;
    return `none: ${title.toLowerCase()} is ${r.clipsFirst.by === 'grid-current' ? 'in grid current' : 'cut off'} with no signal`;
  }
  const out = r.outputPower !== null ? `${watts(r.outputPower)} (${voltsRms(r.speakerRms ?? 0)} at the speaker)` : `${rmsLevel(r.output, 'dBu')} out`;
  return `${out} from ${rmsLevel(r.input, 'dBu')} in`;
}
