import { milliamps, ohms, percentOf as percent, plain, volts, watts } from '../../format';
import { Figure, Share } from '../panels/Figure';
import { SettledBiasFigures } from './SettledBiasFigures';
import { TubeSpreadFigures } from './TubeSpreadFigures';
import type { PushPullBench } from '../../store/outputAnalysis';
import { useWorkbench } from '../../store/StoreProvider';

/**
 * A push-pull pair's figures: each tube's idle point against its ratings
 * (the worse of the two when mismatched), the parts the drag sets, power and
 * distortion with the grids driven to 0 V and within the distortion limit,
 * where class AB begins, the worst dissipation under drive, the current the
 * pair draws from B+, and the damping it gives the speaker; with a shared
 * cathode resistor, where its bias settles under full drive and the power
 * there. The level sweep's figures wait for the full pass ('…' during a drag).
 */
export function PairFigures({ bench }: { bench: PushPullBench }) {
  const a = bench.analysis;
  const s = a.solution;
  const d = s.design;
  const r = s.tube.ratings;
  const [one, two] = s.idle;
  const plan = useWorkbench((st) => st.design.output);
  const mismatched = plan.mismatch !== 0 || plan.idleMismatch !== 0;
  const f = bench.light ? null : a.figures;
  const screen = s.tube.law.kind === 'pentode' && s.feed.kind !== 'tied';
  const wait = '…';
  return (
    <section className="panel figures" aria-label="Push-pull output stage figures">
      <dl className="figure-group">
        <Figure name="vpk" label="Vpk (each)" value={volts(one.vpk)} chars={5.5} />
        <Figure name="ip" label={s.feed.kind === 'tied' && s.tube.law.kind === 'pentode' ? 'Ia + Ig2 (each)' : 'Ia (each)'} value={mismatched ? `${milliamps(one.ip)} / ${milliamps(two.ip)}` : milliamps(one.ip)} chars={mismatched ? 15 : 8} />
        <Figure name="vgk" label="Vgk" value={volts(s.vgk)} chars={7.5} />
        <Share name="pa" label="Pa (each, idle)" value={Math.max(one.pa, two.pa)} rating={r.maxPlateDissipation} meterLabel="Plate dissipation at idle, share of rating" />
        {screen && r.maxScreenDissipation !== null ? <Share name="pg2" label="Pg2 (each, idle)" value={Math.max(one.pg2, two.pg2)} rating={r.maxScreenDissipation} meterLabel="Screen dissipation at idle, share of rating" /> : null}
      </dl>
      <dl className="figure-group" aria-label="Parts">
        <Figure name="o-bplus" label="B+" value={volts(d.bplus)} chars={5.5} />
        {d.bias === 'cathode' ? <Figure name="o-rk" label="Rk (shared)" value={ohms(d.rk)} chars={6.5} /> : <Figure name="o-vg" label="Grid bias" value={volts(d.vg)} chars={6.5} />}
        <Figure name="o-raa" label="Raa" value={ohms(d.raa)} chars={6.5} />
      </dl>
      <dl className="figure-group">
        <Figure name="full-power" label={d.bias === 'cathode' ? 'Grids driven to 0 V, idle bias' : 'Grids driven to 0 V'} value={`${watts(a.full.power)} at ${percent(a.full.thd)} THD`} chars={20.5} />
        <Figure name="limit-power" label={`Power within ${percent(d.thdLimit)} THD`} value={f ? (f.overThdEverywhere ? 'never within' : watts((f.atThdLimit ?? f.atZeroGrid).power)) : wait} chars={12} />
        <Figure name="class" label="Class" value={f ? (f.classABFrom === null ? 'A to 0 V grid' : f.classABFrom === 0 ? 'AB from the smallest signal' : `AB from ${volts(f.classABFrom)} peak per grid`) : wait} chars={24} />
        <Figure name="drive" label="Drive per grid, full" value={`${volts(a.full.drive / Math.SQRT2)} rms`} chars={9} />
      </dl>
      {d.bias === 'cathode' ? <SettledBiasFigures settled={a.settledBias} light={bench.light} label="The shared cathode resistor under full drive" grids="Grids" /> : null}
      <TubeSpreadFigures spread={a.spread} rating={r.maxPlateDissipation} label="The idle across the type's spread of tubes (matched pairs)" />
      <dl className="figure-group">
        <Figure name="worst-pa" label="Worst Pa under drive" value={f ? `${watts(f.worstPlate.watts)} (${Math.round((100 * f.worstPlate.watts) / r.maxPlateDissipation)} %)` : wait} chars={13} />
        <Figure name="supply-current" label="B+ current idle → full" value={`${milliamps(a.supplyCurrent.idle)} → ${milliamps(a.supplyCurrent.full)}`} chars={17} />
        <Figure name="damping" label="Damping factor" value={f?.dampingFactor ? plain(f.dampingFactor, 2) : wait} chars={4} />
        <Figure name="zout" label="Zout at the speaker" value={f?.zSpeaker ? ohms(f.zSpeaker) : wait} chars={6.5} />
        <Figure name="turns" label="Turns ratio (plate to plate)" value={`${plain(a.turnsRatio, 3)} : 1`} chars={6.5} />
        {mismatched ? <Figure name="imbalance" label="DC uncancelled in the core" value={milliamps(Math.abs(s.dcImbalance))} chars={8} /> : null}
      </dl>
    </section>
  );
}
