import { useId } from 'react';
import { farads, milliamps, plain, volts, watts } from '../../format';
import { buildSheetOf, railOf } from '../../store/buildSheet';
import { useWorkbench } from '../../store/StoreProvider';
import { HeaterSection } from './HeaterSection';
import { TubesToOrder } from './TubesToOrder';
import { feedbackPartLine } from '../chain/feedbackPart';
import { StagesParts } from './StagesParts';
import { IdleVoltages } from './IdleVoltages';
import { MeterReadings } from './MeterReadings';
import { OutputPartsLines } from '../output/OutputPartsPanel';
import { SupplyPartsList } from '../supply/SupplyPartsList';
import { BiasPartsList } from '../supply/BiasPartsList';

/** A number box for the build sheet's own inputs: shows the value, reports a bad entry beside itself. */
function NumberInput({ label, value, unit, onValue, min }: { label: string; value: number; unit: string; onValue: (v: number) => void; min: number }) {
  const id = useId();
  const bad = !(value >= min);
  return (
    <label className="field-label" htmlFor={id}>
      {label} ({unit})
      <input id={id} type="number" value={Number.isFinite(value) ? value : ''} onChange={(e) => onValue(e.target.value === '' ? Number.NaN : Number(e.target.value))} aria-invalid={bad || undefined} />
      {bad ? <span className="field-error">{`must be ${min > 0 ? 'above' : 'at least'} ${min} ${unit}`}</span> : null}
    </label>
  );
}

/**
 * The build sheet: an orderable parts list with ratings, capacitor values for
 * a wanted corner, production spread, heater supply and the B+ decoupling
 * filter. Everything here is the model's; the panel only lays it out.
 */
export function BuildSheetPanel() {
  const sheet = useWorkbench(buildSheetOf);
  const inputs = useWorkbench((s) => s.buildInputs);
  const setInputs = useWorkbench((s) => s.setBuildInputs);
  const editField = useWorkbench((s) => s.editField);
  const settleField = useWorkbench((s) => s.settleField);
  const drivenOutput = useWorkbench((s) => (s.design.drivesOutput ? s.design.output.tubeId : null));
  const supplyOn = useWorkbench((s) => s.design.supply.on);
  const feedbackPart = useWorkbench(feedbackPartLine);
  const id = useId();
  const fc = sheet.forCorner;
  const sp = sheet.spread;
  return (
    <section className="panel build-sheet" aria-labelledby={`${id}-h`}>
      <h2 id={`${id}-h`}>Build sheet</h2>
      <TubesToOrder />
      <StagesParts />
      {drivenOutput ? (
        <>
          <h3 className="subhead">{`Output stage, ${drivenOutput}`}</h3>
          <OutputPartsLines />
        </>
      ) : null}
      {feedbackPart ? <p data-testid="feedback-part">{feedbackPart}</p> : null}
      <SupplyPartsList />
      <BiasPartsList />
      <IdleVoltages />
      <MeterReadings />
      <h3 className="subhead corner-head">Capacitors for a wanted low corner, the bench's stage</h3>
      <div className="option-row">
        <NumberInput label="Wanted low corner" unit="Hz" value={inputs.cornerHz} min={0.001} onValue={(v) => setInputs({ cornerHz: v })} />
      </div>
      {!fc.ok ? <p className="field-error" role="alert">{fc.message}</p> : (
        <ul className="corner-caps">
          {(['cin', 'ck', 'cout'] as const).map((k) => {
            const c = fc[k];
            if (!c) return null;
            // Named as on the parts list; a capacitor into the next stage is set with that stage on the bench.
            const parts = sheet.cornerParts;
            const ref = k === 'cout' ? parts.cout.ref : parts[k];
            const box = k === 'cout' ? parts.cout.box : k;
            return (
              <li key={k}>
                {`${ref}: ${farads(c.exact)} exactly, order ${farads(c.preferred)} (corner ${plain(c.cornerHz)} Hz) `}
                {box ? (
                  <button type="button" aria-label={`Use ${farads(c.preferred)} for ${ref}`} onClick={() => { editField(box, farads(c.preferred).replace(' ', '').replace('F', '').replace('µ', 'u')); settleField(box); }}>Use</button>
                ) : <span className="field-hint">{`(the next stage's coupling: set it with that stage on the bench)`}</span>}
              </li>
            );
          })}
        </ul>
      )}
      <h3 className="subhead">Production spread</h3>
      {sp.ok ? (
        <p className="spread" data-testid="spread">
          {`Resistors at their series tolerance and the tube's current ±20 % (common practice), ${sp.samples.length} builds: Ia ${milliamps(sp.range.ia[0])} to ${milliamps(sp.range.ia[1])}, Va ${volts(sp.range.va[0])} to ${volts(sp.range.va[1])}, gain ${plain(sp.range.gain[1])} to ${plain(sp.range.gain[0])}, Pa ${watts(sp.range.pa[0])} to ${watts(sp.range.pa[1])}.`}
        </p>
      ) : <p className="field-error">{sp.message}</p>}
      <label><input type="checkbox" checked={inputs.showSpread} onChange={(e) => setInputs({ showSpread: e.target.checked })} /> Show the spread on the chart</label>
      <HeaterSection />
      <h3 className="subhead decoupling">B+ decoupling filter</h3>
      {supplyOn ? (
        <p className="decoupling" data-testid="filter-on-supply">The amplifier is solved on its B+ supply: its filter ladder feeds the stages (B+ supply, below; its parts are listed above). Clear &ldquo;Solve the amplifier on this supply&rdquo; there for a quick one-section estimate here.</p>
      ) : <DecouplingEstimate />}
    </section>
  );
}

/** One R–C section from a rail to the voltage stages, for a design without its supply: the drop, the ripple and the stage it leaves. */
function DecouplingEstimate() {
  const sheet = useWorkbench(buildSheetOf);
  const inputs = useWorkbench((s) => s.buildInputs);
  const rail = useWorkbench(railOf);
  const setInputs = useWorkbench((s) => s.setBuildInputs);
  const editField = useWorkbench((s) => s.editField);
  const settleField = useWorkbench((s) => s.settleField);
  return (
    <>
      <div className="option-row">
        <NumberInput label={inputs.railVolts === null ? 'Supply rail (follows B+)' : 'Supply rail'} unit="V" value={rail} min={1} onValue={(v) => setInputs({ railVolts: v })} />
        <NumberInput label="Series R" unit="Ω" value={inputs.filterR} min={0} onValue={(v) => setInputs({ filterR: v })} />
        <NumberInput label="Shunt C" unit="µF" value={inputs.filterC * 1e6} min={0.001} onValue={(v) => setInputs({ filterC: v / 1e6 })} />
      </div>
      <p className="decoupling">{`Total B+ current ${milliamps(sheet.totalBplusAmps)}${sheet.outputBplusAmps > 0 ? `, and ${milliamps(sheet.outputBplusAmps)} for the output stage ahead of the filter (${milliamps(sheet.totalBplusAmps + sheet.outputBplusAmps)} in all)` : ''}.`}</p>
      {sheet.filter.ok ? (
        <p data-testid="filter" className="decoupling">
          {`Drop ${volts(sheet.filter.dropVolts)} at ${milliamps(sheet.filter.amps)}: the stage sees ${volts(sheet.filter.stageBplus)}; ripple down ${(-sheet.filter.ripple100Db).toFixed(1)} dB at 100 Hz, ${(-sheet.filter.ripple120Db).toFixed(1)} dB at 120 Hz; R dissipates ${watts(sheet.filter.resistorWatts)}.${sheet.filteredOp ? ` The bench's stage then sits at Va ${volts(sheet.filteredOp.va)}, Ia ${milliamps(sheet.filteredOp.ia)}.` : ''} `}
          <button type="button" onClick={() => { if (sheet.filter.ok) { editField('bplus', sheet.filter.stageBplus.toFixed(1)); settleField('bplus'); } }}>Use this B+ for the stage</button>
        </p>
      ) : <p className="field-error" role="alert">{sheet.filter.message}</p>}
    </>
  );
}
