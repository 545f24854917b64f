import { useId, useMemo } from 'react';
import { ohms, watts } from '../../format';
import { PALETTE } from '../chart/palette';
import { MiniChart } from '../signal/MiniChart';
import type { XYSpec } from '../signal/drawXY';
import { useWorkbench } from '../../store/StoreProvider';
import type { SingleEndedBench } from '../../store/outputAnalysis';
import { PairSignal } from './PairSignal';

const W = 330;
const H = 210;
const pct = (x: number) => x * 100;

/**
 * Power and distortion: THD, H2 and H3 against output power up to the onset
 * of grid current, and the primary-impedance sweep (most power within the
 * distortion limit at this operating point) with a button to take the best.
 * The model computes both on the full pass; during a drag they wait.
 */
export function OutputSignalCharts() {
  const bench = useWorkbench((s) => s.outputBench);
  return bench.pair === 'push-pull' ? <PairSignal bench={bench} /> : <SingleEndedSignal bench={bench} />;
}

function SingleEndedSignal({ bench }: { bench: SingleEndedBench }) {
  const settled = bench.settled;
  const stale = bench.light;
  const changeOutput = useWorkbench((s) => s.changeOutput);
  const { sweep, zSweep, clean, atLimit } = settled;
  const design = settled.solution.design;
  const id = useId();

  const distortion = useMemo<XYSpec | null>(() => {
    const rows = sweep.filter((r) => r.power > 0);
    if (rows.length < 2) return null;
    const series = [
      { key: 'thd', pick: (r: (typeof rows)[number]) => pct(r.thd), stroke: PALETTE.load, dash: undefined },
      { key: 'h2', pick: (r: (typeof rows)[number]) => pct(r.harmonics[2] ?? 0), stroke: PALETTE.point, dash: '6 3' },
      { key: 'h3', pick: (r: (typeof rows)[number]) => pct(r.harmonics[3] ?? 0), stroke: PALETTE.bias, dash: '2 3' },
    ];
    const ys = rows.flatMap((r) => series.map((s) => s.pick(r))).filter((v) => v > 0);
    return {
      width: W,
      height: H,
      x: { domain: [rows[0]!.power, rows[rows.length - 1]!.power], log: true, label: 'Output power (W)' },
      y: { domain: [Math.max(Math.min(...ys), 0.01), Math.max(...ys) * 1.3], log: true, label: 'Distortion (%)' },
      series: series.map((s) => ({ key: s.key, points: rows.map((r) => ({ x: r.power, y: Math.max(s.pick(r), 0.01) })), stroke: s.stroke, ...(s.dash ? { dash: s.dash } : {}) })),
      markers: [{ x: clean.at.power, y: Math.max(pct(clean.at.thd), 0.01), color: PALETTE.point, label: `${watts(clean.at.power)} clean` }],
    };
  }, [sweep, clean]);

  const loadSweep = useMemo<XYSpec | null>(() => {
    if (!zSweep) return null;
    const pts = zSweep.rows.map((r) => ({ x: r.zPrimary, y: r.power }));
    return {
      width: W,
      height: H,
      x: { domain: [pts[0]!.x, pts[pts.length - 1]!.x], log: true, label: 'Primary impedance (Ω)' },
      y: { domain: [0, Math.max(...pts.map((p) => p.y)) * 1.15], label: `Power within ${pct(zSweep.limit).toPrecision(2)} % THD (W)` },
      series: [{ key: 'power', points: pts, stroke: PALETTE.load }],
      markers: [
        { x: zSweep.best.zPrimary, y: zSweep.best.power, color: PALETTE.rival, label: `best ${ohms(zSweep.best.zPrimary)}` },
        ...(design.zPrimary >= pts[0]!.x && design.zPrimary <= pts[pts.length - 1]!.x && atLimit ? [{ x: design.zPrimary, y: atLimit.power, color: PALETTE.point }] : []),
      ],
    };
  }, [zSweep, design.zPrimary, atLimit]);

  return (
    <section className="panel output-signal" aria-labelledby={`${id}-h`}>
      <h2 id={`${id}-h`}>Power and distortion {stale ? <span className="muted">(updating after the drag)</span> : null}</h2>
      <div className="chart-row">
        {distortion ? (
          <MiniChart title="THD (solid), H2 (dashed), H3 (dotted) against power" spec={distortion} description="Total harmonic distortion, second and third harmonic against output power, up to the onset of grid current" />
        ) : (
          <p className="muted">The power sweep follows when the drag ends.</p>
        )}
        {loadSweep ? (
          <MiniChart title="Power at the distortion limit against primary impedance" spec={loadSweep} description="Most power within the distortion limit for each primary impedance at this operating point" />
        ) : null}
      </div>
      {zSweep ? (
        <div className="z-sweep">
          <p>
            At this operating point the most power within {pct(zSweep.limit).toPrecision(2)} % THD is <strong data-figure="best-power">{watts(zSweep.best.power)}</strong> into{' '}
            <strong data-figure="best-z">{ohms(zSweep.best.zPrimary)}</strong> ({zSweep.best.limitedBy === 'distortion' ? 'limited by distortion' : 'limited by grid current'}); the primary now is {ohms(design.zPrimary)}.{' '}
            <button type="button" onClick={() => changeOutput({ zPrimary: zSweep.best.zPrimary })} disabled={zSweep.best.zPrimary === design.zPrimary}>
              Use {ohms(zSweep.best.zPrimary)}
            </button>
          </p>
          <details>
            <summary>The sweep as a table</summary>
            <table className="compare-table">
              <thead>
                <tr><th scope="col">Primary Z</th><th scope="col">Power</th><th scope="col">THD</th><th scope="col">Limited by</th></tr>
              </thead>
              <tbody>
                {zSweep.rows.map((r) => (
                  <tr key={r.zPrimary} className={r === zSweep.best ? 'best' : undefined}>
                    <td>{ohms(r.zPrimary)}</td>
                    <td>{watts(r.power)}</td>
                    <td>{pct(r.thd).toFixed(1)} %</td>
                    <td>{r.limitedBy}</td>
                  </tr>
                ))}
              </tbody>
            </table>
          </details>
        </div>
      ) : null}
    </section>
  );
}
