import { useId } from 'react';
import { milliamps, plain, volts } from '../format';
import { ValueField } from '../panels/ValueField';
import { useWorkbench } from '../store/StoreProvider';
import { drivesPair } from '../store/outputPlan';
import { SplitterChart } from './SplitterChart';

/**
 * The phase splitter before a push-pull pair: its kind, tube and values, and
 * what the amplifier makes of it (its operating point, each output's gain and
 * the balance the pair's grids get). It is part of the amplifier only while
 * the voltage stages drive the output stage.
 */
export function SplitterValues() {
  const id = useId();
  const sp = useWorkbench((s) => s.design.output.splitter);
  const driven = useWorkbench((s) => drivesPair(s.design));
  const tubes = useWorkbench((s) => s.tubes);
  const setSplitter = useWorkbench((s) => s.setSplitter);
  const error = useWorkbench((s) => s.errors.splitter);
  const stage = useWorkbench((s) => {
    const r = s.amplifier?.result;
    return r?.ok ? r.stages.find((st) => st.kind === 'split-load' || st.kind === 'long-tailed-pair') ?? null : null;
  });
  const ltp = sp.kind === 'long-tailed-pair';
  return (
    <fieldset className="splitter-values" aria-labelledby={`${id}-h`}>
      <legend id={`${id}-h`}>Phase splitter</legend>
      {!driven ? <p className="field-hint">Part of the amplifier when the voltage stages drive the output stage (the strip&apos;s box above): it then takes their signal through Cout into its grid leak (RL).</p> : null}
      <div className="option-row">
        <label>
          <input type="radio" name={`${id}-kind`} checked={!ltp} onChange={() => setSplitter({ kind: 'split-load' })} /> Split-load (cathodyne)
        </label>
        <label>
          <input type="radio" name={`${id}-kind`} checked={ltp} onChange={() => setSplitter({ kind: 'long-tailed-pair' })} /> Long-tailed pair
        </label>
        <label htmlFor={`${id}-tube`} className="visually-hidden">Splitter tube</label>
        <select id={`${id}-tube`} value={sp.tubeId} onChange={(e) => setSplitter({ tubeId: e.target.value })}>
          {tubes.map((t) => <option key={t.id} value={t.id}>{t.id}</option>)}
        </select>
      </div>
      {error ? <p className="field-error" role="alert">{error}</p> : null}
      <p className="field-hint">
        {ltp
          ? 'Two triodes, the signal on the first grid, the second grid at signal ground; a larger tail and a slightly larger second plate resistor even the outputs.'
          : 'One triode, equal plate and cathode loads: two outputs of one current, a little under unity each; the cathode sits high, so mind its heater-to-cathode rating.'}
      </p>
      <div className="value-grid">
        <ValueField field="sBplus" hint="its supply node" />
        <ValueField field="sRa" hint={ltp ? 'first plate' : 'plate load'} />
        {ltp ? <ValueField field="sRa2" hint="second plate" /> : null}
        <ValueField field="sRk" hint={ltp ? 'shared bias, over the tail' : 'cathode load'} />
        {ltp ? <ValueField field="sRtail" hint="to ground" /> : null}
        <ValueField field="sVgrid" hint="grid DC, from a divider" />
        <ValueField field="sRg" hint="grid leak (RL of the stage before)" />
        <ValueField field="sCc" hint="into each output grid" />
      </div>
      {driven && stage ? (
        <dl className="figure-group" aria-label="Splitter figures">
          <div className="figure" data-figure="splitter-op"><dt>Va, Vk, Ia</dt><dd>{`${volts(stage.op.va)}, ${volts(stage.op.vk)}, ${milliamps(stage.op.ia)}`}</dd></div>
          <div className="figure" data-figure="splitter-gain"><dt>Gain to the first output</dt><dd>{plain(stage.gain)}×</dd></div>
          <div className="figure" data-figure="splitter-headroom"><dt>Headroom</dt><dd>{stage.headroomDb === null ? 'never clips' : `${stage.headroomDb.toFixed(1)} dB`}</dd></div>
        </dl>
      ) : null}
      {driven ? <SplitterChart tubeId={sp.tubeId} ltp={ltp} /> : null}
    </fieldset>
  );
}
