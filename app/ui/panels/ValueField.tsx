import { useId } from 'react';
import { FIELDS, type FieldName } from '../../store/fields';
import { useWorkbench } from '../../store/StoreProvider';
import { useDragPaced } from './useDragPaced';

/**
 * One design value typed in the trade's notation. The box shows the user's
 * text; a message beside it says what is wrong, and the design keeps its last
 * valid value until the text is fixed. `label` names the box where one
 * field serves stages of more than one kind (a follower's Rk, a second gain
 * stage's).
 */
export function ValueField({ field, hint, readOnly, label }: { field: FieldName; hint?: string; readOnly?: boolean; label?: string }) {
  const def = FIELDS[field];
  // A drag rewrites Ra, Rk or B+ on every move: the box follows at a readable pace, the figures strip live.
  const draft = useDragPaced((s) => s.drafts[field]);
  const error = useWorkbench((s) => s.errors[field]);
  const editField = useWorkbench((s) => s.editField);
  const settleField = useWorkbench((s) => s.settleField);
  const id = useId();
  return (
    <div className={error ? 'value-field has-error' : 'value-field'}>
      <label htmlFor={id} className="field-label">
        {label ?? def.label} <span className="unit">({def.unit})</span>
      </label>
      <input
        id={id}
        name={field}
        inputMode="text"
        autoComplete="off"
        spellCheck={false}
        value={draft}
        readOnly={readOnly}
        placeholder={def.example}
        aria-invalid={error ? true : undefined}
        aria-describedby={error ? `${id}-err` : hint ? `${id}-hint` : undefined}
        onChange={(e) => editField(field, e.target.value)}
        onBlur={() => settleField(field)}
      />
      {error ? (
        <p id={`${id}-err`} className="field-error" role="alert">{error}</p>
      ) : hint ? (
        <p id={`${id}-hint`} className="field-hint">{hint}</p>
      ) : null}
    </div>
  );
}
