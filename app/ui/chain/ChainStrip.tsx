import { useWorkbench, useWorkbenchStore } from '../../store/StoreProvider';
import type { WorkbenchState } from '../../store/workbenchStore';
import { hertz, plain } from '../../format';
import { benchIndex, canAddFollower, MAX_VOLTAGE_STAGES, voltageStages } from '../../store/stagePlans';
import { StageCard } from './StageCard';
import { StageMenu } from './StageMenu';
import { ChainSchematic } from '../schematic/ChainSchematic';
import { StripHum } from '../supply/SupplyHumLine';
import { atLevelWords, cleanLimitWords } from './atLevelWords';
import { NOISE_BAND_WORDS, noiseWords } from './noiseWords';
import { GlobalFeedbackRow } from './GlobalFeedbackRow';

const hz = (f: number | null, none: string) => (f === null ? none : hertz(f));
const gainDb = (g: number) => `${(20 * Math.log10(Math.abs(g))).toFixed(1)} dB`;

/** What the strip draws from the design: each voltage stage's kind, which is on the bench, and whether the output stage is joined. */
function shapeKey(s: WorkbenchState): string {
  const d = s.design;
  return `${voltageStages(d).map((p) => p.kind[0]).join('')}|${benchIndex(d)}|${d.stage2.kind}|${d.stageKind}|${d.drivesOutput}|${d.output.pair}|${d.output.splitter.kind}`;
}

/**
 * The amplifier, input to output: one card per stage (its kind, tube, gain,
 * headroom and worst finding), the whole chain's figures beside them. A card
 * opens its stage on the bench below; under each voltage stage, moving,
 * removing and adding stages.
 */
export function ChainStrip() {
  const view = useWorkbench((s) => s.amplifier);
  // The strip reads the chain's shape, not its values: a drag changes the design every frame and must not redraw the strip.
  useWorkbench(shapeKey);
  const design = useWorkbenchStore().getState().design;
  const note = useWorkbench((s) => s.chainNote);
  const setStageKind = useWorkbench((s) => s.setStageKind);
  const showStage = useWorkbench((s) => s.showStage);
  const setDrivesOutput = useWorkbench((s) => s.setDrivesOutput);
  if (!view) return null;
  const r = view.result;
  const noise = r.ok ? noiseWords(r, r.outputPower !== null ? design.output.speakerOhms : null) : null;
  const list = voltageStages(design);
  const bench = benchIndex(design);
  const followerOnBench = design.stage2.kind !== 'none';
  const gains = list.flatMap((p, i) => (p.kind === 'common-cathode' ? [i] : []));
  const full = list.length >= MAX_VOLTAGE_STAGES;
  return (
    <section className={`chain-strip panel${view.stale ? ' stale' : ''}`} aria-label="The amplifier, stage by stage">
      <div className="chain-head">
        <h2>Amplifier</h2>
        <label>
          <input type="checkbox" checked={design.drivesOutput} onChange={(e) => setDrivesOutput(e.currentTarget.checked)} />
          The voltage stages drive the output stage
        </label>
      </div>
      {!r.ok && <p className="chain-failure" role="status">{r.message}</p>}
      {note && <p className="chain-note" role="status">{note}</p>}
      <ol className="chain-cards">
        {view.names.map((name, i) => {
          const v = name.voltageIndex;
          const onBench = v === null ? design.stageKind === 'output' : (design.stageKind === 'voltage' && v === bench) || (design.stageKind === 'follower' && followerOnBench && v === bench + 1);
          const result = r.ok ? r.stages[i] ?? null : null;
          const isFollower = v !== null && list[v]?.kind === 'follower';
          return (
            <li key={`${i}-${name.tube}`}>
              <div className="chain-stage">
                <StageCard
                  name={name}
                  kind={view.kinds[i]!}
                  result={result}
                  clipsFirst={r.ok && r.clipsFirst.stage === i ? r.clipsFirst : null}
                  noSwing={r.ok && r.input.dBu === null}
                  onBench={onBench}
                  onOpen={() => (v === null ? setStageKind('output') : showStage(v))}
                />
                {v !== null && (
                  <StageMenu
                    index={v}
                    title={name.title}
                    isFollower={isFollower}
                    first={v === 0}
                    last={!gains.some((g) => g > v)}
                    followerFits={canAddFollower(list, v)}
                    full={full}
                    removable={isFollower || gains.length > 1}
                  />
                )}
              </div>
            </li>
          );
        })}
      </ol>
      <ChainSchematic />
      {r.ok && (
        <dl className="chain-figures" data-testid="amplifier-figures">
          <div><dt>{view.feedback?.ok ? 'Gain, open loop' : 'Gain'}</dt><dd>{gainDb(r.gain)} ({plain(Math.abs(r.gain))}×{r.inverting ? ', inverting' : ''})</dd></div>
          <div><dt>{view.feedback?.ok ? 'Band (−3 dB), open loop' : 'Band (−3 dB)'}</dt><dd>{hz(r.lowHz, 'DC')} to {hz(r.highHz, 'beyond 100 MHz')}</dd></div>
          <div>
            <dt>{view.feedback?.ok ? 'Clean to, open loop' : 'Clean to'}</dt>
            <dd>
              {cleanLimitWords(r, view.names)}
            </dd>
          </div>
          {view.atLevel && (
            <div>
              <dt>At {view.levelLabel}{view.feedback?.ok ? ', open loop' : ''}</dt>
              <dd className={view.atLevel.ok && view.atLevel.pastClean ? 'past-clean' : undefined}>{atLevelWords(view)}</dd>
            </div>
          )}
          {noise && (
            <div data-testid="strip-noise">
              <dt>{view.feedback?.ok ? 'Noise, open loop' : 'Noise'}</dt>
              <dd title={`The amplifier's own noise, ${NOISE_BAND_WORDS}, plain and A-weighted (IEC 61672-1): every resistor's thermal noise and each tube's (2.5/gm at its grid), flicker noise left out`}>{noise}</dd>
            </div>
          )}
          <StripHum />
        </dl>
      )}
      <GlobalFeedbackRow />
    </section>
  );
}
