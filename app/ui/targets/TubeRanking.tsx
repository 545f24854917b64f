import { TARGET_LABELS, type OutputRank, type TubeRank } from '../../../src/index';
import { ohms, plain } from '../../format';
import { useWorkbench } from '../../store/StoreProvider';
import { marginWords } from './marginWords';

/** Every tube against the same targets, B+ and load, best first, each with the design it would take; one click takes it. */
export function TubeRanking() {
  const output = useWorkbench((s) => s.design.stageKind === 'output');
  const ranking = useWorkbench((s) => (s.design.stageKind === 'output' ? s.outputRanking : s.ranking));
  const rankTubesNow = useWorkbench((s) => s.rankTubesNow);
  const result = ranking?.result ?? null;
  return (
    <div className="tube-ranking">
      <button type="button" onClick={rankTubesNow}>Rank every tube for these targets</button>
      {ranking && !result ? <p role="status">Ranking…</p> : null}
      {result && !result.ok ? <p className="field-error" role="alert">{result.message}</p> : null}
      {result?.ok ? (output ? <OutputTable ranks={result.ranks as OutputRank[]} /> : <StageTable ranks={result.ranks as TubeRank[]} />) : null}
    </div>
  );
}

/** Where a ranked tube stands: every target met, or its weakest one and by how much. */
const weakestWords = (r: { readonly weakest: keyof typeof TARGET_LABELS | null; readonly score: number }) => (r.weakest ? `${TARGET_LABELS[r.weakest]}, ${marginWords(r.score)}` : '—');

function StageTable({ ranks }: { ranks: readonly TubeRank[] }) {
  const follower = useWorkbench((s) => s.design.stageKind === 'follower');
  const takeRanked = useWorkbench((s) => s.takeRanked);
  return (
    <table className="ranking-table">
      <caption>{follower ? 'Each tube as the follower in this socket (its grid on the same plate), at its best Rk, best first' : 'Each tube\'s best design at this B+ and load, best first'}</caption>
      <thead>
        <tr><th scope="col">Tube</th><th scope="col">Ra</th><th scope="col">Rk</th><th scope="col">Weakest target</th><th scope="col"><span className="visually-hidden">Take</span></th></tr>
      </thead>
      <tbody>
        {ranks.map((r) => (
          <tr key={r.tubeId} className={r.score >= 0 ? 'meets' : 'misses'} data-tube={r.tubeId}>
            <th scope="row">{r.tubeId}</th>
            <td>{r.ra > 0 ? ohms(r.ra) : '—'}</td>
            <td>{ohms(r.rk)}</td>
            <td>{weakestWords(r)}</td>
            <td><button type="button" onClick={() => takeRanked(r)} aria-label={r.ra > 0 ? `Take the ${r.tubeId} at Ra ${ohms(r.ra)}, Rk ${ohms(r.rk)}` : `Take the ${r.tubeId} as the follower at Rk ${ohms(r.rk)}`}>Take</button></td>
          </tr>
        ))}
      </tbody>
    </table>
  );
}

function OutputTable({ ranks }: { ranks: readonly OutputRank[] }) {
  const cathode = useWorkbench((s) => s.design.output.bias === 'cathode');
  const take = useWorkbench((s) => s.takeOutputRank);
  const bias = (r: OutputRank) => (cathode ? `Rk ${ohms(r.parts.rk)}` : `grid ${plain(r.parts.vg)} V`);
  return (
    <table className="ranking-table">
      <caption>Each output tube in this socket (same load, connection and kind of bias; a power triode as a triode), at its best idle point, best first</caption>
      <thead>
        <tr><th scope="col">Tube</th><th scope="col">B+</th><th scope="col">Bias</th><th scope="col">Weakest target</th><th scope="col"><span className="visually-hidden">Take</span></th></tr>
      </thead>
      <tbody>
        {ranks.map((r) => (
          <tr key={r.tubeId} className={r.score >= 0 ? 'meets' : 'misses'} data-tube={r.tubeId}>
            <th scope="row">{r.tubeId}</th>
            <td>{`${plain(r.parts.bplus)} V`}</td>
            <td>{bias(r)}</td>
            <td>{weakestWords(r)}</td>
            <td><button type="button" onClick={() => take(r)} aria-label={`Take the ${r.tubeId} at B+ ${plain(r.parts.bplus)} V, ${bias(r)}`}>Take</button></td>
          </tr>
        ))}
      </tbody>
    </table>
  );
}
