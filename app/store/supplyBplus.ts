import { bplusAgreement, type AmplifierOnSupplyResult, type Finding } from '../../src/index';
import { ROLE_NAME } from './amplifierChain';
import { nodeVoltsOf, screensOf, type SupplyView } from './supplySlice';
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
  // A follower's plate hangs from its gain stage's B+: the gain stages say what the voltage stages were designed for.
  const held = (role: BplusRole, index: number | null): number | null =>
    role === 'splitter' ? d.output.splitter.bplus : role === 'output' ? d.output.bplus : index !== null && list[index]?.kind === 'common-cathode' ? (list[index] as { bplus: number }).bplus : null;
  const out: Finding[] = [];
  for (const g of bplusGroups(view, r, held, list.filter((p) => p.kind === 'common-cathode').length)) {
    const a = bplusAgreement(g.who, g.node, g.held, g.supplied);
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

export type BplusRole = 'voltage' | 'splitter' | 'output';

/** Stages that share a node and a B+ as designed: named together, with that node's voltage under the whole amplifier's current. */
export interface BplusGroup {
  readonly key: string;
  readonly role: BplusRole;
  /** As the ratings list and the supply's lines name them: the voltage stages together when they all share it, or each by its card; the splitter and output stage by role. */
  readonly who: string;
  readonly node: number;
  /** The B+ the stages were designed for, V. */
  readonly held: number;
  /** What their node gives, V. */
  readonly supplied: number;
}

/**
 * The stages grouped by the node that feeds them and the B+ they were
 * designed for (`held`, by role and voltage index; null leaves a stage out:
 * a follower, which rides on its gain stage's B+).
 */
export function bplusGroups(view: SupplyView, r: AmplifierOnSupplyResult, held: (role: BplusRole, index: number | null) => number | null, gainStages: number): BplusGroup[] {
  const groups = new Map<string, { who: string[]; tube: string; role: BplusRole; node: number; held: number; supplied: number }>();
  view.names.forEach((n, i) => {
    const h = held(n.role, n.voltageIndex);
    if (h === null) return;
    const key = `${n.role}|${view.feeds[i]}|${h}`;
    const g = groups.get(key) ?? { who: [], tube: n.tube, role: n.role, node: view.feeds[i]!, held: h, supplied: nodeVoltsOf(view, r, i) };
    g.who.push(`${n.title} (${n.tube})`);
    groups.set(key, g);
  });
  return [...groups].map(([key, g]) => ({
    key,
    role: g.role,
    who: g.role === 'voltage' ? (g.who.length === gainStages ? ROLE_NAME.voltage : g.who.join(', ')) : `${ROLE_NAME[g.role]} (${g.tube})`,
    node: g.node,
    held: g.held,
    supplied: g.supplied,
  }));
}
