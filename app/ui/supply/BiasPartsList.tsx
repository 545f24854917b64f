import { PartsTables } from '../panels/PartsTables';
import { biasPartsOf, rectifierWords } from '../../export/supplyPartsLines';
import { useWorkbench } from '../../store/StoreProvider';

/** The bias supply's capacitors' rating rule, as the table's caption states it. */
const BIAS_CAPACITOR_RULE = 'Bias capacitors (voltage rating: the cold voltage, mains 10 % high, IEC 60038; fitted + to ground, the rail being negative)';

/** The fixed-bias output stage's grid supply to order: its capacitors, filter resistor, each tube's string and trimmer, and its diode. */
export function BiasPartsList() {
  const parts = useWorkbench(biasPartsOf);
  if (!parts) return null;
  return (
    <div className="stage-parts supply-parts bias-parts">
      <h3 className="subhead">Bias supply</h3>
      <PartsTables resistors={parts.resistors} capacitors={parts.capacitors} capacitorRule={BIAS_CAPACITOR_RULE} />
      <p data-part-line="bias-rectifier">{rectifierWords(parts.rectifier, null, true)}</p>
    </div>
  );
}
