import { watts } from '../format';
import { useWorkbench } from '../store/StoreProvider';
import { worstOf } from './StageCard';

/**
 * The push-pull pair's card at the end of the strip: its tubes, the power
 * with the grids driven to 0 V and its worst finding. The pair is not solved
 * in the chain (no phase splitter yet), so the card has no gain or headroom.
 */
export function PairCard() {
  const tubeId = useWorkbench((s) => s.design.output.tubeId);
  const onBench = useWorkbench((s) => s.design.stageKind === 'output');
  const setStageKind = useWorkbench((s) => s.setStageKind);
  // Read from the last full pass: the card need not follow a drag frame by frame.
  const settled = useWorkbench((s) => (s.outputBench.pair === 'push-pull' ? s.outputBench.settled : null));
  if (!settled) return null;
  const worst = worstOf(settled.findings);
  return (
    <button type="button" className={`chain-card ${worst.severity}`} aria-pressed={onBench} onClick={() => setStageKind('output')}>
      <span className="card-title">Output · 2 × {tubeId} <span className="card-kind">push-pull pair</span></span>
      <span className="card-gain">{watts(settled.full.power)} with the grids driven to 0 V</span>
      <span className={`card-worst ${worst.severity}`} title={worst.text}>{worst.severity === 'ok' ? '✓ ' : worst.severity === 'danger' ? '⚠ Danger: ' : '⚠ '}{worst.text}</span>
    </button>
  );
}
