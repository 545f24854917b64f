import { ValueField } from '../panels/ValueField';
import type { FieldName } from '../../store/fields';
import { useWorkbench } from '../../store/StoreProvider';
import { nodeOf } from '../../store/supplyPlan';
import { benchIndex, nodeOfStage, voltageStages } from '../../store/stagePlans';

/**
 * A stage's B+ box: typed, or, while the stages follow the supply, the
 * value its node delivers, read-only and saying which node.
 */
export function BplusField({ field, bench, hint }: { field: FieldName; bench: 'voltage' | 'output'; hint?: string }) {
  const following = useWorkbench((s) => s.design.supply.on && s.design.supply.follow);
  const node = useWorkbench((s) => (bench === 'voltage' ? nodeOfStage(s.design, voltageStages(s.design), benchIndex(s.design)) : nodeOf(s.design.supply, bench)));
  if (!following) return <ValueField field={field} {...(hint ? { hint } : {})} />;
  return <ValueField field={field} readOnly hint={`from node ${node + 1} of the supply (untick “follow” there to type it)`} />;
}
