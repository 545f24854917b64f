import type { ChainInput } from '../../src/index';
import { chainNetlist, nodes } from '../../src/netlist/chainNetlist';
import { runNgspice } from './ngspice';

/** The hum checks' ripple frequency, Hz: full wave on 50 Hz mains. */
export const RIPPLE_HZ = 100;

/**
 * The whole amplifier in ngspice at the ripple's frequency with its input at
 * rest: each netlist line passed through `edit` (to put an AC 1 V source
 * where the ripple is asked, or to swap a part), and `print` read after the
 * AC run (the operating point's own print stays as chainNetlist writes it),
 * at `hz` (behind a half-wave rectifier, the mains' own).
 */
export function rippleRun(chain: ChainInput, edit: (line: string) => string, print = 'vr(out) vi(out)', hz = RIPPLE_HZ): Record<string, number> {
  const netlist = chainNetlist(chain, { kind: 'op-ac' })
    .replace('VS src 0 DC 0 AC 1', 'VS src 0 DC 0 AC 0')
    .split('\n')
    .map(edit)
    .join('\n')
    .replace('ac lin 1 1000 1000', `ac lin 1 ${hz} ${hz}`)
    .replace('print vr(out) vi(out)', `print ${print}`);
  return runNgspice(netlist);
}

/** An edit for rippleRun: 1 V of ripple on stage k's B+ source. */
export const rippleOnSupply = (k: number) => {
  const source = `${nodes.supply(k).toUpperCase()} `;
  return (line: string) => (line.startsWith(source) ? `${line} AC 1` : line);
};
