import { useWorkbench } from '../../store/StoreProvider';
import { mainsOf } from '../../store/mainsPlan';
import { mainsWords } from './mainsWords';

/** The mains transformer's whole load and the primary's fuse, once the supply is solved. */
export function MainsTransformer() {
  // As a string: the view is a fresh object each time, its words are not.
  const words = useWorkbench((s) => {
    const m = mainsOf(s);
    return m ? mainsWords(m, s.design.supply.mainsVolts) : null;
  });
  if (!words) return null;
  return (
    <div className="mains-transformer">
      <h3>Mains transformer and fuse</h3>
      <p data-testid="mains-transformer">{words}</p>
      <p className="field-hint">Every secondary’s VA added: a bound, as their currents are not in phase. A B+ winding drawing more at full power (a class AB pair) is scaled with its DC, an overestimate behind a reservoir capacitor.</p>
    </div>
  );
}
