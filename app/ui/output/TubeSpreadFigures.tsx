import { milliamps, percentOf as percent, watts } from '../../format';
import type { OutputSpread } from '../../../src/index';
import { Figure } from '../panels/Figure';

/**
 * A cathode-biased stage's idle across the type's spread of tubes (for a
 * pair, matched pairs of them): the plate current from the weakest to the
 * strongest, and the strongest's plate dissipation against the rating. Two
 * operating points, solved on every pass, so a drag shows them live.
 */
export function TubeSpreadFigures({ spread, rating, label }: { spread: OutputSpread | null; rating: number; label: string }) {
  if (!spread) return null;
  const share = Math.round(spread.spread * 100);
  return (
    <dl className="figure-group" aria-label={label}>
      <Figure name="spread-ia" label={`Ia, tubes −${share} % to +${share} %`} value={`${milliamps(spread.weakest.ip)} to ${milliamps(spread.strongest.ip)}`} chars={19} />
      <Figure name="spread-pa" label={`Pa, a tube +${share} %`} value={`${watts(spread.strongest.pa)} (${percent(spread.strongest.pa / rating)})`} chars={16} />
    </dl>
  );
}

/** The same in a line, for the build card. */
export function tubeSpreadLine(spread: OutputSpread | null, rating: number, each: boolean): string {
  if (!spread) return '';
  const share = Math.round(spread.spread * 100);
  return `Tubes ${share} % weak to ${share} % strong${each ? ' (matched pairs)' : ''}: Ia ${milliamps(spread.weakest.ip)} to ${milliamps(spread.strongest.ip)}${each ? ' each' : ''}; a strong tube dissipates ${watts(spread.strongest.pa)} at idle, ${percent(spread.strongest.pa / rating)} of ${watts(rating)}`;
}
