import { useId } from 'react';
import { TARGET_LABELS, type FollowerRegion, type PlaneRegion, type TargetName } from '../../../src/index';
import type { RegionView } from '../../store/regionSlice';
import { targetPlanOf } from '../../store/targetPlan';
import { benchHeaterVolts } from '../../store/heaterSharing';
import { ohms, plain } from '../../format';
import { ValueField } from '../panels/ValueField';
import { useWorkbench } from '../../store/StoreProvider';
import { TubeRanking } from './TubeRanking';
import { marginWords } from './marginWords';
import { targetWithValue } from './targetValue';

/**
 * What the builder asks of the stage on the bench, each box optional, and
 * what the region on the chart says about it: how much of the plane meets
 * everything, or which target shuts it out and by how much the best point
 * misses. The region itself is worked out off the page's thread.
 */
export function TargetsPanel() {
  const heater = useWorkbench((s) => targetPlanOf(s.design).heaterCathodeWithinRating);
  const heaterVolts = useWorkbench(benchHeaterVolts);
  const keepInside = useWorkbench((s) => s.keepInside);
  const output = useWorkbench((s) => s.design.stageKind === 'output');
  const cathodeBias = useWorkbench((s) => s.design.output.bias === 'cathode');
  const gainRegion = useWorkbench((s) => (s.design.stageKind === 'output' ? null : s.region));
  const outputRegion = useWorkbench((s) => (s.design.stageKind === 'output' ? s.outputRegion : null));
  const region: RegionView<PlaneRegion> | null = gainRegion ?? outputRegion;
  const follower = useWorkbench((s) => s.design.stageKind === 'follower');
  const along = useWorkbench((s) => s.followerRegion);
  const verdict = useWorkbench((s) => s.verdict);
  const setHeaterTarget = useWorkbench((s) => s.setHeaterTarget);
  const setKeepInside = useWorkbench((s) => s.setKeepInside);
  const moveToBest = useWorkbench((s) => s.moveToBest);
  const snapSeries = useWorkbench((s) => (s.design.snap ? s.design.series : null));
  const clearTargets = useWorkbench((s) => s.clearTargets);
  const id = useId();
  const r = gainRegion?.result.ok ? gainRegion.result : null;
  const o = outputRegion?.result.ok ? outputRegion.result : null;
  const f = follower && along?.result.ok ? along.result : null;
  const anySet = region !== null || (follower && along !== null);
  return (
    <section className="panel targets-panel" aria-labelledby={`${id}-h`}>
      <h2 id={`${id}-h`}>Targets for this stage</h2>
      <p className="panel-note">
        {follower
          ? 'Leave a box empty to leave that target out. With its grid held by the plate before it, the follower\'s Rk moves it along one line: the chart marks the stretches of that line where all of them hold. The follower keeps its own targets, apart from its gain stage\'s.'
          : output
            ? 'Leave a box empty to leave that target out. Each point of the chart is an idle point the bias and B+ can give the tube at this load: the chart hatches those where every target holds. Power and THD are into the primary\'s load; output impedance is at the speaker.'
            : 'Leave a box empty to leave that target out. The chart hatches every operating point (at this B+ and load) where all of them hold.'}
      </p>
      {output ? (
        <div className="value-grid targets-grid">
          <ValueField field="tPower" />
          <ValueField field="tPowerThd" />
          <ValueField field="tThdPower" />
          <ValueField field="tThdAtPower" />
          <ValueField field="tDiss" hint="at idle" />
          <ValueField field="tZout" hint="at the speaker" />
          <ValueField field="tBplusMin" hint="what the supply can give" />
          <ValueField field="tBplusMax" />
          {cathodeBias ? <ValueField field="tRkMin" /> : null}
          {cathodeBias ? <ValueField field="tRkMax" /> : null}
          <ValueField field="tHeadroom" hint="to grid current or cutoff, whichever is nearer" />
        </div>
      ) : (
      <div className="value-grid targets-grid">
        <ValueField field="tGain" />
        <ValueField field="tClean" />
        <ValueField field="tThd" />
        <ValueField field="tThdLevel" />
        <ValueField field="tDiss" />
        <ValueField field="tZout" />
        {follower ? null : <ValueField field="tRaMin" />}
        {follower ? null : <ValueField field="tRaMax" />}
        <ValueField field="tRkMin" />
        <ValueField field="tRkMax" />
        <ValueField field="tHeadroom" hint="to grid current or cutoff, whichever is nearer" />
      </div>
      )}
      <label className="option-row">
        <input type="checkbox" checked={heater} onChange={(e) => setHeaterTarget(e.target.checked)} /> {`Heater–cathode voltage within the rating for its polarity (${heaterVolts === 0 ? 'heaters at ground' : `heaters held at ${plain(heaterVolts)} V`})`}
      </label>
      {verdict?.ok ? (
        <ul className="target-verdicts" aria-label="Each target at the operating point now">
          {(Object.keys(verdict.margins) as TargetName[]).map((k) => (
            <li key={k} className={verdict.margins[k]! >= 0 ? 'meets' : 'misses'} data-target={k}>
              {`${verdict.margins[k]! >= 0 ? '✓' : '✗'} ${targetWithValue(capital(TARGET_LABELS[k]), k, verdict.values[k])}${verdict.values[k] === null ? ';' : ':'} ${marginWords(verdict.margins[k]!)}`}
            </li>
          ))}
        </ul>
      ) : verdict ? <p className="field-error">{verdict.message}</p> : null}
      <p className="region-status" role="status" data-testid="region-status">
        {follower
          ? along === null ? 'No targets set.' : !along.result.ok ? along.result.message : followerSummary(along.result)
          : region === null ? 'No targets set.' : !region.result.ok ? region.result.message : summary(region.result, region.complete)}
      </p>
      <div className="button-row">
        <button type="button" onClick={moveToBest} disabled={!(r?.best || f?.best || o?.best)}>Move to the best point</button>
        <label>
          <input type="checkbox" checked={keepInside} onChange={(e) => setKeepInside(e.target.checked)} disabled={!r && !f && !o} /> Keep the point inside the region while dragging
        </label>
        <button type="button" onClick={clearTargets} disabled={!anySet}>Clear targets</button>
      </div>
      {output && o?.best ? <p className="region-best">{`Best point: B+ ${plain(o.best.parts.bplus)} V, ${cathodeBias ? `Rk ${ohms(o.best.parts.rk)}` : `grid ${plain(o.best.parts.vg)} V`}; weakest target ${o.best.weakest ? `${TARGET_LABELS[o.best.weakest]}, ${marginWords(o.best.score)}` : 'none'}.`}</p> : null}
      {!follower && !output && r?.best ? <p className="region-best">{`Best point: Ra ${ohms(r.best.ra)}, Rk ${ohms(r.best.rk)}; weakest target ${r.best.weakest ? `${TARGET_LABELS[r.best.weakest]}, ${marginWords(r.best.score)}` : 'none'}.${snapSeries ? ` Moving there takes the ${snapSeries} values around it whose weakest target holds best.` : ''}`}</p> : null}
      {f?.best ? <p className="region-best">{`Best point: Rk ${ohms(f.best.rk)}; weakest target ${f.best.weakest ? `${TARGET_LABELS[f.best.weakest]}, ${marginWords(f.best.score)}` : 'none'}.`}</p> : null}
      {anySet ? <TubeRanking /> : null}
    </section>
  );
}

/** A follower's targets in a sentence: how much of its line meets them, or which target shuts it out. */
function followerSummary(r: FollowerRegion): string {
  const inside = r.inside.filter(Boolean).length;
  const solved = r.failing.filter((f) => f[0] !== 'unreachable').length;
  if (inside > 0) return `${inside} of ${solved} points along the follower's line meet every target.`;
  const most = r.excludesMost;
  const words = most ? ` ${capital(TARGET_LABELS[most.target])} fails at ${plain(most.share * 100)} % of them.` : '';
  return `No point along the follower's line meets every target.${words}${r.best ? ` The best point's weakest target is ${r.best.weakest ? TARGET_LABELS[r.best.weakest] : '—'}, ${marginWords(r.best.score)}.` : ''}`;
}

/** The region in a sentence: its size, or why it is empty and how near the best point comes. */
function summary(r: PlaneRegion, complete: boolean): string {
  let inside = 0;
  let reachable = 0;
  for (let i = 0; i < r.va.length; i++) for (let j = 0; j < r.ia.length; j++) {
    if (r.failing[i]![j]![0] !== 'unreachable') reachable++;
    if (r.inside[i]![j]) inside++;
  }
  const grid = `${r.va.length} × ${r.ia.length}`;
  const pass = complete ? '' : ' (a first, coarse look; the full grid follows)';
  if (inside > 0) return `${inside} of ${reachable} reachable points on the ${grid} grid meet every target${pass}.`;
  const most = r.excludesMost;
  const words = most ? ` ${capital(TARGET_LABELS[most.target as TargetName])} fails at ${plain(most.share * 100)} % of them.` : '';
  return `No point meets every target${pass}.${words}${r.best ? ` The best point's weakest target is ${r.best.weakest ? TARGET_LABELS[r.best.weakest] : '—'}, ${marginWords(r.best.score)}.` : ''}`;
}

const capital = (s: string) => s[0]!.toUpperCase() + s.slice(1);
