import { farads, milliamps, ohms, plain, smallVolts, volts, watts } from '../format';
import type { WorkbenchState } from '../store/workbenchStore';
import { fedFrom } from '../store/supplySlice';
import { humSpeakerOhms, humWords } from '../ui/supply/SupplyHumLine';
import { biasHumOf } from '../store/biasSupply';
import { mainsOf } from '../store/mainsPlan';
import { mainsWords } from '../ui/supply/mainsWords';
import { oneWinding, rectifierName } from '../ui/supply/rectifierWords';
import { lowEndWords } from '../ui/supply/lowEndWords';

/** Said first where a supply's figures are its last solve's, the design having moved on before it was solved again. */
export const BEHIND_WORDS = 'Not yet solved for this design: these figures and parts are from the solve before its last change. Make the card again once the workbench shows the supply solved.';

/**
 * The B+ supply on the card, in three or four lines: what it is, every
 * node's voltage and ripple with what it feeds, the rectifier's and
 * winding's currents and the cold voltage, and the bleeder (its ratings are
 * in the card's one ratings list). Null when the supply is off or not solved.
 */
export function supplySection(s: WorkbenchState): { heading: string; lines: string[] } | null {
  const p = s.design.supply;
  const view = s.supplyView;
  if (!p.on || !view || !view.result.ok) return null;
  const r = view.result;
  const rectifier = p.rectifier.kind === 'tube' ? `${p.rectifier.tubeId} rectifier` : `silicon ${rectifierName(p.rectifier)}`;
  const filter = [
    p.input.kind === 'choke' ? `${plain(p.input.l)} H (${ohms(p.input.rdc)}) into ${farads(p.input.c)}` : farads(p.input.c),
    ...p.sections.map((x) => `${x.kind === 'rc' ? ohms(x.r) : `${plain(x.l)} H (${ohms(x.rdc)})`} / ${farads(x.c)}`),
  ].join(' → ');
  const feeds = (k: number) => fedFrom(view, k).map((n) => n.title.toLowerCase());
  const nodes = r.supply.nodes.map((n, k) => `${k + 1}: ${volts(n.dc)}, ${smallVolts(n.ripplePp)} p-p${feeds(k).length ? ` (${feeds(k).join(', ')})` : ''}`).join('; ');
  const lines = [
    ...(view.stale ? [BEHIND_WORDS] : []),
    `${plain(p.secondaryRms)} V rms${oneWinding(p.rectifier) ? '' : ' a side'}${p.secondaryAmps !== null ? ` at ${milliamps(p.secondaryAmps)}` : ''}, ${p.regulation !== null ? `${plain(p.regulation * 100)} % regulation` : `${ohms(p.windingOhms)} winding`}, ${rectifier}, ${p.mainsHz} Hz${p.channels > 1 ? `, ${p.channels} channels` : ''}; ${filter}`,
    `Nodes ${nodes}`,
    `Rectifier peak ${milliamps(r.supply.rectifierPeak)}, winding ${milliamps(r.supply.secondaryRmsCurrent)} rms (${plain(r.supply.secondaryVa)} VA); ${volts(r.supply.noLoadVolts)} on every capacitor cold`,
  ];
  const hum = humWords(view, humSpeakerOhms(s, view), biasHumOf(s));
  if (hum) lines.push(`${hum}, each stage's ripple carried to the output and added in phase`);
  const low = lowEndWords(view);
  if (low) lines.push(low);
  const b = view.bleeder;
  if (b?.ok && b.needed) lines.push(`Bleeder ${ohms(b.ohms)}, ${watts(b.partWatts)} across node 1: under 60 V in ${plain(b.seconds, 2)} s`);
  const m = mainsOf(s);
  const mains = m ? mainsWords(m, p.mainsVolts) : null;
  if (mains) lines.push(mains);
  return { heading: 'B+ supply', lines };
}
