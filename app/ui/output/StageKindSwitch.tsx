import { useWorkbench } from '../../store/StoreProvider';
import type { StageKind } from '../../store/analysis';

const KINDS: { kind: StageKind; label: string }[] = [
  { kind: 'voltage', label: 'Voltage stage (resistance-coupled)' },
  { kind: 'follower', label: 'Its cathode follower' },
  { kind: 'output', label: 'Output stage (transformer-coupled)' },
];

/** Which stage the bench works on: the voltage stage, its follower when it has one, or the output stage. Every design is kept; switching loses nothing. */
export function StageKindSwitch() {
  const kind = useWorkbench((s) => s.design.stageKind);
  const hasFollower = useWorkbench((s) => s.design.stage2.kind === 'follower');
  const setStageKind = useWorkbench((s) => s.setStageKind);
  return (
    <fieldset className="stage-kind" aria-label="Stage to design">
      {KINDS.filter((k) => k.kind !== 'follower' || hasFollower).map((k) => (
        <label key={k.kind} className={kind === k.kind ? 'chosen' : undefined}>
          <input type="radio" name="stage-kind" value={k.kind} checked={kind === k.kind} onChange={() => setStageKind(k.kind)} />
          {k.label}
        </label>
      ))}
    </fieldset>
  );
}
