import { useShallow } from 'zustand/react/shallow';
import { formatValue } from '../../../src/index';
import { dB, decibels, ohms, plain, rmsLevel, voltsRms } from '../../format';
import { ValueField } from '../panels/ValueField';
import { useWorkbench } from '../../store/StoreProvider';

/** What brings a stage's distortion up, in the words the figures use. */
const LIMIT_WORDS = { 'grid-current': 'grid current', cutoff: 'cutoff', curvature: 'within the clean swing' } as const;

const hz = (f: number | null) => (f === null ? 'flat' : formatValue(f, 'Hz'));

/** The signal level control and what the model says at that level: headroom, distortion, bandwidth, and the chain's totals. */
export function SignalPanel() {
  // Field by field: during a drag only the swing path changes, and this panel need not follow it.
  const { swing, distortion: d, corners, chain, stale, atThd } = useWorkbench(
    useShallow(({ analysis: { signal: g } }) => ({ swing: g.swing, distortion: g.distortion, corners: g.corners, chain: g.chain, stale: g.stale, atThd: g.atThd })),
  );
  const thdLimit = useWorkbench((s) => s.design.thdLimit);
  const level = useWorkbench((s) => s.design.levelRms);
  const editField = useWorkbench((s) => s.editField);
  const settleField = useWorkbench((s) => s.settleField);
  const limit = swing.limitedBy === 'grid-current' ? 'grid current' : 'cutoff';
  // Behind a volume control the stage's own input figures are at the wiper (its grid's side); the strip's are at the source.
  const atWiper = useWorkbench((s) => (s.design.volume !== null ? ', at the wiper' : ''));
  return (
    <section className="panel signal-panel" aria-label="Signal at a chosen level">
      <h2>Signal {stale ? <span className="stale-note">(updates when you let go)</span> : null}</h2>
      <div className="signal-row">
        <div className="level-control">
          <ValueField field="level" hint="output level the distortion is read at" />
          <ValueField field="thd" hint="distortion whose output level is shown (5 % in published tables)" />
          <input
            type="range"
            aria-label="Output level, log scale from 1 mV rms to twice the clean swing"
            min={-3}
            max={Math.log10(Math.max(2 * swing.output.rms, 1e-3))}
            step={0.01}
            value={Math.log10(Math.max(1e-3, Math.min(level, 2 * swing.output.rms)))}
            onChange={(e) => editField('level', Number(Math.pow(10, Number(e.target.value)).toPrecision(3)).toString())}
            onPointerUp={() => settleField('level')}
          />
        </div>
        <dl className="figure-group">
          <div className="figure" data-figure="input-needed"><dt>{`Input needed${atWiper}`}</dt><dd>{d.ok ? voltsRms(d.inputRms) : '—'}</dd></div>
          <div className="figure" data-figure="thd"><dt>THD</dt><dd>{d.ok ? `${plain(d.thdPercent)} %${d.pastClean ? ` past the clean swing (${LIMIT_WORDS[d.pastClean]})` : ''}` : '—'}</dd></div>
          <div className="figure" data-figure="h2"><dt>H2</dt><dd>{d.ok ? dB(d.harmonicsDb[0]!) : '—'}</dd></div>
          <div className="figure" data-figure="h3"><dt>H3</dt><dd>{d.ok ? dB(d.harmonicsDb[1]!) : '—'}</dd></div>
        </dl>
        <dl className="figure-group">
          <div className="figure" data-figure="headroom-out"><dt>Clean output swing</dt><dd>{rmsLevel(swing.output, 'dBu')}</dd></div>
          <div className="figure" data-figure="headroom-in"><dt>{`Clean input${atWiper}`}</dt><dd>{rmsLevel(swing.input, 'dBV')}</dd></div>
          <div className="figure" data-figure="limited-by"><dt>Clips by</dt><dd>{swing.output.rms === 0 ? 'at any level (no grid bias)' : limit}</dd></div>
          <div className="figure" data-figure="at-thd"><dt>{`Output at ${plain(100 * thdLimit)} % THD`}</dt><dd>{atThd.ok ? `${voltsRms(atThd.outputRms)} (${voltsRms(atThd.inputRms)} in), ${LIMIT_WORDS[atThd.limitedBy]}` : atThd.message}</dd></div>
          <div className="figure" data-figure="bandwidth"><dt>−3 dB</dt><dd>{`${hz(corners.lowHz)} to ${hz(corners.highHz)}`}</dd></div>
        </dl>
      </div>
      {!d.ok ? <p className="field-error" role="alert">{d.message}</p> : null}
      {chain?.ok ? (
        <dl className="figure-group chain-figures" aria-label="Both stages together">
          <div className="figure" data-figure="chain-gain"><dt>Chain gain</dt><dd>{`${plain(chain.gain)} × (${decibels(chain.gain)}), ${chain.inverting ? 'inverting' : 'non-inverting'}`}</dd></div>
          <div className="figure" data-figure="chain-zout"><dt>Chain Zout</dt><dd>{ohms(chain.zout)}</dd></div>
          <div className="figure" data-figure="chain-swing"><dt>Chain clean output</dt><dd>{`${voltsRms(chain.output.rms)}, limited by stage ${chain.limitedBy.link + 1} (${chain.limitedBy.by === 'grid-current' ? 'grid current' : 'cutoff'})`}</dd></div>
        </dl>
      ) : null}
    </section>
  );
}
