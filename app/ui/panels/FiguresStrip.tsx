import { decibels, farads, mAPerV, milliamps, ohms, plain, volts } from '../../format';
import { Figure, Share } from './Figure';
import { useShallow } from 'zustand/react/shallow';
import { useWorkbench } from '../../store/StoreProvider';

/**
 * The stage's figures as a strip of labelled numbers with units: the
 * operating point, then the parts (B+, Ra, Rk) that put it there. Each value
 * carries a data-figure name so tests and exports can read it.
 */
export function FiguresStrip() {
  // The parts the point asks for: while dragging these are the live values (the form and schematic follow at a readable pace).
  const [bplus, ra, rk] = useWorkbench(useShallow((s) => [s.design.bplus, s.design.ra, s.design.rk]));
  const sol = useWorkbench((s) => s.analysis.solution);
  const maxPa = useWorkbench((s) => s.analysis.tube.ratings.maxPlateDissipation);
  const { op } = sol;
  return (
    <section className="panel figures" aria-label="Figures at the operating point">
      <dl className="figure-group">
        <Figure name="va" label="Va (plate to ground)" value={volts(op.va)} chars={5.5} />
        <Figure name="vpk" label="Vpk" value={volts(op.vpk)} chars={5.5} />
        <Figure name="ia" label="Ia" value={milliamps(op.ia)} chars={8} />
        <Figure name="vgk" label="Vgk" value={volts(op.vgk)} chars={7.5} />
        <Share name="pa" label="Pa" value={op.pa} rating={maxPa} meterLabel="Plate dissipation, share of rating" />
      </dl>
      <dl className="figure-group" aria-label="Parts">
        <Figure name="bplus" label="B+" value={volts(bplus)} chars={5.5} />
        <Figure name="ra" label="Ra" value={ohms(ra)} chars={6.5} />
        <Figure name="rk" label="Rk" value={ohms(rk)} chars={6.5} />
      </dl>
      <dl className="figure-group">
        <Figure name="mu" label="μ" value={plain(sol.mu)} chars={4} />
        <Figure name="rp" label="rp" value={ohms(sol.rp)} chars={6.5} />
        <Figure name="gm" label="gm" value={mAPerV(sol.gm)} chars={9.5} />
      </dl>
      <dl className="figure-group">
        <Figure name="gain" label="Gain" value={`${plain(sol.gain)} × (${decibels(sol.gain)})`} chars={15} />
        <Figure name="zout" label="Zout" value={ohms(sol.zout)} chars={6.5} />
        <Figure name="cin" label="Cin (Miller)" value={farads(sol.cin)} chars={6.5} />
        <Figure name="rin" label="Rin" value={sol.rin !== null ? ohms(sol.rin) : 'no leak'} chars={6.5} />
      </dl>
      <dl className="figure-group">
        <Figure name="to-grid-current" label="Grid swing to grid current" value={volts(sol.toGridCurrent)} chars={7} />
        <Figure name="to-cutoff" label="Grid swing to cutoff" value={volts(sol.toCutoff)} chars={7} />
      </dl>
    </section>
  );
}
