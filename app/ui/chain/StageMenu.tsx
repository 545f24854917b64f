import { useWorkbench } from '../../store/StoreProvider';

export interface StageMenuProps {
  /** The stage's place among the voltage stages. */
  readonly index: number;
  readonly title: string;
  readonly isFollower: boolean;
  readonly first: boolean;
  readonly last: boolean;
  /** Whether a cathode follower can be added after this gain stage. */
  readonly followerFits: boolean;
  readonly full: boolean;
  /** False for the only gain stage: an amplifier keeps one. */
  readonly removable: boolean;
}

/**
 * What can be done to a voltage stage from the strip: move it (with its
 * follower) toward the input or the output, remove it, or add a stage after
 * it. Each is one undo step.
 */
export function StageMenu({ index, title, isFollower, first, last, followerFits, full, removable }: StageMenuProps) {
  const addStage = useWorkbench((s) => s.addStage);
  const dropStage = useWorkbench((s) => s.dropStage);
  const shiftStage = useWorkbench((s) => s.shiftStage);
  return (
    <div className="stage-menu" role="group" aria-label={`${title}: move, remove, add after`}>
      {!isFollower && (
        <>
          <button type="button" disabled={first} onClick={() => shiftStage(index, -1)} title={`Move ${title} toward the input`} aria-label={`Move ${title} toward the input`}>◀</button>
          <button type="button" disabled={last} onClick={() => shiftStage(index, 1)} title={`Move ${title} toward the output`} aria-label={`Move ${title} toward the output`}>▶</button>
        </>
      )}
      <button type="button" disabled={!removable} onClick={() => dropStage(index)} title={isFollower ? `Remove ${title}` : `Remove ${title} (and its follower)`} aria-label={`Remove ${title}`}>✕</button>
      <button type="button" disabled={full} onClick={() => addStage(index, 'common-cathode')} title={`Add a gain stage after ${title}`} aria-label={`Add a gain stage after ${title}`}>+ gain stage</button>
      {followerFits && (
        <button type="button" disabled={full} onClick={() => addStage(index, 'follower')} title={`Add a cathode follower direct-coupled to ${title}'s plate`} aria-label={`Add a cathode follower direct-coupled to ${title}'s plate`}>+ follower</button>
      )}
    </div>
  );
}
