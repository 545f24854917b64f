import { useEffect, useId, useMemo, useRef } from 'react';
import { drawAxes, drawFamily, drawGrid, drawLimits } from '../chart/drawSheet';
import { PALETTE } from '../chart/palette';
import { CHART_BOX, plateScales } from '../chart/plateScales';
import { milliamps, ohms, plain, volts } from '../../format';
import { ValueField } from '../panels/ValueField';
import { useWorkbench } from '../../store/StoreProvider';
import { followerCouplingFor } from '../../store/stagePlans';

const SMALL_BOX = { ...CHART_BOX, width: 330, height: 230, margin: { top: 10, right: 44, bottom: 40, left: 52 } };

/**
 * What follows the stage on the bench, if anything: a cathode follower on its
 * plate or a gain stage after it; its values, figures and operating point on
 * its own plate curves. (Named for where it sits, not a number: the bench
 * may hold any stage of the amplifier.)
 */
export function Stage2Panel() {
  const stage2 = useWorkbench((s) => s.design.stage2);
  const tubes = useWorkbench((s) => s.tubes);
  const setStage2 = useWorkbench((s) => s.setStage2);
  const addStage = useWorkbench((s) => s.addStage);
  const bench = useWorkbench((s) => s.design.before.length);
  const error = useWorkbench((s) => s.errors.stage2);
  const chain = useWorkbench((s) => s.analysis.signal.chain);
  const view = useWorkbench((s) => s.analysis.signal.stage2);
  const onBench = useWorkbench((s) => s.design.stageKind === 'follower');
  const bplus = useWorkbench((s) => s.design.bplus);
  const choice = stage2.kind === 'follower' && stage2.coupling ? 'follower-capacitor' : stage2.kind;
  const id = useId();
  const link = chain?.ok ? chain.links[1] : undefined;
  return (
    <section className="panel stage2" aria-labelledby={`${id}-h`}>
      <h2 id={`${id}-h`}>After this stage</h2>
      <div className="option-row">
        <label htmlFor={`${id}-kind`}>Add</label>
        <select
          id={`${id}-kind`}
          value={choice}
          onChange={(e) => {
            const picked = e.target.value as typeof choice;
            // A gain stage joins the amplifier as a stage of its own (its own B+, bypass and coupling), put on the bench.
            if (picked === 'common-cathode' && stage2.kind === 'none') addStage(bench, 'common-cathode');
            else if (picked === 'follower-capacitor') setStage2({ kind: 'follower', coupling: stage2.coupling ?? followerCouplingFor(bplus) });
            else setStage2({ kind: picked, coupling: undefined });
          }}
        >
          <option value="none">nothing (this stage drives the next, or RL)</option>
          <option value="follower">a cathode follower, direct-coupled</option>
          <option value="follower-capacitor">a cathode follower, capacitor-coupled (its grid held by a divider)</option>
          <option value="common-cathode">a gain stage after it, capacitor-coupled</option>
        </select>
      </div>
      {stage2.kind !== 'none' ? (
        <>
          <div className="option-row">
            <label htmlFor={`${id}-tube`}>Tube</label>
            <select id={`${id}-tube`} value={stage2.tubeId} onChange={(e) => setStage2({ tubeId: e.target.value })}>
              {tubes.map((t) => <option key={t.id} value={t.id}>{t.id}</option>)}
            </select>
          </div>
          <div className="value-grid">
            {stage2.kind === 'common-cathode' ? <ValueField field="ra2" /> : null}
            {/* Named for what it is: the follower after this stage is not always the amplifier's stage 2. */}
            <ValueField field="rk2" label={stage2.kind === 'follower' ? 'Rk (follower)' : undefined} />
            {stage2.kind === 'common-cathode' ? <ValueField field="rg2" /> : null}
            {stage2.kind === 'follower' ? <ValueField field="fRst" hint="at the follower's socket, in series with its grid; “none” to leave it out" /> : null}
            {choice === 'follower-capacitor' ? (
              <>
                <ValueField field="fCc" />
                <ValueField field="fRg" />
                <ValueField field="fVbias" />
              </>
            ) : null}
          </div>
        </>
      ) : null}
      {error ? <p className="field-error" role="alert">{error}</p> : null}
      {link ? (
        <dl className="figure-group">
          <div className="figure" data-figure="stage2-va"><dt>{link.kind === 'follower' ? 'Vk (out)' : 'Va'}</dt><dd>{volts(link.kind === 'follower' ? link.op.vk : link.op.va)}</dd></div>
          <div className="figure" data-figure="stage2-ia"><dt>Ia</dt><dd>{milliamps(link.op.ia)}</dd></div>
          <div className="figure" data-figure="stage2-gain"><dt>Gain</dt><dd>{`${plain(link.gain)} ×`}</dd></div>
          <div className="figure" data-figure="stage2-zout"><dt>Zout</dt><dd>{ohms(link.zout)}</dd></div>
          {link.kind === 'follower' ? <div className="figure" data-figure="stage2-vhk"><dt>Heater–cathode</dt><dd>{volts(link.vhk)}</dd></div> : null}
        </dl>
      ) : null}
      {link ? (
        <ul className="findings-compact">
          {link.findings.filter((f) => f.severity !== 'note').map((f) => <li key={f.kind} className={`finding ${f.severity}`}>{f.message}</li>)}
        </ul>
      ) : null}
      {/* With the follower on the bench, the bench's own chart is its chart. */}
      {view && !onBench ? <Stage2Curves /> : null}
    </section>
  );
}

/** The following stage's operating point on its own plate curves (a static view; the drag is on the bench's stage). */
function Stage2Curves() {
  const view = useWorkbench((s) => s.analysis.signal.stage2)!;
  const stage2Kind = useWorkbench((s) => s.design.stage2.kind);
  const scales = useMemo(() => plateScales(view.sheet.extent, SMALL_BOX), [view.sheet.extent]);
  const grid = useRef<SVGGElement>(null);
  const curves = useRef<SVGGElement>(null);
  const limits = useRef<SVGGElement>(null);
  const axes = useRef<SVGGElement>(null);
  useEffect(() => {
    if (!grid.current || !curves.current || !limits.current || !axes.current) return;
    drawGrid(grid.current, scales);
    drawFamily(curves.current, view.sheet, scales);
    drawLimits(limits.current, view.sheet, scales);
    drawAxes(axes.current, scales);
  }, [view.sheet, scales]);
  return (
    <svg className="stage2-chart" viewBox={`0 0 ${SMALL_BOX.width} ${SMALL_BOX.height}`} role="img" aria-label={`Plate curves of the ${stage2Kind === 'follower' ? 'cathode follower' : 'stage after this one'}, ${view.tubeId}, with its operating point`}>
      <g ref={grid} />
      <g ref={limits} />
      <g ref={curves} />
      <g ref={axes} />
      <circle cx={scales.x(view.point.v)} cy={scales.y(view.point.i)} r={6} fill={PALETTE.point} stroke={PALETTE.ink} strokeWidth={1.5} data-stage2-point="" />
    </svg>
  );
}
