import { bplusAgreement, type Finding } from '../../src/index';
import { ROLE_NAME } from './amplifierChain';
import { nodeVoltsOf, screensOf } from './supplySlice';
import { voltageStages } from './stagePlans';
import type { WorkbenchState } from './workbenchStore';

/**
 * The stages whose B+ as designed is not what their supply node gives: a
 * warning each (the model's bplusAgreement), for the one ratings list and
 * the card. The voltage stages on one node and one typed B+ are named
 * together; an output stage's screens on a node of their own are
 * compared with that node. Nothing while the stages' B+ follow their nodes, before the
 * supply is solved, or while a new solve is on its way (a drag's frames).
 */
export function supplyBplusFindings(s: WorkbenchState): Finding[] {
  const d = s.design;
  const view = s.supplyView;
  if (!d.supply.on || d.supply.follow || !view || view.stale || !view.result.ok) return [];
  const r = view.result;
  const list = voltageStages(d);
  const held = (role: 'voltage' | 'splitter' | 'output', index: number | null): number | null => {
    if (role === 'splitter') return d.output.splitter.bplus;
    if (role === 'output') return d.output.bplus;
    // A follower's plate hangs from its gain stage's B+: the gain stages say what the voltage stages were designed for.
    const p = index === null ? undefined : list[index];
    return p?.kind === 'common-cathode' ? p.bplus : null;
  };
  const groups = new Map<string, { who: string[]; tube: string; role: 'voltage' | 'splitter' | 'output'; node: number; held: number; supplied: number }>();
  view.names.forEach((n, i) => {
    const h = held(n.role, n.voltageIndex);
    if (h === null) return;
    const key = `${n.role}|${view.feeds[i]}|${h}`;
    const g = groups.get(key) ?? { who: [], tube: n.tube, role: n.role, node: view.feeds[i]!, held: h, supplied: nodeVoltsOf(view, r, i) };
    g.who.push(`${n.title} (${n.tube})`);
    groups.set(key, g);
  });
  const gainStages = list.filter((p) => p.kind === 'common-cathode').length;
  const out: Finding[] = [];
  for (const g of groups.values()) {
    // Named as the ratings list names them: the voltage stages together, or each by its card; the splitter and output stage by role.
    const who = g.role === 'voltage' ? (g.who.length === gainStages ? ROLE_NAME.voltage : g.who.join(', ')) : `${ROLE_NAME[g.role]} (${g.tube})`;
    const a = bplusAgreement(who, g.node, g.held, g.supplied);
    if (a.ok && a.finding) out.push(a.finding);
  }
  // Screens on a node of their own: their voltage as designed against that node's.
  const screens = screensOf(view, r);
  if (screens) {
    const a = bplusAgreement(`${ROLE_NAME.output} (${screens.tube})`, screens.node, d.output.screenVolts, screens.volts, 'screens');
    if (a.ok && a.finding) out.push(a.finding);
  }
  return out;
}
