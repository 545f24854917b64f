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
            </li>
          ))}
        </ul>
      )}
      <p className="field-hint">The voltage stages' heaters, their wiring and a DC heater supply with its dropping resistor are on the build sheet.</p>
    </div>
  );
}
