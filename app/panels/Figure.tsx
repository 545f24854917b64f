import { memo } from 'react';
import { watts } from '../format';

/**
 * One labelled figure of a figures strip; data-figure names it for tests and
 * exports. Memoised: during a drag only the figures whose text changed are
 * rendered again.
 */
export const Figure = memo(function Figure({ name, label, value }: { name: string; label: string; value: string }) {
  return (
    <div className="figure" data-figure={name}>
      <dt>{label}</dt>
      <dd>{value}</dd>
    </div>
  );
});

/** A dissipation against its rating, with its bar: plain below 85 %, amber to 100 %, red above. */
export function Share({ name, label, value, rating, meterLabel }: { name: string; label: string; value: number; rating: number; meterLabel: string }) {
  const share = value / rating;
  const barClass = share > 1 ? 'bar danger' : share > 0.85 ? 'bar warning' : 'bar';
  return (
    <div className="figure" data-figure={name}>
      <dt>{label}</dt>
      <dd>
        {watts(value)} <span className="muted">({Math.round(share * 100)} % of {rating} W)</span>
        <span className={barClass} role="meter" aria-label={meterLabel} aria-valuemin={0} aria-valuemax={100} aria-valuenow={Math.round(share * 100)}>
          <span style={{ width: `${Math.min(share, 1) * 100}%` }} />
        </span>
      </dd>
    </div>
  );
}
