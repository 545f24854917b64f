import { decibels, farads, mAPerV, milliamps, ohms, plain, volts } from '../format';
import { Figure, Share } from './Figure';
import { useWorkbench } from '../store/StoreProvider';

/**
 * The stage's figures as a strip of labelled numbers with units. Each value
 * carries a data-figure name so tests and exports can read it.
 */
export function FiguresStrip() {
  const sol = useWorkbench((s) => s.analysis.solution);
  const maxPa = useWorkbench((s) => s.analysis.tube.ratings.maxPlateDissipation);
  const { op } = sol;
  return (
    <section className="panel figures" aria-label="Figures at the operating point">
      <dl className="figure-group">
        <Figure name="va" label="Va (plate to ground)" value={volts(op.va)} />
        <Figure name="vpk" label="Vpk" value={volts(op.vpk)} />
        <Figure name="ia" label="Ia" value={milliamps(op.ia)} />
        <Figure name="vgk" label="Vgk" value={volts(op.vgk)} />
        <Share name="pa" label="Pa" value={op.pa} rating={maxPa} meterLabel="Plate dissipation, share of rating" />
      </dl>
      <dl className="figure-group">
        <Figure name="mu" label="μ" value={plain(sol.mu)} />
        <Figure name="rp" label="rp" value={ohms(sol.rp)} />
        <Figure name="gm" label="gm" value={mAPerV(sol.gm)} />
      </dl>
      <dl className="figure-group">
        <Figure name="gain" label="Gain" value={`${plain(sol.gain)} × (${decibels(sol.gain)})`} />
        <Figure name="zout" label="Zout" value={ohms(sol.zout)} />
        <Figure name="cin" label="Cin (Miller)" value={farads(sol.cin)} />
      </dl>
      <dl className="figure-group">
        <Figure name="to-grid-current" label="Grid swing to 0 V" value={volts(sol.toGridCurrent)} />
        <Figure name="to-cutoff" label="Grid swing to cutoff" value={volts(sol.toCutoff)} />
      </dl>
    </section>
  );
}
