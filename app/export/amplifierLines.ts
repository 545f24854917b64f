import { farads, hertz, milliamps, ohms, plain, volts, watts } from '../format';
import type { BuildSheet } from '../store/buildSheet';
import type { CapacitorLine, ResistorLine } from '../../src/index';
import { voltageStages } from '../store/stagePlans';
import { atLevelWords, cleanLimitWords } from '../ui/chain/atLevelWords';
import { NOISE_BAND_WORDS, noiseWords } from '../ui/chain/noiseWords';
import { FEEDBACK_CAVEAT, feedbackBandWords, feedbackWords } from '../ui/chain/feedbackWords';
import type { WorkbenchState } from '../store/workbenchStore';

/**
 * The whole amplifier on the card, when it is more than one stage: the chain
 * input to output, its gain and band, its clean limit and the input for it,
 * and the input and THD at the working level. Null for a single stage (its
 * own sections say it all) or when the chain did not solve.
 */
export function amplifierSection(s: WorkbenchState): { heading: string; lines: string[] } | null {
  const view = s.amplifier;
  if (!view || !view.result.ok || view.result.stages.length < 2) return null;
  const r = view.result;
  const hz = (f: number | null, none: string) => (f === null ? none : hertz(f));
  const chain = view.names.map((n, i) => `${n.tube} ${view.kinds[i]!.toLowerCase()}`).join(' → ');
  const first = r.clipsFirst;
  const lines = [
    chain,
    `Gain ${plain(Math.abs(r.gain))} × (${(20 * Math.log10(Math.abs(r.gain))).toFixed(1)} dB${r.inverting ? ', inverting' : ''}), −3 dB ${hz(r.lowHz, 'DC')} to ${hz(r.highHz, 'beyond 100 MHz')}`,
    `Clean to ${cleanLimitWords(r, view.names)}${r.input.dBu === null ? '' : `; ${view.names[first.stage]!.title.toLowerCase()} clips first (${first.by === 'grid-current' ? 'grid current' : 'cutoff'})`}`,
  ];
  if (view.atLevel?.ok) lines.push(`At ${view.levelLabel}: ${atLevelWords(view)}`);
  const noise = noiseWords(r, r.outputPower !== null ? s.design.output.speakerOhms : null);
  if (noise) lines.push(`Noise (${NOISE_BAND_WORDS}${s.design.feedbackRf !== null ? ', open loop' : ''}): ${noise}`);
  // With global feedback the figures above are the open loop's; the loop's own follow, with what they leave out.
  const fb = feedbackWords(view, s.design.output.speakerOhms);
  if (fb && s.design.feedbackRf !== null) {
    lines[1] = `Open loop: ${lines[1]}`;
    const across = s.design.feedbackCf === null ? '' : ` with ${farads(s.design.feedbackCf)} across it`;
    lines.push(view.feedback?.ok ? `Global feedback, Rf ${ohms(s.design.feedbackRf)}${across} from the speaker to stage 1's cathode: ${fb}` : `Global feedback: ${fb}`);
    const band = feedbackBandWords(view, s.design.output);
    if (band) lines.push(band);
    if (view.feedback?.ok) lines.push(FEEDBACK_CAVEAT);
  }
  return { heading: 'Amplifier', lines };
}

/**
 * The voltage stages (and the phase splitter) not on the bench, one section
 * each: their values, where they sit in the solved amplifier, and their parts
 * with their own ratings.
 */
export function otherStageSections(s: WorkbenchState, sheet: BuildSheet): { heading: string; lines: string[] }[] {
  const amp = s.amplifier?.result.ok ? s.amplifier.result : null;
  if (!amp) return [];
  const list = voltageStages(s.design);
  return sheet.stages.filter((st) => !st.onBench).map((parts) => {
    const i = parts.index;
    const p = list[i];
    const st = amp.stages[i];
    if (!st) return { heading: parts.title, lines: partLines(parts) };
    const sp = s.design.output.splitter;
    const values = !p
      ? `${sp.kind === 'split-load' ? `Split-load: Ra ${ohms(sp.ra)}, Rk ${ohms(sp.rk)}${sp.rstopper ? `, grid stopper ${ohms(sp.rstopper)}` : ''}` : `Long-tailed pair: Ra ${ohms(sp.ra)} and ${ohms(sp.ra2)}, Rk ${ohms(sp.rk)} over a ${ohms(sp.rtail)} tail${sp.rstopper ? `, grid stopper ${ohms(sp.rstopper)} at the first grid` : ''}`}, B+ ${volts(sp.bplus)}, ${sp.coupling === 'direct' ? 'grid direct from the plate before it' : `grid at ${volts(sp.vgrid)} through ${ohms(sp.rg)}`}, Cc ${farads(sp.cc)} into each output grid`
      : p.kind === 'follower'
      ? `Rk ${ohms(p.rk)}, ${p.coupling ? `Cc ${farads(p.coupling.cc)} from stage ${i}'s plate into ${ohms(p.coupling.rg)}, grid held at ${volts(p.coupling.vbias)}` : `direct-coupled to stage ${i}'s plate`}${p.rstopper ? `, grid stopper ${ohms(p.rstopper)}` : ''}`
      : `B+ ${volts(p.bplus)}, Ra ${ohms(p.ra)}, Rk ${ohms(p.rk)}${p.bypassed ? ` bypassed${p.ck ? ` by ${farads(p.ck)}` : ''}` : ' unbypassed'}, ${p.cc === null ? 'direct from the source' : `Cc ${farads(p.cc)}`}, ${leakWords(p.rg, p.volume ?? null)}${p.rstopper ? `, grid stopper ${ohms(p.rstopper)}` : ''}`;
    return {
      heading: parts.title,
      lines: [
        values,
        `Va ${volts(st.op.va)}, Vk ${volts(st.op.vk)}, Ia ${milliamps(st.op.ia)}, Vgk ${volts(st.op.vgk)}; gain ${plain(st.gain)} ×, Zout ${ohms(st.zout)}`,
        ...partLines(parts),
      ],
    };
  });
}

/** One line per part to order: its value and series, its rating, and what it runs at or sees. */
export function partLines(parts: { readonly resistors: readonly ResistorLine[]; readonly capacitors: readonly CapacitorLine[] }): string[] {
  return [
    ...parts.resistors.map((r) => (r.potentiometer ? `${r.ref}: ${ohms(r.preferred)} pot, audio taper` : `${r.ref}: ${ohms(r.preferred)} ${r.series}, ${r.ratingWatts} W (runs at ${watts(r.watts)})`)),
    ...parts.capacitors.map((c) => `${c.ref}: ${c.value === null ? 'value to choose' : farads(c.value)}, ${c.ratingVolts} V${c.polarity ? `, ${c.polarity}` : ''} (sees ${volts(Math.max(c.volts, c.voltsAtSwitchOn))})`),
  ];
}

/** A grid leak in words: Rg, or the volume control in its place with its setting. */
export function leakWords(rg: number, volume: number | null): string {
  return volume === null ? `Rg ${ohms(rg)}` : `volume control ${ohms(rg)} (in Rg's place) at ${plain(volume)} dB`;
}
