import { useId } from 'react';
import { useWorkbench } from '../../store/StoreProvider';

/** How densely the plate family is drawn: a sparse sheet reads faster, a dense one interpolates better. */
export function CurveDensity() {
  const count = useWorkbench((s) => s.curveCount);
  const setCount = useWorkbench((s) => s.setCurveCount);
  const id = useId();
  return (
    <div className="curve-density">
      <label htmlFor={id}>Plate curves drawn</label>
      <select id={id} value={count} onChange={(e) => setCount(Number(e.target.value))}>
        <option value={6}>up to 6</option>
        <option value={12}>up to 12</option>
        <option value={24}>up to 24</option>
      </select>
    </div>
  );
}
