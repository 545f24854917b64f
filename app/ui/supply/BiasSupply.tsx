import { useId } from 'react';
import { ohms, percentOf, smallAmps, smallVolts, volts } from '../../format';
import { useWorkbench } from '../../store/StoreProvider';
import { biasSupplyOf, needsBiasSupply } from '../../store/biasSupply';
import { SupplyField } from './SupplyField';
import { BiasSchematic } from './BiasSchematic';

/** A negative voltage as the trade writes it: "−37.6 V". */
const below = (v: number) => `−${volts(v)}`;

/**
 * A fixed-bias output stage's grid supply: its winding, reservoir and
 * filter typed here, and what the model makes of them (the rail, a trimmer
 * string per tube covering its adjustment, the hot end's danger, the
 * grids' ripple). Shown only while the output stage is fixed-bias.
 */
export function BiasSupply() {
  const shown = useWorkbench(needsBiasSupply);
  const result = useWorkbench(biasSupplyOf);
  const stale = useWorkbench((s) => s.biasView?.stale ?? false);
  const pair = useWorkbench((s) => s.design.output.pair === 'push-pull');
  const tube = useWorkbench((s) => s.design.output.tubeId);
  const plan = useWorkbench((s) => s.design.supply.bias);
  const id = useId();
  if (!shown) return null;
  return (
    <section className="bias-supply" aria-labelledby={`${id}-h`}>
      <h3 id={`${id}-h`}>Bias supply</h3>
      <p className="field-hint">
        The fixed-bias output {pair ? 'tubes’' : 'tube’s'} grid {pair ? 'voltages come' : 'voltage comes'} from a winding (or a bias tap) through one diode turned the negative way, a
        reservoir and one R–C section; from that rail a trimmer string for each tube, its wiper feeding the tube’s grid leak.
      </p>
      <BiasSchematic plan={plan} result={result?.ok ? result : null} tubes={pair ? 2 : 1} />
      <div className="value-grid">
        <SupplyField path="bias.secondaryRms" label="Bias winding" unit="V rms" example="50" />
        <SupplyField path="bias.windingOhms" label="Its resistance" unit="Ω" example="150" />
        <SupplyField path="bias.reservoir" label="Bias reservoir" unit="F" example="47u" />
        <SupplyField path="bias.r" label="Bias filter resistor" unit="Ω" example="4k7" />
        <SupplyField path="bias.c" label="Bias rail capacitor" unit="F" example="100u" />
      </div>
      {result === null ? (
        <p className="field-hint" role="status">Solving the bias supply…</p>
      ) : !result.ok ? (
        <p className="finding danger" role="alert">{result.message}</p>
      ) : (
        <div className={`bias-results${stale ? ' stale' : ''}`} data-testid="bias-results">
          {stale ? <p className="stale-note" role="status">Solving again for the changed design; these figures are from before it.</p> : null}
          <table className="parts-table">
            <caption>The rail under the strings’ {smallAmps(result.load)}</caption>
            <tbody>
              <tr><th scope="row">Reservoir</th><td>{below(result.reservoir)}</td><td>{smallVolts(result.reservoirRippleRms)} rms ripple</td></tr>
              <tr><th scope="row">Rail</th><td>{below(result.rail)}</td><td>{smallVolts(result.railRippleRms)} rms ripple</td></tr>
            </tbody>
          </table>
          <table className="parts-table">
            <caption>{pair ? 'Each tube’s string (both alike)' : 'The tube’s string'}: rail, trimmer, ground</caption>
            <thead><tr><th scope="col">Rail end</th><th scope="col">Trimmer</th><th scope="col">Ground end</th><th scope="col">Reaches</th><th scope="col">A typical {tube} sets at</th><th scope="col">Grid ripple</th></tr></thead>
            <tbody>
              <tr>
                <td>{ohms(result.taps[0]!.string.top)}</td>
                <td>{ohms(result.taps[0]!.string.pot)} linear</td>
                <td>{ohms(result.taps[0]!.string.bottom)}</td>
                <td>{below(result.taps[0]!.string.least)} to {below(result.taps[0]!.string.most)}</td>
                <td>{below(result.taps[0]!.nominal)}, {Math.round(result.taps[0]!.travel * 100)} % up from the ground end</td>
                <td>{smallVolts(result.taps[0]!.gridRippleRms)} rms</td>
              </tr>
            </tbody>
          </table>
          <p>
            Tubes of the type need from {below(-result.adjustment.weakest)} (passing {percentOf(result.adjustment.spread)} less current than typical) to {below(-result.adjustment.strongest)} ({percentOf(result.adjustment.spread)} more) for the
            designed idle; the string’s hot end sits just past the first, its cold end 10 % past the second (our margins).
            {result.humAtSpeaker !== null
              ? ` The grid’s ripple gives ${smallVolts(result.humAtSpeaker)} rms of hum at the speaker.`
              : ' The ripple is common to both grids: the pair cancels it as far as its tubes match.'}
          </p>
          <ul className="findings-compact">
            {result.findings.map((f) => <li key={f.kind} className={`finding ${f.severity}`}>{f.message}</li>)}
          </ul>
        </div>
      )}
      <p className="supply-caution" role="note">
        Before first switch-on, turn every trimmer to its cold end (most negative) and measure each grid’s voltage with the output tubes out of their sockets; then set each tube’s idle by its
        cathode sense resistor (common practice). A bias supply that fails leaves the output tubes unbiased: they overheat within seconds.
      </p>
    </section>
  );
}
