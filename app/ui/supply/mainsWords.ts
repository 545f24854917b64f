import { FUSE_FACTOR } from '../../../src/index';
import { plain } from '../../format';
import type { MainsView } from '../../store/mainsPlan';

const va = (x: number) => `${plain(x)} VA`;

/** The mains transformer and its fuse in words, as the panel and the card give them; null when it does not add up. */
export function mainsWords(m: MainsView, mainsVolts: number): string | null {
  const a = m.answer;
  if (!a.ok) return null;
  const bplus = m.bplusVaFull !== null ? `B+ ${va(m.bplusVa)} idle, about ${va(m.bplusVaFull)} at full power` : `B+ ${va(m.bplusVa)}`;
  const parts = [bplus, `heaters ${va(m.heaterVa)}${m.dcHeaters ? ' (the DC supply at its output)' : ''}`, ...(m.biasVa !== null ? [`bias ${va(m.biasVa)}`] : [])];
  const fuse = a.fuseAmps !== null ? `a time-lag (T) fuse of ${plain(a.fuseAmps)} A in the primary (${FUSE_FACTOR} × its full-load current, common practice: it rides out the switch-on surge)` : 'past 10 A, more than a miniature fuse carries';
  const ht = a.htFuseAmps !== null ? `; a time-lag fuse of ${plain(a.htFuseAmps)} A ${m.htFuseAt === 'centre tap' ? 'in the B+ winding\'s centre tap' : 'in series with the B+ winding'} (the same rule: it opens on a shorted filter capacitor first)` : '';
  return `Mains transformer: at least ${va(a.va)} (${parts.join(', ')}); ${plain(a.primaryAmps)} A in the primary at ${mainsVolts} V (at ${Math.round(a.efficiency * 100)} % efficiency, from memory); ${fuse}${ht}.`;
}
