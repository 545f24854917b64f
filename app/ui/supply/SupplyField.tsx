import { useId } from 'react';
import { useWorkbench } from '../../store/StoreProvider';

/**
 * One of the supply's values, typed in the trade's notation ("100u", "4k7").
 * A message beside it says what is wrong; the supply keeps its last good
 * value until the text is fixed.
 */
export function SupplyField({ path, label, unit, example }: { path: string; label: string; unit: string; example: string }) {
  const draft = useWorkbench((s) => s.supplyDrafts[path] ?? '');
  const error = useWorkbench((s) => s.supplyErrors[path]);
  const edit = useWorkbench((s) => s.editSupplyValue);
  const id = useId();
  return (
    <div className={error ? 'value-field has-error' : 'value-field'}>
      <label htmlFor={id} className="field-label">
        {label} <span className="unit">({unit})</span>
      </label>
      <input
        id={id}
        name={`supply.${path}`}
        autoComplete="off"
        spellCheck={false}
        value={draft}
        placeholder={example}
        aria-invalid={error ? true : undefined}
        aria-describedby={error ? `${id}-err` : undefined}
        onChange={(e) => edit(path, e.target.value)}
      />
      {error ? <p id={`${id}-err`} className="field-error" role="alert">{error}</p> : null}
    </div>
  );
}
