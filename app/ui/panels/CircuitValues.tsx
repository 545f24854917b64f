import { useId } from 'react';
import type { PreferredSeries } from '../../../src/index';
import { useWorkbench } from '../../store/StoreProvider';
import { ValueField } from './ValueField';
import { BplusField } from '../supply/BplusField';
import { benchSource } from '../../store/amplifierChain';
import { ohms } from '../../format';

/** The stage's values as a form: the same values the schematic shows, one source of truth. */
export function CircuitValues() {
  const bypassed = useWorkbench((s) => s.design.bypassed);
  const series = useWorkbench((s) => s.design.series);
  const snap = useWorkbench((s) => s.design.snap);
  const setBypassed = useWorkbench((s) => s.setBypassed);
  const setSeries = useWorkbench((s) => s.setSeries);
  const setSnap = useWorkbench((s) => s.setSnap);
  // RL, Rs and Cout belong to the amplifier's ends; on a stage in the middle the hints say what this stage really sees.
  const place = useWorkbench((s) => s.design.before.length);
  const drivesNext = useWorkbench((s) => s.design.after.length > 0);
  const sourceHint = useWorkbench((s) => {
    if (s.design.before.length === 0) return 'what drives the grid';
    const src = benchSource(s.design, s.registry);
    return `the amplifier's source; this stage is fed by stage ${s.design.before.length}${src.ok ? ` (${ohms(src.ohms)})` : ''}`;
  });
  const rlHint = useWorkbench((s) => {
    const next = s.design.after[0];
    return next?.kind === 'common-cathode' ? `the last voltage stage's load; this one drives ${ohms(next.rg)} at the next grid` : 'next stage\'s input; “none” if open';
  });
  const id = useId();
  return (
    <section className="panel circuit-values" aria-labelledby={`${id}-h`}>
      <h2 id={`${id}-h`}>Circuit values</h2>
      <div className="value-grid">
        <BplusField field="bplus" bench="voltage" />
        <ValueField field="ra" />
        <ValueField field="rk" />
        <ValueField field="rl" hint={rlHint} />
      </div>
      <h3 className="subhead">Signal parts</h3>
      <div className="value-grid">
        <ValueField field="rsource" hint={sourceHint} />
        <ValueField field="cin" hint={place > 0 ? `from stage ${place}` : undefined} />
        <ValueField field="rg" />
        <ValueField field="rstopper" hint="at the socket, in series with the grid; “none” to leave it out" />
        <ValueField field="volume" hint="Rg as a pot behind Cin, the grid on its wiper: its setting below full (0 at full); “none”: Rg is fixed" />
        <ValueField field="ck" hint="when bypassed" />
        <ValueField field="cout" hint={drivesNext ? 'the last voltage stage\'s' : undefined} />
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
