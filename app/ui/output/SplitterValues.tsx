import { useId } from 'react';
import { degrees, milliamps, ohms, percentOf, plain, volts } from '../../format';
import { ValueField } from '../panels/ValueField';
import { useWorkbench } from '../../store/StoreProvider';
import { drivesPair } from '../../store/outputPlan';
import { splitterFiguresOf } from '../../store/splitterPlane';

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
  const figures = useWorkbench(splitterFiguresOf);
  const rgPair = useWorkbench((s) => s.design.output.rg);
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
      <label className="option-row splitter-direct">
        <input type="checkbox" checked={sp.coupling === 'direct'} onChange={(e) => setSplitter({ coupling: e.currentTarget.checked ? 'direct' : 'capacitor' })} />
        <span>Direct-coupled: its grid at the last voltage stage&apos;s plate (no coupling capacitor, leak or divider)</span>
      </label>
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
        {sp.coupling === 'direct' ? null : <ValueField field="sVgrid" hint="grid DC, from a divider" />}
        {sp.coupling === 'direct' && !ltp ? null : <ValueField field="sRg" hint={sp.coupling === 'direct' ? 'the second grid\'s leak' : 'grid leak (RL of the stage before)'} />}
        <ValueField field="sRst" hint={`at ${ltp ? 'the first grid\'s' : 'its'} socket, in series with the grid; “none” to leave it out`} />
        <ValueField field="sCc" hint="into each output grid" />
      </div>
      {driven && stage ? (
        <dl className="figure-group" aria-label="Splitter figures">
          <div className="figure" data-figure="splitter-op"><dt>Va, Vk, Ia</dt><dd>{`${volts(stage.op.va)}, ${volts(stage.op.vk)}, ${milliamps(stage.op.ia)}`}</dd></div>
          <div className="figure" data-figure="splitter-headroom"><dt>Headroom</dt><dd>{stage.headroomDb === null ? 'never clips' : `${stage.headroomDb.toFixed(1)} dB`}</dd></div>
        </dl>
      ) : null}
      {driven && figures ? (
        <table className="compare-table splitter-outputs" aria-label="Splitter outputs">
          <thead>
            <tr><th scope="col">Output</th><th scope="col">Gain</th><th scope="col">Zout</th><th scope="col">Clean peak</th></tr>
          </thead>
          <tbody>
            {figures.outputs.map((o, k) => (
              <tr key={k} data-output={k + 1}>
                <th scope="row">{ltp ? (k === 0 ? 'First plate (inverted)' : 'Second plate (in phase)') : k === 0 ? 'Plate (inverted)' : 'Cathode (in phase)'}</th>
                <td>{plain(o.gain)}×</td>
                <td>{ohms(o.zout)}</td>
                <td>{volts(o.swingPeak)}</td>
              </tr>
            ))}
          </tbody>
        </table>
      ) : null}
      {driven && figures ? (
        <p className="field-hint" data-figure="splitter-balance">
          {`Balance ${percentOf(figures.balance)} at midband; ${figures.balanceAt.filter((b) => b.hz === 20e3 || b.hz === 100e3).map((b) => `${percentOf(b.ratio)} and ${degrees(b.phaseErrorDeg)} off at ${b.hz / 1e3} kHz`).join(', ')} (each output into a pair grid's ${ohms(rgPair)} and its Miller capacitance). Clean to ${volts(figures.inputPeak)} peak at its grid (${figures.limitedBy === 'grid-current' ? 'grid current' : 'cutoff'}).`}
          {figures.tail ? ` Tail: ${milliamps(figures.tail.current)} at ${volts(figures.tail.volts)}.` : ''}
          {!ltp ? ' Unloaded, the plate\'s output impedance is near Ra and the cathode\'s a follower\'s: they differ greatly; equal loads keep the outputs balanced.' : ''}
        </p>
      ) : null}
    </fieldset>
  );
}
