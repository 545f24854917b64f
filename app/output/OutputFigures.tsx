import { mAPerV, milliamps, ohms, percentOf as percent, plain, volts, watts } from '../format';
import { Figure, Share } from '../panels/Figure';
import { useWorkbench } from '../store/StoreProvider';

/**
 * The output stage's figures: the quiescent point, dissipation against
 * ratings, small-signal figures, and power: clean (to grid current or
 * cutoff), at full drive (grid to 0 V, as data sheets quote it), and within
 * the distortion limit. Names in data-figure for tests and exports.
 */
export function OutputFigures() {
  const bench = useWorkbench((s) => s.outputBench);
  const a = bench.analysis;
  const { op, tube } = a.solution;
  const r = tube.ratings;
  const screen = tube.law.kind === 'pentode' && op.connection !== 'triode';
  return (
    <section className="panel figures" aria-label="Output stage figures">
      <dl className="figure-group">
        <Figure name="vpk" label="Vpk" value={volts(op.vpk)} />
        <Figure name="ip" label={op.connection === 'triode' && tube.law.kind === 'pentode' ? 'Ia + Ig2' : 'Ia'} value={milliamps(op.ip)} />
        {screen ? <Figure name="ig2" label="Ig2" value={milliamps(op.ig2)} /> : null}
        <Figure name="vgk" label="Vgk" value={volts(op.vgk)} />
        <Share name="pa" label="Pa" value={op.pa} rating={r.maxPlateDissipation} meterLabel="Plate dissipation, share of rating" />
        {screen && r.maxScreenDissipation !== null ? <Share name="pg2" label="Pg2 (idle)" value={op.pg2} rating={r.maxScreenDissipation} meterLabel="Screen dissipation, share of rating" /> : null}
      </dl>
      <dl className="figure-group">
        <Figure name="rp" label="rp (as wired)" value={ohms(op.rp)} />
        <Figure name="gm" label="gm" value={mAPerV(op.gm)} />
        <Figure name="damping" label="Damping factor" value={plain(a.dampingFactor, 2)} />
        <Figure name="zout" label="Zout at the speaker" value={ohms(a.outputImpedance)} />
        <Figure name="turns" label="Turns ratio" value={`${plain(a.turnsRatio, 3)} : 1`} />
      </dl>
      <dl className="figure-group">
        <Figure name="clean-power" label={`Clean power (to ${a.clean.limitedBy})`} value={`${watts(a.clean.at.power)} at ${percent(a.clean.at.thd)} THD`} />
        <Figure name="full-power" label="Grid driven to 0 V" value={`${watts(a.full.power)} at ${percent(a.full.thd)} THD`} />
        <Figure
          name="limit-power"
          label={`Power within ${percent(bench.analysis.solution.design.thdLimit)} THD`}
          value={a.atLimit && !bench.light ? `${watts(a.atLimit.power)}${a.atLimit.limitedBy === 'grid current' ? ' (grid current first)' : ''}` : '…'}
        />
        <Figure name="drive" label="Drive for clean power" value={`${volts(a.clean.at.drive / Math.SQRT2)} rms`} />
      </dl>
    </section>
  );
}
