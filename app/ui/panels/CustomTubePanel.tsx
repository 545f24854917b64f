import { useId, useMemo, useState } from 'react';
import { PALETTE } from '../chart/palette';
import { download } from '../../export/download';
import { plain } from '../../format';
import { MiniChart } from '../signal/MiniChart';
import type { XYSpec } from '../signal/drawXY';
import { useWorkbench } from '../../store/StoreProvider';
import { PointsBox } from './PointsBox';

/** Make a tube from points read off a datasheet or measured: paste, fit, check the curves over the points, save under a name. */
export function CustomTubePanel() {
  const custom = useWorkbench((s) => s.custom);
  const setTypical = useWorkbench((s) => s.setTypicalCsv);
  const fit = useWorkbench((s) => s.fitCustom);
  const save = useWorkbench((s) => s.saveCustom);
  const importTubes = useWorkbench((s) => s.importCustomTubes);
  const cancel = useWorkbench((s) => s.cancelCustomWork);
  const exportTubes = useWorkbench((s) => s.exportCustomTubes);
  const [name, setName] = useState('');
  const [ratings, setRatings] = useState({ maxPlateVoltage: 300, maxPlateDissipation: 1, maxHeaterCathodeVoltage: 100 });
  const [extras, setExtras] = useState({ heaterVolts: 6.3, heaterAmps: 0.3, cgkPf: 0, cgpPf: 0, cpkPf: 0 });
  const extraField = (key: keyof typeof extras, label: string, step = '0.1') => (
    <label className="field-label">{label}<input type="number" step={step} value={extras[key]} onChange={(e) => setExtras({ ...extras, [key]: Number(e.target.value) })} /></label>
  );
  const id = useId();
  const f = custom.fit;

  const chart = useMemo<XYSpec | null>(() => {
    const shown = [...custom.points, ...custom.typical];
    if (!f?.ok || shown.length === 0) return null;
    const vmax = Math.max(...shown.map((p) => p.va)) * 1.15;
    const imax = Math.max(...shown.map((p) => p.ia)) * 1.2e3;
    return {
      width: 330,
      height: 230,
      x: { domain: [0, vmax], label: 'Va (V)' },
      y: { domain: [0, imax], label: 'Ia (mA)' },
      series: custom.curves.map((c) => ({ key: `fit-${c.vg}`, points: c.points.map((p) => ({ x: p.v, y: p.i * 1e3 })), stroke: PALETTE.ink, width: 1.2 })),
      dots: { key: 'your-points', color: PALETTE.point, points: custom.points.map((p) => ({ x: p.va, y: p.ia * 1e3 })) },
      markers: custom.typical.map((p) => ({ x: p.va, y: p.ia * 1e3, color: PALETTE.rival, label: 'typical' })),
    };
  }, [f, custom.curves, custom.points, custom.typical]);

  return (
    <section className="panel custom-tube" aria-labelledby={`${id}-h`}>
      <h2 id={`${id}-h`}>A tube of your own</h2>
      <label htmlFor={`${id}-csv`} className="field-label">Points, one per line: plate voltage (V), grid voltage (V), plate current (mA)</label>
      <PointsBox id={`${id}-csv`} hintId={`${id}-hint`} />
      <p id={`${id}-hint`} className="field-hint">Commas, semicolons, tabs or spaces; a header line and # comments are skipped. Read at least two grid curves.</p>
      <label htmlFor={`${id}-typ`} className="field-label">And/or the datasheet's typical figures, one point per line: Va (V), Vg (V), Ia (mA), mu, rp (Ω), gm (mA/V); “-” for a figure not given</label>
      <textarea id={`${id}-typ`} rows={2} value={custom.typicalCsv} spellCheck={false} placeholder="250, -8.5, 10.5, 17, 7700, 2.2" onChange={(e) => setTypical(e.target.value)} />
      <div className="option-row">
        <button type="button" onClick={() => void fit()} disabled={custom.busy !== null}>Fit the model</button>
        {custom.busy ? (
          <>
            <progress max={custom.busy.of} value={custom.busy.done} aria-label={custom.busy.what === 'fit' ? 'Fit in progress' : 'Import in progress'} />
            <button type="button" onClick={cancel}>Cancel</button>
          </>
        ) : null}
      </div>
      {custom.lineErrors.length > 0 ? (
        <ul className="field-error line-errors" role="alert">
          {custom.lineErrors.map((e) => <li key={e.line}>{`Line ${e.line}: ${e.message}`}</li>)}
        </ul>
      ) : null}
      {f && !f.ok ? <p className="field-error" role="alert">{f.message}</p> : null}
      {f?.ok ? (
        <>
          <p className="fit-summary" data-testid="fit-summary">
            {`μ ${plain(f.params.mu)}, ex ${plain(f.params.ex)}, kg1 ${plain(f.params.kg1)}, kp ${plain(f.params.kp)}, kvb ${plain(f.params.kvb)} · RMS error ${f.rmsPercent.toFixed(2)} %, worst ${f.worst.label}: ${f.worst.errorPercent.toFixed(1)} %`}
          </p>
          {f.warning ? <p className="field-error">{f.warning}</p> : null}
          {chart ? <MiniChart title="Fitted curves (lines) over your points (dots)" spec={chart} description="The fitted model's plate curves drawn over the points given" /> : null}
          <div className="value-grid">
            <label className="field-label">Name<input value={name} maxLength={40} onChange={(e) => setName(e.target.value)} /></label>
            <label className="field-label">Max plate voltage (V)<input type="number" value={ratings.maxPlateVoltage} onChange={(e) => setRatings({ ...ratings, maxPlateVoltage: Number(e.target.value) })} /></label>
            <label className="field-label">Max plate dissipation (W)<input type="number" step="0.1" value={ratings.maxPlateDissipation} onChange={(e) => setRatings({ ...ratings, maxPlateDissipation: Number(e.target.value) })} /></label>
            <label className="field-label">Max heater–cathode (V)<input type="number" value={ratings.maxHeaterCathodeVoltage} onChange={(e) => setRatings({ ...ratings, maxHeaterCathodeVoltage: Number(e.target.value) })} /></label>
            {extraField('heaterVolts', 'Heater (V)')}
            {extraField('heaterAmps', 'Heater (A)', '0.01')}
            {extraField('cgkPf', 'Cgk (pF)')}
            {extraField('cgpPf', 'Cgp (pF)')}
            {extraField('cpkPf', 'Cpk (pF)')}
          </div>
          <div className="option-row">
            <button type="button" onClick={() => save(name, ratings, {
              heater: { volts: extras.heaterVolts, amps: extras.heaterAmps },
              caps: { cgk: extras.cgkPf * 1e-12, cgp: extras.cgpPf * 1e-12, cpk: extras.cpkPf * 1e-12 },
            })}>Save as my tube</button>
          </div>
        </>
      ) : null}
      <div className="option-row">
        <button type="button" onClick={() => download(new Blob([exportTubes()], { type: 'application/json' }), 'my-tubes.quiescent-tubes.json')}>Export my tubes</button>
        <label className="file-button">
          Import tubes
          <input type="file" accept=".json,application/json" onChange={(e) => {
            const file = e.target.files?.[0];
            if (!file) return;
            const reader = new FileReader();
            reader.onload = () => void importTubes(String(reader.result));
            reader.readAsText(file);
          }} />
        </label>
      </div>
      {custom.note ? <p className="keep-ok" role="status">{custom.note}</p> : null}
    </section>
  );
}
