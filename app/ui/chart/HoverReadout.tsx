import { cursorTargetWords } from '../targets/cursorTargets';
import { milliamps, plain } from '../../format';
import { failingAt } from '../../store/regionSlice';
import { useWorkbench } from '../../store/StoreProvider';
import { followerShown } from '../../store/shownStage';

/** What the model says at the cursor: plate voltage, plate current and the grid voltage of the curve through it. */
export function HoverReadout() {
  const hover = useWorkbench((s) => s.hover);
  const follower = useWorkbench(followerShown);
  const note = useWorkbench((s) => s.dragNote);
  const region = useWorkbench((s) => (s.region?.result.ok ? s.region.result : null));
  const failing = hover && region ? failingAt(region, hover.vpk, hover.ia) : null;
  const targets = cursorTargetWords(failing, 'no stage on this B+ sits here');
  return (
    <div className="chart-status" aria-live="polite">
      {note ? <p className="drag-note">{note}</p> : null}
      <p className="hover-readout" data-testid="hover-readout">
        {hover
          ? `Cursor: Vpk ${plain(hover.vpk)} V · Ia ${milliamps(hover.ia)} · Vgk ${hover.vgk === null ? 'above 0 V (grid current)' : `${plain(hover.vgk)} V`}${targets}`
          : follower
            ? 'Point at the curves to read Vpk, Ia and Vgk; drag the orange point along its dotted line to choose the follower\'s Rk.'
            : 'Point at the curves to read Vpk, Ia and Vgk; drag the orange point to choose Ra and Rk.'}
      </p>
    </div>
  );
}
