import type { CapacitorLine, ResistorLine } from '../../../src/index';
import { farads, ohms, smallAmps, volts, watts } from '../../format';

/** The stages' rule for a capacitor's voltage rating (partsList's). */
const STAGE_CAPACITORS = 'Capacitors (voltage rating: twice the larger of running and switch-on, common practice)';

/**
 * The resistors and capacitors to order, as one pair of tables for every
 * stage kind and the supply. A supply's capacitors state their own rating
 * rule and carry a ripple current (a column of its own when any does).
 */
export function PartsTables({ resistors, capacitors, capacitorRule = STAGE_CAPACITORS }: { resistors: readonly ResistorLine[]; capacitors: readonly (CapacitorLine & { readonly rippleAmps?: number })[]; capacitorRule?: string }) {
  const ripple = capacitors.some((c) => c.rippleAmps !== undefined);
  return (
    <>
      <table className="parts-table">
        <caption>Resistors (power rating: twice the worst case, common practice)</caption>
        <thead><tr><th scope="col">Part</th><th scope="col">Order</th><th scope="col">Runs at</th><th scope="col">Worst case</th><th scope="col">Rating</th></tr></thead>
        <tbody>
          {resistors.map((r) => (
            <tr key={r.ref} data-part-line={r.ref}><th scope="row">{`${r.ref} (${r.role})`}</th><td>{`${ohms(r.preferred)} ${r.potentiometer ? 'pot' : r.series}`}</td><td>{watts(r.watts)}</td><td>{watts(r.wattsWorst)}</td><td>{`${r.ratingWatts} W`}</td></tr>
          ))}
        </tbody>
      </table>
      {capacitors.length > 0 ? (
        <table className="parts-table">
          <caption>{capacitorRule}</caption>
          <thead><tr><th scope="col">Part</th><th scope="col">Value</th><th scope="col">Runs at</th><th scope="col">At switch-on</th>{ripple ? <th scope="col">Ripple current</th> : null}<th scope="col">Rating</th></tr></thead>
          <tbody>
            {capacitors.map((c) => (
              <tr key={c.ref} data-part-line={c.ref}><th scope="row">{`${c.ref} (${c.role})`}</th><td>{`${c.value === null ? 'to choose' : farads(c.value)}${c.polarity ? `, ${c.polarity}` : ''}`}</td><td>{volts(c.volts)}</td><td>{volts(c.voltsAtSwitchOn)}</td>{ripple ? <td>{c.rippleAmps !== undefined ? `${smallAmps(c.rippleAmps)} rms` : ''}</td> : null}<td>{`${c.ratingVolts} V`}</td></tr>
            ))}
          </tbody>
        </table>
      ) : null}
    </>
  );
}
