import { memo } from 'react';
import { watts } from '../../format';

/**
 * A live figure's value sits in a box of fixed width, `chars` digits wide
 * (its widest reading): the strip never reflows while numbers change under a
 * drag, and the browser lays out a changed value inside its own box instead
 * of the whole page (the box has size and layout containment; see .readout).
 */
const readoutWidth = (chars: number) => ({ width: `${chars}ch` });

interface FigureProps {
  /** data-figure, for tests and exports. */
  readonly name: string;
  readonly label: string;
  readonly value: string;
  /** The widest reading, in digit widths. */
  readonly chars: number;
}

/** One labelled figure of a figures strip. Memoised: during a drag only the figures whose text changed are rendered again. */
export const Figure = memo(function Figure({ name, label, value, chars }: FigureProps) {
  return (
    <div className="figure" data-figure={name}>
      <dt>{label}</dt>
      <dd className="readout" style={readoutWidth(chars)}>{value}</dd>
    </div>
  );
});

interface ShareProps {
  readonly name: string;
  readonly label: string;
  /** Dissipation, W. */
  readonly value: number;
  /** Its rating, W. */
  readonly rating: number;
  readonly meterLabel: string;
}

/** A dissipation against its rating, with its bar: plain below 85 %, amber to 100 %, red above. */
export function Share({ name, label, value, rating, meterLabel }: ShareProps) {
  const share = value / rating;
  const barClass = share > 1 ? 'bar danger' : share > 0.85 ? 'bar warning' : 'bar';
  return (
    <div className="figure" data-figure={name}>
      <dt>{label}</dt>
      <dd className="readout with-bar" style={readoutWidth(18)}>
        {watts(value)} <span className="muted">({Math.round(share * 100)} % of {rating} W)</span>
        <span className={barClass} role="meter" aria-label={meterLabel} aria-valuemin={0} aria-valuemax={100} aria-valuenow={Math.round(share * 100)}>
          <span style={{ width: `${Math.min(share, 1) * 100}%` }} />
        </span>
      </dd>
    </div>
  );
}
