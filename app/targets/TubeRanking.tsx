import { TARGET_LABELS } from '../../src/index';
import { ohms } from '../format';
import { useWorkbench } from '../store/StoreProvider';
import { marginWords } from './marginWords';

/** Every tube against the same targets, B+ and load, best first, each with the design it would take; one click takes it. */
export function TubeRanking() {
  const ranking = useWorkbench((s) => s.ranking);
  const rankTubesNow = useWorkbench((s) => s.rankTubesNow);
  const takeRanked = useWorkbench((s) => s.takeRanked);
  const follower = useWorkbench((s) => s.design.stageKind === 'follower');
  const result = ranking?.result ?? null;
  return (
    <div className="tube-ranking">
      <button type="button" onClick={rankTubesNow}>Rank every tube for these targets</button>
      {ranking && !result ? <p role="status">Ranking…</p> : null}
      {result && !result.ok ? <p className="field-error" role="alert">{result.message}</p> : null}
      {result?.ok ? (
        <table className="ranking-table">
          <caption>{follower ? 'Each tube as the follower in this socket (its grid on the same plate), at its best Rk, best first' : 'Each tube\'s best design at this B+ and load, best first'}</caption>
          <thead>
            <tr><th scope="col">Tube</th><th scope="col">Ra</th><th scope="col">Rk</th><th scope="col">Weakest target</th><th scope="col"><span className="visually-hidden">Take</span></th></tr>
          </thead>
          <tbody>
            {result.ranks.map((r) => {
              const weakest = r.weakest;
              return (
                <tr key={r.tubeId} className={r.score >= 0 ? 'meets' : 'misses'} data-tube={r.tubeId}>
                  <th scope="row">{r.tubeId}</th>
                  <td>{r.ra > 0 ? ohms(r.ra) : '—'}</td>
                  <td>{ohms(r.rk)}</td>
                  <td>{weakest ? `${TARGET_LABELS[weakest]}, ${marginWords(r.score)}` : '—'}</td>
                  <td><button type="button" onClick={() => takeRanked(r)} aria-label={r.ra > 0 ? `Take the ${r.tubeId} at Ra ${ohms(r.ra)}, Rk ${ohms(r.rk)}` : `Take the ${r.tubeId} as the follower at Rk ${ohms(r.rk)}`}>Take</button></td>
                </tr>
              );
            })}
          </tbody>
        </table>
      ) : null}
    </div>
  );
}
