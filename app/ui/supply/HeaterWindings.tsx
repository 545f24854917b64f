import { plain } from '../../format';
import { heaterWindingsOf } from '../../store/heaterPlan';
import { useWorkbench } from '../../store/StoreProvider';

/** The transformer's heater windings beside its B+ winding: each winding's volts, amperes and VA, and what it lights. */
export function HeaterWindings() {
  const view = useWorkbench(heaterWindingsOf);
  return (
    <div className="heater-windings">
      <h3>Heater windings</h3>
      {!view.ok ? (
        <p className="field-error">{view.message}</p>
      ) : (
        <ul data-testid="heater-windings">
          {view.windings.map((w, i) => (
            <li key={i}>
              <strong>{plain(w.volts)} V, {plain(w.amps)} A</strong> ({plain(w.va)} VA): {w.feeds.join(', ')}
              {w.atBplus ? '. Its own winding: the filament is the rectifier\'s cathode and sits at B+, so the winding must be insulated for it (common practice).' : ''}
              {view.held[i] ? `; held at ${plain(view.heldVolts)} V DC by the elevation divider on the build sheet.` : ''}
            </li>
          ))}
          {view.dc ? <li key="dc" data-heater="dc"><strong>DC heater supply {plain(view.dc.volts)} V, {plain(view.dc.amps)} A</strong> at the heaters: {view.dc.feeds.join(', ')}{view.heldVolts !== 0 ? `, held at ${plain(view.heldVolts)} V DC by the elevation divider on the build sheet` : ''}. Its winding, rectifier and filter are not designed here.</li> : null}
        </ul>
      )}
      <p className="field-hint">Whether the voltage stages' heaters run on the winding or from a DC supply, their wiring and the supply's dropping resistor are on the build sheet.</p>
    </div>
  );
}
