import { decibels, milliamps, ohms, plain, volts } from '../../format';
import { Figure, Share } from '../panels/Figure';
import { useWorkbench } from '../../store/StoreProvider';
import { benchIndex } from '../../store/stagePlans';

/**
 * The follower's figures when it is the stage on the bench: where it sits
 * (its cathode is the output's DC, its plate at B+), what it dissipates, its
 * gain and output impedance into the load after it, the heater-to-cathode
 * voltage a follower so often runs too high, and from the whole amplifier
 * its headroom at the chain's clean limit.
 */
export function FollowerFigures() {
  const bench = useWorkbench((s) => s.followerBench);
  const rk = useWorkbench((s) => s.design.stage2.rk);
  const coupled = useWorkbench((s) => s.design.stage2.coupling !== undefined);
  const ratings = useWorkbench((s) => s.followerBench?.tube.ratings ?? null);
  const inChain = useWorkbench((s) => {
    const view = s.amplifier;
    if (!view?.result.ok) return null;
    const at = view.names.findIndex((n) => n.voltageIndex === benchIndex(s.design) + 1);
    return at >= 0 ? view.result.stages[at] ?? null : null;
  });
  if (!bench) return null;
  const sol = bench.plane.solution;
  const { op } = sol;
  return (
    <section className="panel figures" aria-label="The follower's figures at its operating point">
      <dl className="figure-group">
        <Figure name="follower-vk" label="Vk (cathode, the output's DC)" value={volts(op.vk)} chars={5.5} />
        <Figure name="follower-vgrid" label={coupled ? 'Grid (held by its divider)' : 'Grid (the plate before it)'} value={volts(bench.vgrid)} chars={5.5} />
        <Figure name="follower-vpk" label="Vpk" value={volts(op.vpk)} chars={5.5} />
        <Figure name="follower-ia" label="Ia" value={milliamps(op.ia)} chars={8} />
        <Figure name="follower-vgk" label="Vgk" value={volts(op.vgk)} chars={7.5} />
        <Share name="follower-pa" label="Pa" value={op.pa} rating={bench.tube.ratings.maxPlateDissipation} meterLabel="Plate dissipation, share of rating" />
      </dl>
      <dl className="figure-group" aria-label="Parts">
        <Figure name="follower-bplus" label="B+ (the gain stage's)" value={volts(bench.bplus)} chars={5.5} />
        <Figure name="follower-rk" label="Rk" value={ohms(rk)} chars={6.5} />
      </dl>
      <dl className="figure-group">
        <Figure name="follower-gain" label="Gain" value={`${plain(sol.gain, 3)} × (${decibels(sol.gain)})`} chars={15} />
        <Figure name="follower-zout" label="Zout" value={ohms(sol.zout)} chars={6.5} />
        <Figure name="follower-gm" label="gm" value={`${plain(sol.gm * 1e3)} mA/V`} chars={9.5} />
      </dl>
      <dl className="figure-group">
        <Figure name="follower-vhk" label={vhkLabel(sol.vhk, ratings)} value={volts(sol.vhk)} chars={6} />
        <Figure
          name="follower-headroom"
          label="Headroom in the amplifier"
          value={inChain?.headroomDb == null ? '—' : `${inChain.headroomDb.toFixed(1)} dB${inChain.clipsAt ? ` (then ${inChain.clipsAt.by === 'grid-current' ? 'grid current' : 'cutoff'})` : ''}`}
          chars={22}
        />
      </dl>
    </section>
  );
}

/** The heater–cathode figure's label with the rating for its polarity: a cathode below heaters held above it meets the sheet's other figure. */
function vhkLabel(vhk: number, ratings: { readonly maxHeaterCathodeVoltage: number | null; readonly maxHeaterCathodeVoltageCathodeNegative?: number } | null): string {
  const positive = ratings?.maxHeaterCathodeVoltage ?? null;
  if (positive === null) return 'Heater–cathode';
  if (vhk >= 0) return `Heater–cathode (rated ${plain(positive)} V)`;
  return `Heater–cathode (cathode negative, rated ${plain(ratings?.maxHeaterCathodeVoltageCathodeNegative ?? positive)} V)`;
}
