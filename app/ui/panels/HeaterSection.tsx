import { useEffect, useId, useState } from 'react';
import { ohms, plain, watts } from '../../format';
import { buildSheetOf } from '../../store/buildSheet';
import { DESIGN_LIMITS } from '../../store/designLimits';
import { useWorkbench } from '../../store/StoreProvider';
import { elevationAdvice } from './elevationAdvice';

const DC = DESIGN_LIMITS.heaterDcVolts;

/**
 * The build sheet's heaters: where the small tubes are lit from (the
 * transformer's heater winding, or a DC supply with its dropping resistor),
 * each type's wiring and envelopes, what they draw, and the heater-elevation
 * advice. The choice is part of the design (an undo step, saved and shared);
 * the output and rectifier tubes' windings are listed with the supply.
 */
export function HeaterSection() {
  const sheet = useWorkbench(buildSheetOf);
  const heaters = useWorkbench((s) => s.design.heaters);
  const setHeaters = useWorkbench((s) => s.setHeaters);
  const channels = useWorkbench((s) => s.design.supply.channels);
  const id = useId();
  const onDc = heaters.voltageStages === 'dc';
  return (
    <>
      <h3 className="subhead">Heaters</h3>
      <div className="option-row">
        <label htmlFor={`${id}-feed`}>The voltage stages&rsquo; heaters run</label>
        <select id={`${id}-feed`} value={heaters.voltageStages} onChange={(e) => setHeaters({ voltageStages: e.target.value === 'dc' ? 'dc' : 'ac' })}>
          <option value="ac">on the AC heater winding</option>
          <option value="dc">from a DC supply (dropping resistor)</option>
        </select>
      </div>
      {sheet.tubes.map((t) => (
        <div className="option-row" key={t.tube.id}>
          <label htmlFor={`${id}-${t.tube.id}`}>{`${t.tube.id}: ${t.envelopes} envelope${t.envelopes === 1 ? '' : 's'} (${t.sectionsUsed} section${t.sectionsUsed === 1 ? '' : 's'} used)`}</label>
          <select id={`${id}-${t.tube.id}`} value={t.chosen.wiring} onChange={(e) => setHeaters({ wiring: { ...heaters.wiring, [t.tube.id]: e.target.value } })}>
            {t.options.map((o) => <option key={o.wiring} value={o.wiring}>{`${o.volts} V, ${o.amps} A (${o.wiring})`}</option>)}
          </select>
        </div>
      ))}
      {sheet.heaters.ok ? (
        <p data-testid="heater-totals">{`${onDc ? 'From the DC heater supply' : 'From the heater winding'}: ${sheet.heaters.volts} V, ${plain(sheet.heaters.totalAmps)} A, ${plain(sheet.heaters.totalWatts)} W for the voltage stages${channels > 1 ? ' of each channel' : ''}${onDc ? '' : ' (the winding, with the output tubes on it, is listed with the B+ supply)'}.`}</p>
      ) : <p className="field-error">{sheet.heaters.message}</p>}
      {onDc ? <DcSupply volts={heaters.dcVolts} onVolts={(v) => setHeaters({ dcVolts: v })} /> : null}
      {sheet.dropper && !sheet.dropper.ok ? <p className="field-error" role="alert">{sheet.dropper.message}</p> : null}
      {sheet.dropper?.ok ? (
        <p data-testid="dropper">{sheet.dropper.preferred === 0 ? 'No dropping resistor needed.' : `Dropping resistor ${ohms(sheet.dropper.exact)} exactly, order ${ohms(sheet.dropper.preferred)} (${sheet.dropper.ratingWatts} W)${channels > 1 ? ', one for each channel' : ''}: heaters at ${plain(sheet.dropper.heaterVolts)} V, resistor dissipating ${watts(sheet.dropper.watts)}.`}{sheet.dropper.warning ? <span className="field-error"> {sheet.dropper.warning}</span> : null}</p>
      ) : null}
      {sheet.elevation.ok ? <p data-testid="elevation">{elevationAdvice(sheet.elevation)}</p> : <p className="field-error">{sheet.elevation.message}</p>}
    </>
  );
}

/**
 * The DC heater supply's voltage: typed text stays in the box, a value out of
 * range is refused with its message beside it and the last good one stays in
 * the design; a value from elsewhere (undo, an opened file) shows.
 */
function DcSupply({ volts, onVolts }: { volts: number; onVolts: (v: number) => void }) {
  const id = useId();
  const [text, setText] = useState(String(volts));
  useEffect(() => setText((t) => (Number(t) === volts ? t : String(volts))), [volts]);
  const typed = Number(text);
  const bad = text.trim() === '' || !(typed >= DC.min && typed <= DC.max);
  return (
    <div className="option-row">
      <label className="field-label" htmlFor={id}>
        DC heater supply (V)
        <input
          id={id}
          type="number"
          value={text}
          aria-invalid={bad || undefined}
          onChange={(e) => {
            setText(e.target.value);
            const v = Number(e.target.value);
            if (e.target.value.trim() !== '' && v >= DC.min && v <= DC.max) onVolts(v);
          }}
        />
        {bad ? <span className="field-error">{`must be a number from ${DC.min} to ${DC.max} V`}</span> : null}
      </label>
    </div>
  );
}
