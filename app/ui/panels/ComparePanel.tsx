import { useId } from 'react';
import type { Analysis } from '../../store/analysis';
import { mAPerV, milliamps, ohms, plain, volts, watts, voltsRms } from '../../format';
import { rivalDesign } from '../../store/compareSlice';
import { useWorkbench } from '../../store/StoreProvider';
import { SecondTubeChoice } from './SecondTubeChoice';
import { AmplifierCompare } from './AmplifierCompare';
import { sameEntries, useDragPaced } from './useDragPaced';

/** One row of the comparison: how to read a figure from an analysis, how to show it, and how to show a difference. */
interface Row {
  readonly label: string;
  readonly key: string;
  readonly value: (a: Analysis) => number | null;
  readonly show: (v: number) => string;
  /** Differences as a ratio (for quantities that scale), a plain difference, or percentage points (for shares in %). */
  readonly diff: 'ratio' | 'difference' | 'points';
}

export const COMPARE_ROWS: readonly Row[] = [
  { label: 'Va', key: 'va', value: (a) => a.solution.op.va, show: volts, diff: 'difference' },
  { label: 'Ia', key: 'ia', value: (a) => a.solution.op.ia, show: milliamps, diff: 'ratio' },
  { label: 'Vgk', key: 'vgk', value: (a) => a.solution.op.vgk, show: volts, diff: 'difference' },
  { label: 'Pa', key: 'pa', value: (a) => a.solution.op.pa, show: watts, diff: 'ratio' },
  { label: 'Pa / rating', key: 'pa-share', value: (a) => (100 * a.solution.op.pa) / a.tube.ratings.maxPlateDissipation, show: (v) => `${v.toFixed(0)} %`, diff: 'points' },
  { label: 'μ', key: 'mu', value: (a) => a.solution.mu, show: (v) => plain(v), diff: 'ratio' },
  { label: 'rp', key: 'rp', value: (a) => a.solution.rp, show: ohms, diff: 'ratio' },
  { label: 'gm', key: 'gm', value: (a) => a.solution.gm, show: mAPerV, diff: 'ratio' },
  { label: 'Gain', key: 'gain', value: (a) => a.solution.gain, show: (v) => `${plain(v)} ×`, diff: 'ratio' },
  { label: 'Zout', key: 'zout', value: (a) => a.solution.zout, show: ohms, diff: 'ratio' },
  { label: 'Clean output', key: 'swing', value: (a) => a.signal.swing.output.rms, show: (v) => voltsRms(v), diff: 'ratio' },
  { label: 'THD at the level', key: 'thd', value: (a) => (a.signal.distortion.ok ? a.signal.distortion.thdPercent : null), show: (v) => `${plain(v)} %`, diff: 'ratio' },
];

/** A whole number with its sign, none for zero. */
const signed = (n: number, unit: string) => `${n > 0 ? '+' : n < 0 ? '−' : ''}${Math.abs(n)}${unit}`;

/**
 * The second design's value against the first: a percentage for quantities
 * that scale, percentage points between two shares (20 % → 9 % is −11
 * points, not −11 %), else a signed difference.
 */
export function difference(row: Pick<Row, 'show' | 'diff'>, a: number | null, b: number | null): string {
  if (a === null || b === null) return '—';
  // Rounded before the sign is chosen: a change too small to show reads "0", not "−0".
  if (row.diff === 'points') return signed(Math.round(b - a), ' points');
  if (row.diff === 'ratio') return a === 0 ? '—' : signed(Math.round((b / a - 1) * 100), ' %');
  const d = b - a;
  return `${d >= 0 ? '+' : '−'}${row.show(Math.abs(d))}`.replace('−−', '−');
}

/** Weigh a second tube: choose it and how it is fitted, swap which is first, and read both designs side by side. */
export function ComparePanel() {
  const rival = useWorkbench((s) => s.rival);
  const setRival = useWorkbench((s) => s.setRival);
  const swapTubes = useWorkbench((s) => s.swapTubes);
  // The chart shows both points live; the table follows a drag at a readable pace (useDragPaced).
  const [first, second, design] = useDragPaced((s) => [s.analysis, s.rivalAnalysis, s.design] as const, { equal: sameEntries });
  const amplifier = useWorkbench((s) => s.amplifier);
  const rivalAmplifier = useWorkbench((s) => s.rivalAmplifier);
  const other = rivalDesign(design, rival);
  const id = useId();
  return (
    <section className="panel compare" aria-labelledby={`${id}-h`}>
      <h2 id={`${id}-h`}>Compare</h2>
      <SecondTubeChoice id={id}>
        <button type="button" onClick={swapTubes} disabled={!rival.on}>Swap first and second</button>
      </SecondTubeChoice>
      <fieldset className="option-row" disabled={!rival.on}>
        <legend className="visually-hidden">How the second tube is fitted</legend>
        <label><input type="radio" name={`${id}-mode`} checked={rival.mode === 'same-parts'} onChange={() => setRival({ mode: 'same-parts' })} /> Same parts (a tube swap)</label>
        <label><input type="radio" name={`${id}-mode`} checked={rival.mode === 'own-values'} onChange={() => setRival({ mode: 'own-values' })} /> Each its own Ra, Rk (drag the square)</label>
      </fieldset>
      {rival.on && second && !second.ok ? <p className="field-error" role="alert">{`The ${rival.tubeId} cannot run here: ${second.message}`}</p> : null}
      {rival.on && second?.ok ? (
        <table className="compare-table">
          <thead>
            <tr><th scope="col">At the operating point</th><th scope="col">{first.tube.id}</th><th scope="col">{second.tube.id}</th><th scope="col">Second vs first</th></tr>
          </thead>
          <tbody>
            <tr><th scope="row">Ra, Rk</th><td>{`${ohms(design.ra)}, ${ohms(design.rk)}`}</td><td>{`${ohms(other.ra)}, ${ohms(other.rk)}`}</td><td /></tr>
            {COMPARE_ROWS.map((row) => {
              const a = row.value(first);
              const b = row.value(second);
              return (
                <tr key={row.key} data-row={row.key}>
                  <th scope="row">{row.label}</th>
                  <td>{a === null ? '—' : row.show(a)}</td>
                  <td>{b === null ? '—' : row.show(b)}</td>
                  <td>{difference(row, a, b)}</td>
                </tr>
              );
            })}
          </tbody>
        </table>
      ) : null}
      {rival.on && second?.ok ? <AmplifierCompare first={amplifier} second={rivalAmplifier} /> : null}
    </section>
  );
}

