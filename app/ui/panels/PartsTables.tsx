import type { CapacitorLine, ResistorLine } from '../../../src/index';
import { farads, ohms, volts, watts } from '../../format';

/** The resistors and capacitors to order, as one pair of tables for every stage kind. */
export function PartsTables({ resistors, capacitors }: { resistors: readonly ResistorLine[]; capacitors: readonly CapacitorLine[] }) {
  return (
    <>
      <table className="parts-table">
        <caption>Resistors (power rating: twice the worst case, common practice)</caption>
        <thead><tr><th scope="col">Part</th><th scope="col">Order</th><th scope="col">Runs at</th><th scope="col">Worst case</th><th scope="col">Rating</th></tr></thead>
        <tbody>
          {resistors.map((r) => (
            <tr key={r.ref} data-part-line={r.ref}><th scope="row">{`${r.ref} (${r.role})`}</th><td>{`${ohms(r.preferred)} ${r.series}`}</td><td>{watts(r.watts)}</td><td>{watts(r.wattsWorst)}</td><td>{`${r.ratingWatts} W`}</td></tr>
          ))}
        </tbody>
      </table>
      {capacitors.length > 0 ? (
        <table className="parts-table">
          <caption>Capacitors (voltage rating: twice the larger of running and switch-on, common practice)</caption>
          <thead><tr><th scope="col">Part</th><th scope="col">Value</th><th scope="col">Runs at</th><th scope="col">At switch-on</th><th scope="col">Rating</th></tr></thead>
          <tbody>
            {capacitors.map((c) => (
              <tr key={c.ref} data-part-line={c.ref}><th scope="row">{`${c.ref} (${c.role})`}</th><td>{`${c.value === null ? 'to choose' : farads(c.value)}${c.polarity ? `, ${c.polarity}` : ''}`}</td><td>{volts(c.volts)}</td><td>{volts(c.voltsAtSwitchOn)}</td><td>{`${c.ratingVolts} V`}</td></tr>
            ))}
          </tbody>
        </table>
      ) : null}
    </>
  );
}
