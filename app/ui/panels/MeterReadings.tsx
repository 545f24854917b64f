import { useId, useState } from 'react';
import { meterVolts } from '../../format';
import { meterFromText, type MeterText } from '../../store/meterPlan';
import { meterRowsOf, type MeterRow } from '../../store/meterRows';
import { useWorkbench } from '../../store/StoreProvider';
import { compact } from '../../store/fields';
import { meterWords } from './meterWords';

/**
 * The amplifier as built, read with a meter: for each gain stage and
 * follower with a cathode resistor, the plate and cathode to chassis at
 * idle typed in, and where that puts the tube against the model's typical
 * one. Readings are kept with the design (files, links, undo).
 */
export function MeterReadings() {
  const rows = useWorkbench(meterRowsOf);
  const id = useId();
  if (rows.length === 0) return null;
  return (
    <section className="meter-readings" aria-labelledby={`${id}-h`}>
      <h3 className="subhead" id={`${id}-h`}>Your meter readings, stage by stage</h3>
      <p className="field-hint">
        With the amplifier built and idling, read the plate and cathode to chassis and type them here: the cathode’s drop across Rk gives the current (Ohm’s law), and the model says where the tube sits against a typical one of its type.
      </p>
      {rows.map((row) => (
        <MeterRowBoxes key={`${row.stage}-${row.tubeId}`} row={row} />
      ))}
    </section>
  );
}

const textOf = (r: MeterRow['reading']): MeterText => ({ plate: r ? compact(r.plate) : '', cathode: r ? compact(r.cathode) : '' });

function MeterRowBoxes({ row }: { readonly row: MeterRow }) {
  const setReading = useWorkbench((s) => s.setReading);
  const [text, setText] = useState<MeterText>(() => textOf(row.reading));
  const [errors, setErrors] = useState<Partial<Record<keyof MeterText, string>>>({});
  // A reading changed from outside the boxes (undo, a file opened): the boxes show it.
  const [shown, setShown] = useState(row.reading);
  if (shown !== row.reading) {
    setShown(row.reading);
    setText(textOf(row.reading));
    setErrors({});
  }
  const id = useId();
  /** Enter takes the boxes as they are; leaving a box waits while the other is still empty (its turn is next). */
  const settle = (leaving: boolean) => {
    if (leaving && (text.plate.trim() === '') !== (text.cathode.trim() === '')) return setErrors({});
    const made = meterFromText(row.stage, row.tubeId, text);
    if (!made.ok) return setErrors(made.errors);
    setErrors({});
    const same = made.reading && row.reading && made.reading.plate === row.reading.plate && made.reading.cathode === row.reading.cathode;
    if (!same && !(made.reading === null && row.reading === null)) setReading(row.stage, made.reading);
  };
  const box = (key: keyof MeterText, label: string, expected: number) => (
    <div className={errors[key] ? 'value-field has-error' : 'value-field'}>
      <label htmlFor={`${id}-${key}`} className="field-label">
        {label} <span className="unit">(V)</span>
      </label>
      <input
        id={`${id}-${key}`}
        name={`reading.${row.stage}.${key}`}
        autoComplete="off"
        spellCheck={false}
        inputMode="decimal"
        value={text[key]}
        placeholder={`designed ${meterVolts(expected)}`}
        aria-invalid={errors[key] ? true : undefined}
        aria-describedby={errors[key] ? `${id}-${key}-err` : undefined}
        onChange={(e) => setText({ ...text, [key]: e.target.value })}
        onBlur={() => settle(true)}
        onKeyDown={(e) => e.key === 'Enter' && settle(false)}
      />
      {errors[key] ? <p id={`${id}-${key}-err`} className="field-error" role="alert">{errors[key]}</p> : null}
    </div>
  );
  const readout = row.readout;
  return (
    <div className="meter-row" role="group" aria-label={`Meter readings, ${row.name}`}>
      <h4 className="meter-stage">{row.name}</h4>
      <div className="value-grid">
        {box('plate', 'Plate to chassis', row.expected.plate)}
        {box('cathode', 'Cathode to chassis', row.expected.cathode)}
      </div>
      {readout === null ? null : readout.ok ? (
        <p className={`meter-readout${readout.paFraction > 1 ? ' finding danger' : ''}`} role="status">{meterWords(readout, row.tubeId, row.ratedWatts)}</p>
      ) : (
        <p className="finding warning" role="alert">{readout.message}</p>
      )}
    </div>
  );
}
