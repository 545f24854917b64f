import type { StageFinding, StageResult } from '../../../src/index';
import { plain } from '../../format';
import type { ChainCardName } from '../../store/amplifierChain';

/** Headroom shown on each card's bar: 20 dB fills it. */
const HEADROOM_FULL_DB = 20;

function worstOf(findings: readonly Pick<StageFinding, "severity" | "message">[]): { text: string; severity: 'danger' | 'warning' | 'ok' } {
  const f = findings.find((x) => x.severity === 'danger') ?? findings.find((x) => x.severity === 'warning');
  return f ? { text: f.message, severity: f.severity as 'danger' | 'warning' } : { text: 'Within every rating', severity: 'ok' };
}

export interface StageCardProps {
  readonly name: ChainCardName;
  readonly kind: string;
  /** The stage solved in the amplifier; null while the amplifier cannot be solved (the card still opens its stage). */
  readonly result: StageResult | null;
  readonly clipsFirst: { readonly by: 'grid-current' | 'cutoff' } | null;
  /** The amplifier has no clean swing (a stage clips with no signal): no headroom to read against it. */
  readonly noSwing?: boolean;
  readonly onBench: boolean;
  readonly onOpen: () => void;
}

/** One stage of the amplifier: its kind, tube, gain, headroom and worst finding; pressing it puts the stage on the bench. */
export function StageCard({ name, kind, result, clipsFirst, noSwing = false, onBench, onOpen }: StageCardProps) {
  const worst = result ? worstOf(result.findings) : null;
  const headroom = result?.headroomDb ?? null;
  return (
    <button type="button" className={`chain-card ${worst?.severity ?? 'ok'}`} aria-pressed={onBench} onClick={onOpen}>
      <span className="card-title">{name.title} · {name.tube} <span className="card-kind">{kind.toLowerCase()}</span></span>
      {result ? (
        <>
          <span className="card-gain">gain {plain(result.gain)}×{result.kind === 'single-ended-output' || result.kind === 'push-pull-output' ? ' (grid to speaker)' : ''}</span>
          <span className="card-headroom">
            <meter min={0} max={HEADROOM_FULL_DB} low={3} optimum={HEADROOM_FULL_DB} value={noSwing ? 0 : headroom === null ? HEADROOM_FULL_DB : Math.min(headroom, HEADROOM_FULL_DB)} aria-label="headroom" />
            {clipsFirst
              ? `${noSwing ? 'clips at rest' : 'clips first'} (${clipsFirst.by === 'grid-current' ? 'grid current' : 'cutoff'})`
              : noSwing ? 'no clean swing' : headroom === null ? 'never clips' : `${headroom.toFixed(1)} dB headroom`}
          </span>
          <span className={`card-worst ${worst!.severity}`} title={worst!.text}>{worst!.severity === 'ok' ? '✓ ' : worst!.severity === 'danger' ? '⚠ Danger: ' : '⚠ '}{worst!.text}</span>
        </>
      ) : (
        <span className="card-gain">not solved</span>
      )}
    </button>
  );
}
