import { useWorkbench } from '../../store/StoreProvider';
import { tubesToOrderLine } from '../../store/tubesToOrder';

/** The tubes the design needs, every channel's, as one line at the head of a parts list. */
export function TubesToOrder() {
  const line = useWorkbench(tubesToOrderLine);
  return <p className="tubes-to-order" data-testid="tubes-to-order">{line}</p>;
}
