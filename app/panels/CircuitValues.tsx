import { useId } from 'react';
import type { PreferredSeries } from '../../src/index';
import { useWorkbench } from '../store/StoreProvider';
import { ValueField } from './ValueField';
import { BplusField } from '../supply/BplusField';

/** The stage's values as a form: the same values the schematic shows, one source of truth. */
export function CircuitValues() {
  const bypassed = useWorkbench((s) => s.design.bypassed);
  const series = useWorkbench((s) => s.design.series);
  const snap = useWorkbench((s) => s.design.snap);
  const setBypassed = useWorkbench((s) => s.setBypassed);
  const setSeries = useWorkbench((s) => s.setSeries);
  const setSnap = useWorkbench((s) => s.setSnap);
  const id = useId();
  return (
    <section className="panel circuit-values" aria-labelledby={`${id}-h`}>
      <h2 id={`${id}-h`}>Circuit values</h2>
      <div className="value-grid">
        <BplusField field="bplus" bench="voltage" />
        <ValueField field="ra" />
        <ValueField field="rk" />
        <ValueField field="rl" hint="next stage's input; “none” if open" />
      </div>
      <h3 className="subhead">Signal parts</h3>
      <div className="value-grid">
        <ValueField field="rsource" hint="what drives the grid" />
        <ValueField field="cin" />
        <ValueField field="rg" />
        <ValueField field="ck" hint="when bypassed" />
        <ValueField field="cout" />
      </div>
      <div className="option-row">
        <label>
          <input type="checkbox" checked={bypassed} onChange={(e) => setBypassed(e.target.checked)} /> Rk bypassed (Ck)
        </label>
      </div>
      <div className="option-row">
        <label>
          <input type="checkbox" checked={snap} onChange={(e) => setSnap(e.target.checked)} /> After a drag, snap Ra and Rk to
        </label>
        <label htmlFor={`${id}-series`} className="visually-hidden">Preferred-value series</label>
        <select id={`${id}-series`} value={series} onChange={(e) => setSeries(e.target.value as PreferredSeries)}>
          <option value="E12">E12 (±10 %)</option>
          <option value="E24">E24 (±5 %)</option>
          <option value="E96">E96 (±1 %)</option>
        </select>
      </div>
    </section>
  );
}
