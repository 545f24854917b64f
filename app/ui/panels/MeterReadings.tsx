import { useId, useState } from 'react';
import type { Finding } from '../../../src/index';
import { meterVolts, smallVolts } from '../../format';
import { askedBoxes, meterFromText, outputMeterFromText, sameReading, type MeterText, type OutputMeterText, type TriodeBox } from '../../store/meterPlan';
import { shownMeterRows, type MeterRow, type OutputMeterRow } from '../../store/meterRows';
import { useWorkbench } from '../../store/StoreProvider';
import { useDragPaced } from './useDragPaced';
import { compact } from '../../store/fields';
import { outputMeterWords, triodeMeterLines } from './meterWords';

/**
 * The amplifier as built, read with a meter: for each gain stage,
 * follower, phase splitter and output tube, the electrodes to
 * chassis at idle typed in, and where that puts the tube against the model's
 * typical one. Readings are kept with the design (files, links, undo). Like
 * the voltages to check, an output stage apart from the voltage stages is
 * read on its own bench (`outputAlone`).
 */
export function MeterReadings({ outputAlone = false }: { readonly outputAlone?: boolean }) {
  // A table of many figures: during a drag it follows at the paced rate, not every frame (the designed values it shows move with the point).
  const shownTriodes = useDragPaced((s) => shownMeterRows(s, outputAlone).triodes);
  const shownOutputs = useDragPaced((s) => shownMeterRows(s, outputAlone).outputs);
  const id = useId();
  if (shownTriodes.length + shownOutputs.length === 0) return null;
  return (
    <section className="meter-readings" aria-labelledby={`${id}-h`}>
      <h3 className="subhead" id={`${id}-h`}>Your meter readings, stage by stage</h3>
      <p className="field-hint">
        With the amplifier built and idling, read each electrode to chassis and type it here: the drop across the cathode resistor (or a fixed-bias tube’s 1 Ω sense resistor, or where there is neither, the plate resistor) gives the current (Ohm’s law), and the model says where the tube sits against a typical one of its type.
      </p>
      {shownTriodes.map((row) => <TriodeMeter key={`${row.stage}-${row.tubeId}`} row={row} />)}
      {shownOutputs.map((row) => <OutputMeter key={`${row.tube}-${row.tubeId}-${row.pair}-${row.bias}`} row={row} />)}
    </section>
  );
}

/** One reading's box: a message beside it says what is wrong. */
function MeterBox(props: { readonly id: string; readonly name: string; readonly label: string; readonly value: string; readonly placeholder: string; readonly error?: string; readonly onChange: (text: string) => void; readonly onSettle: (leaving: boolean) => void }) {
  const { id, error } = props;
  return (
    <div className={error ? 'value-field has-error' : 'value-field'}>
      <label htmlFor={id} className="field-label">
        {props.label} <span className="unit">(V)</span>
      </label>
      <input
        id={id}
        name={props.name}
        autoComplete="off"
        spellCheck={false}
        value={props.value}
        placeholder={props.placeholder}
        aria-invalid={error ? true : undefined}
        aria-describedby={error ? `${id}-err` : undefined}
        onChange={(e) => props.onChange(e.target.value)}
        onBlur={() => props.onSettle(true)}
        onKeyDown={(e) => e.key === 'Enter' && props.onSettle(false)}
      />
      {error ? <p id={`${id}-err`} className="field-error" role="alert">{error}</p> : null}
    </div>
  );
}

/**
 * A row's boxes as typed, kept apart from the design until they make a
 * reading; a reading changed from outside them (undo, a file opened) is
 * shown afresh.
 */
function useMeterText<T, K extends string>(reading: T, textOf: (r: T) => Record<K, string>) {
  const [text, setText] = useState<Record<K, string>>(() => textOf(reading));
  const [errors, setErrors] = useState<Partial<Record<K, string>>>({});
  const [shown, setShown] = useState(reading);
  if (shown !== reading) {
    setShown(reading);
    setText(textOf(reading));
    setErrors({});
  }
  return { text, setText, errors, setErrors };
}

/** A readout styled as its worst check (a dissipation near or past the rating), as the ratings list shows it. */
const worstClass = (findings: readonly Finding[]) => (findings.some((f) => f.severity === 'danger') ? ' finding danger' : findings.some((f) => f.severity === 'warning') ? ' finding warning' : '');

/** Leaving a box waits while another of the row's is still empty (its turn may be next); Enter takes the boxes as they are. */
const waitsForOthers = (texts: readonly string[]) => texts.some((t) => t.trim() === '') && texts.some((t) => t.trim() !== '');

/** While the row waits, a box whose text cannot be read says so at once; only the empty boxes' "give it too" waits. */
const refusedOnly = <K extends string>(made: { ok: true } | { ok: false; errors: Partial<Record<K, string>> }, text: Readonly<Record<K, string>>): Partial<Record<K, string>> =>
  made.ok ? {} : (Object.fromEntries(Object.entries(made.errors).filter(([key]) => text[key as K].trim() !== '')) as Partial<Record<K, string>>);

const triodeText = (r: MeterRow['reading']): MeterText => ({
  supply: r?.supply !== undefined ? compact(r.supply) : '',
  plate: r ? compact(r.plate) : '',
  plate2: r?.plate2 !== undefined ? compact(r.plate2) : '',
  cathode: r ? compact(r.cathode) : '',
});

/** Each box's label, by how the stage is read. */
const triodeLabel = (key: TriodeBox, route: MeterRow['route']): string =>
  ({ supply: 'Supply at the top of Ra', plate: route === 'pair' ? 'First plate to chassis' : 'Plate to chassis', plate2: 'Second plate to chassis', cathode: route === 'pair' ? 'Cathodes to chassis' : 'Cathode to chassis' })[key];

function TriodeMeter({ row }: { readonly row: MeterRow }) {
  const setReading = useWorkbench((s) => s.setReading);
  const { text, setText, errors, setErrors } = useMeterText(row.reading, triodeText);
  const id = useId();
  const settle = (leaving: boolean) => {
    const made = meterFromText(row.stage, row.tubeId, row.boxes, text);
    if (leaving && waitsForOthers(row.boxes.map((k) => text[k]))) return setErrors(refusedOnly(made, text));
    if (!made.ok) return setErrors(made.errors);
    setErrors({});
    if (!sameReading(made.reading, row.reading)) setReading(row.stage, made.reading);
  };
  const box = (key: TriodeBox) => (
    <MeterBox key={key} id={`${id}-${key}`} name={`reading.${row.stage}.${key}`} label={triodeLabel(key, row.route)} value={text[key]} placeholder={`designed ${meterVolts(row.expected[key])}`} error={errors[key]} onChange={(t) => setText({ ...text, [key]: t })} onSettle={settle} />
  );
  const readout = row.readout;
  return (
    <div className="meter-row" role="group" aria-label={`Meter readings, ${row.name}`}>
      <h4 className="meter-stage">{row.name}</h4>
      <div className="value-grid">{row.boxes.map(box)}</div>
      {readout === null ? null : readout.ok ? (
        <p className={`meter-readout${worstClass(readout.findings)}`} role="status">
          {triodeMeterLines(readout, row).map((line, k) => <span key={k} className="meter-line">{line}</span>)}
        </p>
      ) : (
        <p className="finding warning" role="alert">{readout.message}</p>
      )}
    </div>
  );
}

const outputText = (r: OutputMeterRow['reading']): OutputMeterText => ({
  plate: r ? compact(r.plate) : '',
  screen: r?.screen != null ? compact(r.screen) : '',
  grid: r && r.bias === 'fixed' ? compact(r.grid) : '',
  cathode: r ? compact(r.cathode) : '',
});

function OutputMeter({ row }: { readonly row: OutputMeterRow }) {
  const setReading = useWorkbench((s) => s.setOutputReading);
  const { text, setText, errors, setErrors } = useMeterText(row.reading, outputText);
  const id = useId();
  const asked = askedBoxes(row.boxes);
  const settle = (leaving: boolean) => {
    const made = outputMeterFromText({ tube: row.tube, tubeId: row.tubeId, pair: row.pair, bias: row.bias }, row.boxes, text);
    if (leaving && waitsForOthers(asked.map((k) => text[k]))) return setErrors(refusedOnly(made, text));
    if (!made.ok) return setErrors(made.errors);
    setErrors({});
    if (!sameReading(made.reading, row.reading)) setReading(row.tube, made.reading);
  };
  const box = (key: keyof OutputMeterText, label: string, placeholder: string) => (
    <MeterBox id={`${id}-${key}`} name={`outputReading.${row.tube}.${key}`} label={label} value={text[key]} placeholder={placeholder} error={errors[key]} onChange={(t) => setText({ ...text, [key]: t })} onSettle={settle} />
  );
  const e = row.expected;
  const readout = row.readout;
  return (
    <div className="meter-row" role="group" aria-label={`Meter readings, ${row.name}`}>
      <h4 className="meter-stage">{row.name}</h4>
      <div className="value-grid">
        {box('plate', 'Plate to chassis', `designed ${meterVolts(e.plate)}`)}
        {row.boxes.screen ? box('screen', 'Screen to chassis', `designed ${meterVolts(e.screen ?? 0)}`) : null}
        {row.boxes.grid ? box('grid', 'Grid to chassis', `designed ${meterVolts(e.grid)}`) : null}
        {row.bias === 'fixed' ? box('cathode', 'Across its 1 Ω sense resistor', `designed ${smallVolts(e.cathode)}`) : box('cathode', row.together ? 'Cathodes to chassis (shared Rk)' : 'Cathode to chassis', `designed ${meterVolts(e.cathode)}`)}
      </div>
      {readout === null ? null : readout.ok ? (
        <p className={`meter-readout${worstClass(readout.findings)}`} role="status">{outputMeterWords(readout, row)}</p>
      ) : (
        <p className="finding warning" role="alert">{readout.message}</p>
      )}
    </div>
  );
}
