import { PartsTables } from '../panels/PartsTables';
import { chokeWords, rectifierWords, SUPPLY_CAPACITOR_RULE, supplyPartsOf } from '../../export/supplyPartsLines';
import { useWorkbench } from '../../store/StoreProvider';

/**
 * The B+ supply's parts to order, under the stages' parts: its filter
 * capacitors with their ratings and ripple currents, its resistors and the
 * bleeder, its chokes and rectifier. Shown when the supply is solved.
 */
export function SupplyPartsList() {
  const parts = useWorkbench(supplyPartsOf);
  const tube = useWorkbench((s) => (s.design.supply.rectifier.kind === 'tube' ? s.design.supply.rectifier.tubeId : null));
  if (!parts) return null;
  const notes = [...new Set(parts.capacitors.map((c) => c.note).filter((n): n is string => n !== null))];
  return (
    <div className="stage-parts supply-parts">
      <h3 className="subhead">B+ supply</h3>
      <PartsTables resistors={parts.resistors} capacitors={parts.capacitors} capacitorRule={SUPPLY_CAPACITOR_RULE} />
      {notes.map((n) => <p key={n} className="field-error">{n}</p>)}
      {parts.chokes.map((c) => <p key={c.ref} data-part-line={c.ref}>{chokeWords(c)}</p>)}
      <p data-part-line="rectifier">{rectifierWords(parts.rectifier, tube)}</p>
    </div>
  );
}
