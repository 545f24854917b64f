import { plain, rmsLevel } from '../../format';
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
