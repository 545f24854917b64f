import type { TargetName } from '../../../src/index';
import { ohms, plain, voltsRms } from '../../format';

/** What a target measures at the design, in the bench's words. */
function targetValueWords(k: TargetName, v: number | null | undefined): string {
  if (v === undefined) return '';
  if (v === null) return k === 'maxThdAt' ? 'the level is past the clean swing' : k === 'maxThdAtPower' ? 'that power needs the grid past 0 V' : 'no rating to hold it to';
  switch (k) {
    case 'minGain': return `${plain(v)} ×`;
    case 'minCleanOutputRms': return voltsRms(v);
    case 'maxThdAt': return `${plain(100 * v)} %`;
    case 'maxDissipationFraction': return `${plain(100 * v)} % of its rating`;
    case 'maxZout':
    case 'raRange':
    case 'rkRange': return ohms(v);
    case 'minGridHeadroom': return `${plain(v)} V peak`;
    case 'heaterCathodeWithinRating': return `cathode at ${plain(v)} V`;
    case 'minPower': return `${plain(v)} W`;
    case 'maxThdAtPower': return `${plain(100 * v)} %`;
    case 'bplusRange': return `${plain(v)} V`;
  }
}

/**
 * A target's label with what it measures: "gain 15.2 ×", or, where it cannot
 * be measured there, "THD at level: the level is past the clean swing" (a
 * phrase, set off by a colon rather than run into the label).
 */
export function targetWithValue(label: string, k: TargetName, v: number | null | undefined): string {
  const words = targetValueWords(k, v);
  return v === null ? `${label}: ${words}` : `${label} ${words}`;
}
