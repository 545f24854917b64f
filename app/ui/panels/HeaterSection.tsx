import { useEffect, useId, useState } from 'react';
import { ohms, plain, watts } from '../../format';
import { buildSheetOf } from '../../store/buildSheet';
import { DESIGN_LIMITS, type Limit } from '../../store/designLimits';
import { useWorkbench } from '../../store/StoreProvider';
import { dividerWords, elevationAdvice, keepsWithin, remedyWords, wholeVoltsSuggested } from './elevationAdvice';
import { elevationOf } from '../../store/heaterChoice';

/**
 * The build sheet's heaters: where the small tubes are lit from (the
 * transformer's heater winding, or a DC supply with its dropping resistor),
 * each type's wiring and envelopes, what they draw, and the heater elevation:
 * the advice, the potential the builder holds them at and its divider. The
 * choices are part of the design (undo steps, saved and shared); the output
 * and rectifier tubes' windings are listed with the supply.
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
      {onDc ? <VoltsBox label="DC heater supply (V)" limit={DESIGN_LIMITS.heaterDcVolts} volts={heaters.dcVolts} onVolts={(v) => setHeaters({ dcVolts: v })} /> : null}
      {sheet.dropper && !sheet.dropper.ok ? <p className="field-error" role="alert">{sheet.dropper.message}</p> : null}
      {sheet.dropper?.ok ? (
        <p data-testid="dropper">{sheet.dropper.preferred === 0 ? 'No dropping resistor needed.' : `Dropping resistor ${ohms(sheet.dropper.exact)} exactly, order ${ohms(sheet.dropper.preferred)} (${sheet.dropper.ratingWatts} W)${channels > 1 ? ', one for each channel' : ''}: heaters at ${plain(sheet.dropper.heaterVolts)} V, resistor dissipating ${watts(sheet.dropper.watts)}.`}{sheet.dropper.warning ? <span className="field-error"> {sheet.dropper.warning}</span> : null}</p>
      ) : null}
      <VoltsBox label="Heaters held at (V DC, 0 at ground)" limit={DESIGN_LIMITS.heaterElevationVolts} volts={elevationOf(heaters)} onVolts={(v) => setHeaters({ elevationVolts: v })} />
      {sheet.elevation.ok ? <p data-testid="elevation">{elevationAdvice(sheet.elevation, elevationOf(heaters))}</p> : <p className="field-error">{sheet.elevation.message}</p>}
      {sheet.elevation.ok && !keepsWithin(sheet.elevation, elevationOf(heaters)) ? (
        <button type="button" onClick={() => sheet.elevation.ok && setHeaters({ elevationVolts: wholeVoltsSuggested(sheet.elevation) })}>{remedyWords(sheet.elevation)}</button>
      ) : null}
      {sheet.elevationDivider ? <p data-testid="elevation-divider" className={sheet.elevationDivider.divider.ok ? undefined : 'field-error'}>{dividerWords(sheet.elevationDivider)}</p> : null}
    </>
  );
}

/**
 * A heater voltage (the DC supply's, the elevation): typed text stays in the
 * box, a value out of range is refused with its message beside it and the
 * last good one stays in the design; a value from elsewhere (undo, an opened
 * file) shows.
 */
function VoltsBox({ label, limit, volts, onVolts }: { label: string; limit: Limit; volts: number; onVolts: (v: number) => void }) {
  const id = useId();
  const [text, setText] = useState(String(volts));
  useEffect(() => setText((t) => (Number(t) === volts ? t : String(volts))), [volts]);
  const typed = Number(text);
  const bad = text.trim() === '' || !(typed >= limit.min && typed <= limit.max);
  return (
    <div className="option-row">
      <label className="field-label" htmlFor={id}>
        {label}
        <input
          id={id}
          type="number"
          value={text}
          aria-invalid={bad || undefined}
          onChange={(e) => {
            setText(e.target.value);
            const v = Number(e.target.value);
            if (e.target.value.trim() !== '' && v >= limit.min && v <= limit.max) onVolts(v);
          }}
        />
        {bad ? <span className="field-error">{`must be a number from ${limit.min} to ${limit.max} V`}</span> : null}
      </label>
    </div>
  );
}
