import { useEffect, useId, useRef } from 'react';
import { FIELDS, type FieldName } from '../../store/fields';
import { useWorkbench } from '../../store/StoreProvider';

/**
 * The in-place editor for one part's value on a drawing, placed over its
 * label (`at`: CSS left and top within the drawing's frame). Bound to the
 * store's field like the form's box: the same draft, message and checks.
 * Enter, Escape or leaving it settles the value.
 */
export function InlineEditor({ field, at, onDone }: { field: FieldName; at: { left: string; top: string }; onDone: () => void }) {
  const draft = useWorkbench((s) => s.drafts[field]);
  const error = useWorkbench((s) => s.errors[field]);
  const editField = useWorkbench((s) => s.editField);
  const settleField = useWorkbench((s) => s.settleField);
  const input = useRef<HTMLInputElement>(null);
  const id = useId();
  useEffect(() => {
    input.current?.focus();
    input.current?.select();
  }, []);
  const close = () => {
    settleField(field);
    onDone();
  };
  return (
    <div className="inline-editor" style={at}>
      <label htmlFor={id} className="visually-hidden">{`${FIELDS[field].label} (${FIELDS[field].unit})`}</label>
      <input
        ref={input}
        id={id}
        value={draft}
        aria-invalid={error ? true : undefined}
        aria-describedby={error ? `${id}-err` : undefined}
        onChange={(e) => editField(field, e.target.value)}
        onBlur={close}
        onKeyDown={(e) => {
          if (e.key === 'Enter' || e.key === 'Escape') close();
        }}
      />
      {error ? <p id={`${id}-err`} className="field-error" role="alert">{error}</p> : null}
    </div>
  );
}
