import { withBiasHum } from '../../../src/index';
import { smallVolts } from '../../format';
import { biasHumOf } from '../../store/biasSupply';
import { useWorkbench } from '../../store/StoreProvider';
import type { SupplyView } from '../../store/supplySlice';
import type { WorkbenchState } from '../../store/workbenchStore';
import { drivesPair } from '../../store/outputPlan';


/** The speaker the hum is read at: the output stage's, when the supply feeds one; null for an amplifier ending in a voltage stage. */
export const humSpeakerOhms = (s: WorkbenchState, view: SupplyView | null) => (view?.names.some((n) => n.role === 'output') ? s.design.output.speakerOhms : null);

/** The hum's headline in words, as the card prints it: the bound and how far under the reference it is. */
export function humWords(view: SupplyView, speakerOhms: number | null, biasHum: number | null = null): string | null {
  const h = view.hum?.ok ? withBiasHum(view.hum, biasHum) : null;
  if (!h?.ok) return null;
  const db = speakerOhms !== null ? `${(20 * Math.log10(Math.sqrt(speakerOhms) / Math.max(h.bound, 1e-12))).toFixed(0)} dB below 1 W into ${speakerOhms} Ω` : `${(20 * Math.log10(Math.max(h.bound, 1e-12))).toFixed(0).replace('-', '−')} dBV`;
  return `Hum at the ${speakerOhms !== null ? 'speaker' : 'output'}: at most ${smallVolts(h.bound)} rms (${db})`;
}

/**
 * The hum the supply leaves at the amplifier's output: each stage's B+
 * ripple carried to the output at midband, and their sum as a bound (the
 * nodes' ripples are not in phase). At the speaker it is read against 1 W;
 * elsewhere in dBV. A stage whose own share could not be worked out is
 * named; a splitter's and a pair's are said to be what they are.
 */
export function SupplyHumLine({ view }: { view: SupplyView }) {
  const speakerOhms = useWorkbench((s) => humSpeakerOhms(s, view));
  const pairDriven = useWorkbench((s) => drivesPair(s.design));
  const biasHum = useWorkbench(biasHumOf);
  const hum = view.hum;
  if (!hum) return null;
  if (!hum.ok) return <p className="field-error">{`Hum at the output: ${hum.message}`}</p>;
  const h = hum;
  const screens = (k: number) => (h.screens[k] !== null ? ` (its screens ${smallVolts(h.screens[k]!)})` : '');
  const shares = view.names.map((n, k) => `${n.title} (${n.tube}) ${h.volts[k] === null ? 'not counted' : `${smallVolts(h.volts[k]!)}${screens(k)}`}`).join(', ');
  const uncounted = h.volts.some((v) => v === null);
  const screened = h.screens.some((v) => v !== null);
  return (
    <p className="supply-hum" data-testid="supply-hum">
      <strong>{humWords(view, speakerOhms, biasHum)}</strong>
      {`. From each stage's B+ ripple: ${shares}${biasHum !== null ? `; from the bias rail's ripple at the output tube's grid, ${smallVolts(biasHum)}` : ''}.`}
      <span className="supply-hum-why">
        {' Each stage\u2019s ripple is carried to the output by the stages after it at midband and the shares added as if in phase, so the real hum is at or under this.'}
        {uncounted ? ' Not counted: a stage whose own share could not be worked out at its operating point.' : ''}
        {pairDriven ? ' A phase splitter\u2019s is the difference its ripple makes between its two outputs (with what its first plate\u2019s ripple puts on its first grid through the plate-to-grid capacitance), which the pair passes on; a push-pull pair\u2019s own is what its mismatch leaves of its centre tap\u2019s ripple (a matched pair cancels it): set the tubes\u2019 mismatch to see what a real pair passes.' : ''}
        {screened ? ' A pentode output stage\u2019s screens take the ripple of the node feeding them, straight (their plates\u2019 node, or the one named for them) or through their dropper and its bypass: a screen moves the plate current many times harder than the plate does, so filter it well. Screens above B+ on a node this supply does not feed are taken as clean.' : ''}
      </span>
    </p>
  );
}

/**
 * The hum in the amplifier's figures at the top, once the supply is solved:
 * the bound and how far under 1 W (or in dBV), the details under the supply.
 * Its own small subscription: a drag's live supply answers redraw only it.
 */
export function StripHum() {
  const view = useWorkbench((s) => (s.design.supply.on ? s.supplyView : null));
  const speakerOhms = useWorkbench((s) => humSpeakerOhms(s, view));
  const biasHum = useWorkbench(biasHumOf);
  const words = view ? humWords(view, speakerOhms, biasHum) : null;
  if (!words) return null;
  // Until the supply is solved for the changed design, the last solve's hum shows greyed, as the supply's own table does.
  const behind = view?.stale === true;
  return (
    <div data-testid="strip-hum" className={behind ? 'stale' : undefined} title={behind ? 'From the supply’s last solve: solving it again for the change' : undefined}>
      <dt>Hum</dt>
      <dd>{words.replace(/^Hum at the (speaker|output): /, '')}</dd>
    </div>
  );
}
