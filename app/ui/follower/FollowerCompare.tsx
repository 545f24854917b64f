import { useId } from 'react';
import type { FollowerSolution } from '../../../src/index';
import { milliamps, ohms, plain, volts, watts } from '../../format';
import { useWorkbench } from '../../store/StoreProvider';
import { SecondTubeChoice } from '../panels/SecondTubeChoice';

interface Row {
  readonly key: string;
  readonly label: string;
  readonly value: (s: FollowerSolution) => number;
  readonly show: (x: number) => string;
}

const ROWS: readonly Row[] = [
  { key: 'vk', label: 'Vk (the output\'s DC)', value: (s) => s.op.vk, show: volts },
  { key: 'ia', label: 'Ia', value: (s) => s.op.ia, show: milliamps },
  { key: 'vgk', label: 'Vgk', value: (s) => s.op.vgk, show: volts },
  { key: 'pa', label: 'Pa', value: (s) => s.op.pa, show: watts },
  { key: 'gain', label: 'Gain', value: (s) => s.gain, show: (x) => `${plain(x, 3)} ×` },
  { key: 'zout', label: 'Zout', value: (s) => s.zout, show: ohms },
  { key: 'vhk', label: 'Heater–cathode', value: (s) => s.vhk, show: volts },
];

/**
 * A second tube in the follower's socket: the same Rk and the same grid
 * voltage (a tube swap), its point and lines on the shared chart, and the
 * two side by side here.
 */
export function FollowerCompare() {
  const rival = useWorkbench((s) => s.rival);
  const first = useWorkbench((s) => s.followerBench);
  const second = useWorkbench((s) => s.followerRival);
  const id = useId();
  if (!first) return null;
  return (
    <section className="panel compare" aria-labelledby={`${id}-h`}>
      <h2 id={`${id}-h`}>Compare the follower</h2>
      <SecondTubeChoice id={id} />
      <p className="field-hint">In the same socket: the same Rk, its grid on the same plate. Drag the first tube's point to move both.</p>
      {rival.on && second && !second.ok ? <p className="field-error" role="alert">{`The ${rival.tubeId} cannot follow here: ${second.message}`}</p> : null}
      {rival.on && second?.ok ? (
        <table className="compare-table">
          <thead>
            <tr><th scope="col">At the operating point</th><th scope="col">{first.tube.id}</th><th scope="col">{second.tube.id}</th></tr>
          </thead>
          <tbody>
            {ROWS.map((row) => (
              <tr key={row.key} data-row={row.key}>
                <th scope="row">{row.label}</th>
                <td>{row.show(row.value(first.plane.solution))}</td>
                <td>{row.show(row.value(second.plane.solution))}</td>
              </tr>
            ))}
          </tbody>
        </table>
      ) : null}
    </section>
  );
}
