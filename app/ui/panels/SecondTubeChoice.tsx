import type { ReactNode } from 'react';
import { useWorkbench } from '../../store/StoreProvider';

/** Comparing on or off, and which tube is second: shared by the stage's and the follower's compare panels. */
export function SecondTubeChoice({ id, children }: { id: string; children?: ReactNode }) {
  const rival = useWorkbench((s) => s.rival);
  const setRival = useWorkbench((s) => s.setRival);
  const tubes = useWorkbench((s) => s.tubes);
  return (
    <div className="option-row">
      <label>
        <input type="checkbox" checked={rival.on} onChange={(e) => setRival({ on: e.target.checked })} /> Compare with
      </label>
      <label htmlFor={`${id}-tube`} className="visually-hidden">Second tube</label>
      <select id={`${id}-tube`} value={rival.tubeId} onChange={(e) => setRival({ tubeId: e.target.value, on: true })}>
        {tubes.map((t) => <option key={t.id} value={t.id}>{t.id}</option>)}
      </select>
      {children}
    </div>
  );
}
