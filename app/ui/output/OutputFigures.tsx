import { mAPerV, milliamps, ohms, percentOf as percent, plain, volts, watts } from '../../format';
import { Figure, Share } from '../panels/Figure';
import { useWorkbench } from '../../store/StoreProvider';
import type { SingleEndedBench } from '../../store/outputAnalysis';
import { PairFigures } from './PairFigures';
import { SettledBiasFigures } from './SettledBiasFigures';
import { TubeSpreadFigures } from './TubeSpreadFigures';

/**
 * The output stage's figures: the parts the drag sets (B+, bias, Zpri), the quiescent point, dissipation against
 * ratings, small-signal figures, and power: clean (to grid current or
 * cutoff), at full drive (grid to 0 V, as data sheets quote it), and within
 * the distortion limit; with a cathode resistor, where its bias settles under
 * full drive and the power there. Names in data-figure for tests and exports.
 */
export function OutputFigures() {
  const bench = useWorkbench((s) => s.outputBench);
  return bench.pair === 'push-pull' ? <PairFigures bench={bench} /> : <SingleEndedFigures bench={bench} />;
}

function SingleEndedFigures({ bench }: { bench: SingleEndedBench }) {
  // The parts the point and the load handle set: the live values while dragging (the form and schematic follow at a readable pace).
  const o = useWorkbench((s) => s.design.output);
  const a = bench.analysis;
  const { op, tube } = a.solution;
  const r = tube.ratings;
  const limitFirst = a.atLimit?.limitedBy === 'grid current' && !bench.light;
  const screen = tube.law.kind === 'pentode' && op.connection !== 'triode';
  return (
    <section className="panel figures" aria-label="Output stage figures">
      <dl className="figure-group">
        <Figure name="vpk" label="Vpk" value={volts(op.vpk)} chars={5.5} />
        <Figure name="ip" label={op.connection === 'triode' && tube.law.kind === 'pentode' ? 'Ia + Ig2' : 'Ia'} value={milliamps(op.ip)} chars={8} />
        {screen ? <Figure name="ig2" label="Ig2" value={milliamps(op.ig2)} chars={8} /> : null}
        <Figure name="vgk" label="Vgk" value={volts(op.vgk)} chars={7.5} />
        <Share name="pa" label="Pa" value={op.pa} rating={r.maxPlateDissipation} meterLabel="Plate dissipation, share of rating" />
        {screen && r.maxScreenDissipation !== null ? <Share name="pg2" label="Pg2 (idle)" value={op.pg2} rating={r.maxScreenDissipation} meterLabel="Screen dissipation, share of rating" /> : null}
      </dl>
      <dl className="figure-group" aria-label="Parts">
        <Figure name="o-bplus" label="B+" value={volts(o.bplus)} chars={5.5} />
        {o.bias === 'cathode' ? <Figure name="o-rk" label="Rk" value={ohms(o.rk)} chars={6.5} /> : <Figure name="o-vg" label="Grid bias" value={volts(o.vg)} chars={6.5} />}
        <Figure name="o-zpri" label="Zpri" value={ohms(o.zPrimary)} chars={6.5} />
      </dl>
      <dl className="figure-group">
        <Figure name="rp" label="rp (as wired)" value={ohms(op.rp)} chars={6.5} />
        <Figure name="gm" label="gm" value={mAPerV(op.gm)} chars={9.5} />
        <Figure name="damping" label="Damping factor" value={plain(a.dampingFactor, 2)} chars={4} />
        <Figure name="zout" label="Zout at the speaker" value={ohms(a.outputImpedance)} chars={6.5} />
        <Figure name="turns" label="Turns ratio" value={`${plain(a.turnsRatio, 3)} : 1`} chars={6.5} />
      </dl>
      <dl className="figure-group">
        <Figure name="clean-power" label={`Power at ${a.clean.limitedBy} onset`} value={`${watts(a.clean.at.power)} at ${percent(a.clean.at.thd)} THD`} chars={20.5} />
        <Figure name="full-power" label={o.bias === 'cathode' ? 'Grid driven to 0 V, idle bias' : 'Grid driven to 0 V'} value={`${watts(a.full.power)} at ${percent(a.full.thd)} THD`} chars={20.5} />
        <Figure
          name="limit-power"
          label={`Power within ${percent(bench.analysis.solution.design.thdLimit)} THD${limitFirst ? ' (grid current first)' : ''}`}
          value={a.atLimit && !bench.light ? watts(a.atLimit.power) : '…'}
          // Three digits under a watt take seven characters ("0.557 W", met by a library tube in the e2e check of every figure box).
          chars={7.5}
        />
        <Figure name="drive" label="Drive for clean power" value={`${volts(a.clean.at.drive / Math.SQRT2)} rms`} chars={9} />
      </dl>
      {o.bias === 'cathode' ? <SettledBiasFigures settled={a.settledCathode} light={bench.light} label="The cathode resistor under full drive" grids="Grid" /> : null}
      <TubeSpreadFigures spread={a.spread} rating={a.solution.tube.ratings.maxPlateDissipation} label="The idle across the type's spread of tubes" />
    </section>
  );
}
