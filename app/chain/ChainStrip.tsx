import type { StageFinding } from '../../src/index';
import { useWorkbench } from '../store/StoreProvider';
import { plain, rmsLevel, watts } from '../format';

/** Headroom shown on each card's bar: 20 dB fills it. */
const HEADROOM_FULL_DB = 20;

const hz = (f: number | null, none: string) => (f === null ? none : f >= 1000 ? `${plain(f / 1000)} kHz` : `${plain(f)} Hz`);
const gainDb = (g: number) => `${(20 * Math.log10(Math.abs(g))).toFixed(1)} dB`;

function worstOf(findings: readonly StageFinding[]): { text: string; severity: 'danger' | 'warning' | 'ok' } {
  const f = findings.find((x) => x.severity === 'danger') ?? findings.find((x) => x.severity === 'warning');
  return f ? { text: f.message, severity: f.severity as 'danger' | 'warning' } : { text: 'Within every rating', severity: 'ok' };
}

/**
 * The amplifier, input to output: one card per stage (its kind, tube, gain,
 * headroom and worst finding), the whole chain's figures beside them. A card
 * opens its stage on the bench below.
 */
export function ChainStrip() {
  const view = useWorkbench((s) => s.amplifier);
  const stageKind = useWorkbench((s) => s.design.stageKind);
  const drivesOutput = useWorkbench((s) => s.design.drivesOutput);
  const setStageKind = useWorkbench((s) => s.setStageKind);
  const setDrivesOutput = useWorkbench((s) => s.setDrivesOutput);
  if (!view) return null;
  const r = view.result;
  return (
    <section className={`chain-strip panel${view.stale ? ' stale' : ''}`} aria-label="The amplifier, stage by stage">
      <div className="chain-head">
        <h2>Amplifier</h2>
        <label>
          <input type="checkbox" checked={drivesOutput} onChange={(e) => setDrivesOutput(e.currentTarget.checked)} />
          The voltage stages drive the output stage
        </label>
      </div>
      {!r.ok ? (
        <p className="chain-failure" role="status">{r.message}</p>
      ) : (
        <>
          <ol className="chain-cards">
            {r.stages.map((st, i) => {
              const name = view.names[i]!;
              const worst = worstOf(st.findings);
              const clipsHere = r.clipsFirst.stage === i;
              const headroom = st.headroomDb;
              return (
                <li key={i}>
                  <button
                    type="button"
                    className={`chain-card ${worst.severity}`}
                    aria-pressed={stageKind === name.bench}
                    onClick={() => setStageKind(name.bench)}
                  >
                    <span className="card-title">{name.title} · {name.tube} <span className="card-kind">{view.kinds[i]!.toLowerCase()}</span></span>
                    <span className="card-gain">gain {plain(st.gain)}×{st.kind === 'single-ended-output' ? ' (grid to speaker)' : ''}</span>
                    <span className="card-headroom">
                      <meter min={0} max={HEADROOM_FULL_DB} low={3} optimum={HEADROOM_FULL_DB} value={headroom === null ? HEADROOM_FULL_DB : Math.min(headroom, HEADROOM_FULL_DB)} aria-label="headroom" />
                      {clipsHere ? `clips first (${r.clipsFirst.by === 'grid-current' ? 'grid current' : 'cutoff'})` : headroom === null ? 'never clips' : `${headroom.toFixed(1)} dB headroom`}
                    </span>
                    <span className={`card-worst ${worst.severity}`} title={worst.text}>{worst.severity === 'ok' ? '✓ ' : worst.severity === 'danger' ? '⚠ Danger: ' : '⚠ '}{worst.text}</span>
                  </button>
                </li>
              );
            })}
          </ol>
          <dl className="chain-figures" data-testid="amplifier-figures">
            <div><dt>Gain</dt><dd>{gainDb(r.gain)} ({plain(Math.abs(r.gain))}×{r.inverting ? ', inverting' : ''})</dd></div>
            <div><dt>Band (−3 dB)</dt><dd>{hz(r.lowHz, 'DC')} to {hz(r.highHz, 'beyond 100 MHz')}</dd></div>
            <div>
              <dt>Clean to</dt>
              <dd>
                {r.outputPower !== null ? `${watts(r.outputPower)} (${plain(r.speakerRms ?? 0)} V rms at the speaker)` : `${rmsLevel(r.output, 'dBu')} out`}, from {rmsLevel(r.input, 'dBu')} in
              </dd>
            </div>
            {view.atLevel && (
              <div>
                <dt>At {view.levelLabel}</dt>
                <dd>{view.atLevel.ok ? `${rmsLevel(view.atLevel.input, 'dBu')} in, THD ${plain(view.atLevel.thd * 100, 2)} %` : view.atLevel.message}</dd>
              </div>
            )}
          </dl>
        </>
      )}
    </section>
  );
}
