import { useId, useState } from 'react';
import { mAPerV, ohms, plain } from '../../format';
import { useWorkbench } from '../../store/StoreProvider';
import { followerShown, shownTubeId } from '../../store/shownStage';

/**
 * Choose the tube: a filter box over the library, each entry with the figures
 * a builder weighs first (mu, rp, gm at its datasheet point, rated plate
 * dissipation). A radio group, so arrow keys move through it.
 */
/** Tubes listed at once, at most. */
export const MAX_LISTED = 60;

export function TubeChooser() {
  const tubes = useWorkbench((s) => s.tubes);
  // The tube of the stage shown: the gain stage's, or its follower's when the follower is on the bench.
  const follower = useWorkbench(followerShown);
  const current = useWorkbench(shownTubeId);
  const error = useWorkbench((s) => (followerShown(s) ? s.errors.stage2 : s.errors.tube));
  const chooseGainTube = useWorkbench((s) => s.chooseTube);
  const setStage2 = useWorkbench((s) => s.setStage2);
  const chooseTube = (id: string) => (follower ? setStage2({ tubeId: id }) : chooseGainTube(id));
  const [filter, setFilter] = useState('');
  const filterId = useId();
  const errorId = useId();
  const words = filter.trim().toLowerCase().split(/\s+/).filter(Boolean);
  const matching = tubes.filter((t) => words.every((w) => `${t.id} ${t.description}`.toLowerCase().includes(w)));
  // A list the eye can scan, and the page can draw at once: the chosen tube and the first matches; the filter finds the rest.
  const chosen = tubes.find((t) => t.id === current);
  const shown = matching.length <= MAX_LISTED ? matching : [...matching.filter((t) => t.id === current), ...matching.filter((t) => t.id !== current).slice(0, MAX_LISTED - 1)];

  return (
    <section className="panel tube-chooser" aria-labelledby={`${filterId}-h`}>
      <h2 id={`${filterId}-h`}>{follower ? 'Tube (the follower)' : 'Tube'}</h2>
      <label htmlFor={filterId} className="field-label">Find by type or use</label>
      <input
        id={filterId}
        type="search"
        value={filter}
        placeholder="e.g. 12A, octal, power"
        onChange={(e) => setFilter(e.target.value)}
        aria-describedby={error ? errorId : undefined}
      />
      {error ? <p id={errorId} className="field-error" role="alert">{error}</p> : null}
      <div className="tube-list" role="radiogroup" aria-label="Tubes">
        {matching.length === 0 ? <p className="muted">No tube matches “{filter}”.</p> : null}
        {shown.map((t) => (
          <label key={t.id} className={t.id === current ? 'tube-option chosen' : 'tube-option'} title={t.description}>
            <input type="radio" name="tube" value={t.id} checked={t.id === current} onChange={() => chooseTube(t.id)} />
            <span className="tube-id">{t.id}{t.userMade ? <span className="yours"> · yours</span> : null}</span>
            <span className="tube-figures">
              μ {plain(t.mu, 2)} · rp {ohms(t.rp)} · gm {mAPerV(t.gm)} · {t.maxPlateDissipation} W
            </span>
            <span className="tube-desc">{t.description}</span>
          </label>
        ))}
        {matching.length > shown.length ? <p className="muted">{`${matching.length - shown.length} more: type in the box to narrow the list.`}</p> : null}
      </div>
      {chosen ? <p className="fit-basis"><strong>{chosen.id}'s model:</strong> {chosen.fitBasis}</p> : null}
    </section>
  );
}
