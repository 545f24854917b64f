import { useId } from 'react';
import type { PushPullDrive } from '../../../src/index';
import { dB, ohms, volts, watts } from '../../format';
import type { PushPullBench } from '../../store/outputAnalysis';
import { useWorkbench } from '../../store/StoreProvider';

const HARMONICS = [2, 3, 4, 5, 6, 7, 8, 9] as const;
/** Below −120 dB a harmonic is the arithmetic's noise, not the pair's: a matched pair's even harmonics cancel exactly in the model. */
const db = (x: number) => (x > 1e-6 ? dB(20 * Math.log10(x)) : 'below −120 dB');

/**
 * The pair's power and distortion: the harmonics H2 to H9 (relative to the
 * fundamental) with the grids driven to 0 V and at the distortion limit, and
 * the plate-to-plate load sweep, run when asked (each load is a whole level
 * sweep), with a button to take the best.
 */
export function PairSignal({ bench }: { bench: PushPullBench }) {
  const id = useId();
  const a = bench.settled;
  const f = a.figures;
  const output = useWorkbench((s) => s.design.output);
  const sweep = useWorkbench((s) => s.pairRaaSweep);
  const sweepPairRaa = useWorkbench((s) => s.sweepPairRaa);
  const changeOutput = useWorkbench((s) => s.changeOutput);
  const levels: { name: string; at: PushPullDrive }[] = [{ name: 'Grids to 0 V', at: a.full }];
  if (f?.atThdLimit) levels.push({ name: `At the ${(a.solution.design.thdLimit * 100).toPrecision(2)} % limit`, at: f.atThdLimit });
  const current = sweep && sweep.output === output ? sweep.result : null;
  return (
    <section className="panel output-signal" aria-labelledby={`${id}-h`}>
      <h2 id={`${id}-h`}>Power and distortion of the pair {bench.light ? <span className="muted">(updating after the drag)</span> : null}</h2>
      <table className="compare-table" aria-label="Harmonics of the pair">
        <thead>
          <tr>
            <th scope="col">Level</th>
            <th scope="col">Drive per grid</th>
            <th scope="col">Power</th>
            {HARMONICS.map((h) => <th key={h} scope="col">H{h}</th>)}
          </tr>
        </thead>
        <tbody>
          {levels.map((l) => (
            <tr key={l.name}>
              <th scope="row">{l.name}</th>
              <td>{volts(l.at.drive)} peak</td>
              <td>{watts(l.at.power)}</td>
              {HARMONICS.map((h) => <td key={h} data-harmonic={h}>{db(l.at.harmonics[h] ?? 0)}</td>)}
            </tr>
          ))}
        </tbody>
      </table>
      <p className="field-hint">
        A matched pair cancels its even harmonics; set a mismatch to see what a few percent between the tubes puts back (and the DC it leaves in the core).
      </p>
      <div className="z-sweep">
        <p>
          <button type="button" onClick={sweepPairRaa} disabled={current !== null}>Sweep Raa from {ohms(output.raa / 3)} to {ohms(output.raa * 3)}</button>{' '}
          {current && current.ok ? (
            <>
              Most power within the limit: <strong data-figure="best-raa-power">{watts(current.rows[current.best]!.power)}</strong> into <strong data-figure="best-raa">{ohms(current.rows[current.best]!.raa)}</strong>.{' '}
              <button type="button" onClick={() => changeOutput({ raa: Number(current.rows[current.best]!.raa.toPrecision(2)) })}>Use {ohms(Number(current.rows[current.best]!.raa.toPrecision(2)))}</button>
            </>
          ) : current && !current.ok ? <span className="field-error" role="alert">{current.message}</span> : null}
        </p>
        {current && current.ok ? (
          <table className="compare-table" aria-label="Power against plate-to-plate load">
            <thead>
              <tr><th scope="col">Raa</th><th scope="col">Power</th><th scope="col">THD</th><th scope="col">Limited by</th></tr>
            </thead>
            <tbody>
              {current.rows.map((r, k) => (
                <tr key={r.raa} className={k === current.best ? 'best' : undefined}>
                  <td>{ohms(r.raa)}</td>
                  <td>{watts(r.power)}</td>
                  <td>{(r.thd * 100).toFixed(1)} %</td>
                  <td>{r.limitedBy === 'thd-limit' ? 'distortion' : r.limitedBy === 'grid-current' ? 'grid current' : 'never within'}</td>
                </tr>
              ))}
            </tbody>
          </table>
        ) : null}
      </div>
    </section>
  );
}
