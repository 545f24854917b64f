import { useId } from 'react';
import { meterVolts, milliamps } from '../../format';
import { IDLE_VOLTAGES_WORDS, idleRowsFor, idleVoltagesOf } from '../../store/idleVoltages';
import { useDragPaced } from './useDragPaced';

/**
 * The voltages to check at first switch-on: each stage's B+, plate,
 * cathode, grid and screen to chassis at idle, and its plate current, from
 * the solved amplifier (the model's figures; this only lays them out).
 */
export function IdleVoltages({ outputAlone = false }: { readonly outputAlone?: boolean }) {
  // A table of many figures: during a drag it follows at the paced rate, not every frame.
  const idle = useDragPaced(idleVoltagesOf);
  const id = useId();
  if (!idle) return null;
  const rows = idleRowsFor(idle, outputAlone);
  const anyScreen = rows.some((r) => r.pins.screen !== null);
  return (
    <div className="idle-voltages">
      <h3 className="subhead" id={`${id}-h`}>Voltages to check at first switch-on</h3>
      <table className="parts-table" aria-labelledby={`${id}-h`}>
        <thead>
          <tr>
            <th scope="col">Stage</th>
            <th scope="col">B+</th>
            <th scope="col">Plate</th>
            <th scope="col">Cathode</th>
            <th scope="col">Grid</th>
            {anyScreen ? <th scope="col">Screen</th> : null}
            <th scope="col">Ia</th>
          </tr>
        </thead>
        <tbody>
          {rows.map((r) => (
            <tr key={r.name}>
              <th scope="row">{`${r.name}${r.eachTube ? ' (each tube)' : ''}`}</th>
              <td>{meterVolts(r.bplus)}</td>
              <td>{r.pins.plate2 === null ? meterVolts(r.pins.plate) : `${meterVolts(r.pins.plate)}, ${meterVolts(r.pins.plate2)}`}</td>
              <td>{meterVolts(r.pins.cathode)}</td>
              <td>{meterVolts(r.pins.grid)}</td>
              {anyScreen ? <td>{r.pins.screen === null ? '—' : meterVolts(r.pins.screen)}</td> : null}
              <td>{r.pins.plate2Current === null ? milliamps(r.ia) : `${milliamps(r.ia)}, ${milliamps(r.pins.plate2Current)}`}</td>
            </tr>
          ))}
        </tbody>
      </table>
      <p className="field-hint">{`${IDLE_VOLTAGES_WORDS}${idle.apartOutput && !outputAlone ? ' The output stage is apart from the voltage stages (the strip\'s box): its voltages are with its own parts.' : ''}`}</p>
    </div>
  );
}
