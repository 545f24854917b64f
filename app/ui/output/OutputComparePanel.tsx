import { useId } from 'react';
import { connectionsOf, findOutputTube, outputTubeLibrary, type OutputAnalysis, type PushPullAnalysis } from '../../../src/index';
import { mAPerV, milliamps, ohms, plain, volts, watts } from '../../format';
import { difference } from '../panels/ComparePanel';
import { useWorkbench } from '../../store/StoreProvider';
import { rivalConnection, type OutputBench, type OutputRival } from '../../store/outputAnalysis';
import { sameEntries, useDragPaced } from '../panels/useDragPaced';

interface Row<A = OutputAnalysis> {
  readonly label: string;
  readonly key: string;
  readonly value: (a: A) => number | null;
  readonly show: (v: number) => string;
  readonly diff: 'ratio' | 'difference' | 'points';
  /** Left out of the table where neither stage has it (a shared cathode resistor's figures under fixed bias). */
  readonly ifAny?: true;
}

const share = (v: number, rating: number | null) => (rating ? (100 * v) / rating : null);

export const OUTPUT_COMPARE_ROWS: readonly Row[] = [
  { label: 'Vpk', key: 'vpk', value: (a) => a.solution.op.vpk, show: volts, diff: 'difference' },
  { label: 'Plate current', key: 'ip', value: (a) => a.solution.op.ip, show: milliamps, diff: 'ratio' },
  { label: 'Vgk', key: 'vgk', value: (a) => a.solution.op.vgk, show: volts, diff: 'difference' },
  { label: 'Pa / rating', key: 'pa-share', value: (a) => share(a.solution.op.pa, a.solution.tube.ratings.maxPlateDissipation), show: (v) => `${v.toFixed(0)} %`, diff: 'points' },
  { label: 'Pa / rating, a tube +20 %', key: 'spread-pa', value: (a) => (a.spread ? share(a.spread.strongest.pa, a.solution.tube.ratings.maxPlateDissipation) : null), show: (v) => `${v.toFixed(0)} %`, diff: 'points', ifAny: true },
  { label: 'Pg2 / rating', key: 'pg2-share', value: (a) => (a.solution.op.connection === 'triode' ? null : share(a.solution.op.pg2, a.solution.tube.ratings.maxScreenDissipation)), show: (v) => `${v.toFixed(0)} %`, diff: 'points' },
  { label: 'rp as wired', key: 'rp', value: (a) => a.solution.op.rp, show: ohms, diff: 'ratio' },
  { label: 'gm', key: 'gm', value: (a) => a.solution.op.gm, show: mAPerV, diff: 'ratio' },
  { label: 'Damping factor', key: 'damping', value: (a) => a.dampingFactor, show: (v) => plain(v, 2), diff: 'ratio' },
  { label: 'Power at grid-current or cutoff onset', key: 'clean', value: (a) => a.clean.at.power, show: watts, diff: 'ratio' },
  { label: 'THD at that onset', key: 'clean-thd', value: (a) => a.clean.at.thd * 100, show: (v) => `${plain(v, 2)} %`, diff: 'ratio' },
  { label: 'Rk settled at full drive: Vk', key: 'settled-vk', value: (a) => a.settledCathode?.vk ?? null, show: volts, diff: 'difference', ifAny: true },
  { label: 'Power, grid to 0 V there', key: 'settled', value: (a) => a.settledCathode?.full.power ?? null, show: watts, diff: 'ratio', ifAny: true },
  { label: 'Power within the THD limit', key: 'limit', value: (a) => a.atLimit?.power ?? null, show: watts, diff: 'ratio' },
  { label: 'Best primary Z at the limit', key: 'best-z', value: (a) => a.zSweep?.best.zPrimary ?? null, show: ohms, diff: 'ratio' },
];

const worse = (a: PushPullAnalysis, pick: (p: PushPullAnalysis['solution']['idle'][0]) => number) => Math.max(pick(a.solution.idle[0]), pick(a.solution.idle[1]));

/** The same comparison for two pairs in the same sockets. */
export const PAIR_COMPARE_ROWS: readonly Row<PushPullAnalysis>[] = [
  { label: 'Vpk (each)', key: 'vpk', value: (a) => a.solution.idle[0].vpk, show: volts, diff: 'difference' },
  { label: 'Plate current (each)', key: 'ip', value: (a) => a.solution.idle[0].ip, show: milliamps, diff: 'ratio' },
  { label: 'Vgk', key: 'vgk', value: (a) => a.solution.vgk, show: volts, diff: 'difference' },
  { label: 'Pa / rating at idle', key: 'pa-share', value: (a) => share(worse(a, (p) => p.pa), a.solution.tube.ratings.maxPlateDissipation), show: (v) => `${v.toFixed(0)} %`, diff: 'points' },
  { label: 'Pa / rating at idle, tubes +20 %', key: 'spread-pa', value: (a) => (a.spread ? share(a.spread.strongest.pa, a.solution.tube.ratings.maxPlateDissipation) : null), show: (v) => `${v.toFixed(0)} %`, diff: 'points', ifAny: true },
  { label: 'Worst Pa / rating under drive', key: 'worst-pa', value: (a) => (a.figures ? share(a.figures.worstPlate.watts, a.solution.tube.ratings.maxPlateDissipation) : null), show: (v) => `${v.toFixed(0)} %`, diff: 'points' },
  { label: 'Power, grids to 0 V', key: 'full', value: (a) => a.full.power, show: watts, diff: 'ratio' },
  { label: 'THD there', key: 'full-thd', value: (a) => a.full.thd * 100, show: (v) => `${plain(v, 2)} %`, diff: 'ratio' },
  { label: 'Shared Rk settled at full drive: Vk', key: 'settled-vk', value: (a) => a.settledBias?.vk ?? null, show: volts, diff: 'difference', ifAny: true },
  { label: 'Power, grids to 0 V there', key: 'settled', value: (a) => a.settledBias?.full.power ?? null, show: watts, diff: 'ratio', ifAny: true },
  { label: 'Power within the THD limit', key: 'limit', value: (a) => (a.figures && !a.figures.overThdEverywhere ? (a.figures.atThdLimit ?? a.figures.atZeroGrid).power : null), show: watts, diff: 'ratio' },
  { label: 'Damping factor', key: 'damping', value: (a) => a.figures?.dampingFactor ?? null, show: (v) => plain(v, 2), diff: 'ratio' },
  { label: 'B+ current at full drive', key: 'supply-full', value: (a) => a.supplyCurrent.full, show: milliamps, diff: 'ratio' },
];

/** Rows and their values for whichever kind of stage both benches hold (the rival copies the design, so they agree). */
export function compareCells(first: OutputBench, second: OutputBench): { readonly key: string; readonly label: string; readonly a: string; readonly b: string; readonly diff: string }[] {
  const cells = <A,>(rows: readonly Row<A>[], x: A, y: A) =>
    rows.filter((row) => !row.ifAny || row.value(x) !== null || row.value(y) !== null).map((row) => {
      const va = row.value(x);
      const vb = row.value(y);
      return { key: row.key, label: row.label, a: va === null ? '—' : row.show(va), b: vb === null ? '—' : row.show(vb), diff: difference(row, va, vb) };
    });
  if (first.pair === 'push-pull' && second.pair === 'push-pull') return cells(PAIR_COMPARE_ROWS, first.analysis, second.analysis);
  if (first.pair === 'single-ended' && second.pair === 'single-ended') return cells(OUTPUT_COMPARE_ROWS, first.analysis, second.analysis);
  return [];
}

/** How the stage's tube is wired, for the table's heading. */
const wiring = (b: OutputBench) => (b.pair === 'push-pull' ? `${b.analysis.solution.feed.kind === 'tied' ? 'triode' : b.analysis.solution.feed.kind === 'tap' ? 'ultralinear' : 'pentode'} pair` : b.analysis.solution.op.connection);

/** Two output tubes in the same socket (same B+, transformer and bias parts), on one chart and side by side. */
export function OutputComparePanel() {
  const rival = useWorkbench((s) => s.outputRival);
  const setOutputRival = useWorkbench((s) => s.setOutputRival);
  // The chart shows both points live; the table follows a drag at a readable pace (useDragPaced).
  const [first, second] = useDragPaced((s) => [s.outputBench, s.outputRivalBench] as const, { equal: sameEntries });
  const id = useId();
  const rivalTube = findOutputTube(rival.tubeId);
  const connections = rivalTube ? connectionsOf(rivalTube) : [];
  const asWired = useWorkbench((s) => rivalConnection(s.design.output, s.outputRival));
  const b = second && second.ok ? second : null;
  return (
    <section className="panel compare" aria-labelledby={`${id}-h`}>
      <h2 id={`${id}-h`}>Compare output tubes</h2>
      <div className="option-row">
        <label>
          <input type="checkbox" checked={rival.on} onChange={(e) => setOutputRival({ on: e.target.checked })} /> Compare with
        </label>
        <label htmlFor={`${id}-tube`} className="visually-hidden">Second output tube</label>
        <select id={`${id}-tube`} value={rival.tubeId} onChange={(e) => setOutputRival({ tubeId: e.target.value, on: true })}>
          {outputTubeLibrary.map((t) => <option key={t.id} value={t.id}>{t.id}</option>)}
        </select>
        <label htmlFor={`${id}-conn`} className="visually-hidden">Its connection</label>
        <select id={`${id}-conn`} value={connections.length > 1 ? rival.connection : 'as-wired'} onChange={(e) => setOutputRival({ connection: e.target.value as OutputRival['connection'] })}>
          <option value="as-wired">{connections.length > 1 ? `as wired (${asWired})` : 'triode'}</option>
          {connections.length > 1 ? connections.map((c) => <option key={c} value={c}>{c}</option>) : null}
        </select>
      </div>
      {rival.on && second && !second.ok ? <p className="field-error" role="alert">The {rival.tubeId} cannot run with these parts: {second.message}</p> : null}
      {rival.on && b ? (
        <table className="compare-table">
          <thead>
            <tr>
              <th scope="col">Same parts</th>
              <th scope="col">{first.analysis.solution.tube.id} ({wiring(first)})</th>
              <th scope="col">{b.analysis.solution.tube.id} ({wiring(b)})</th>
              <th scope="col">Difference</th>
            </tr>
          </thead>
          <tbody>
            {compareCells(first, b).map((c) => (
              <tr key={c.key} data-row={c.key}>
                <th scope="row">{c.label}</th>
                <td>{c.a}</td>
                <td>{c.b}</td>
                <td>{c.diff}</td>
              </tr>
            ))}
          </tbody>
        </table>
      ) : null}
    </section>
  );
}
