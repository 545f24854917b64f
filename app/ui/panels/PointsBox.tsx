import { useWorkbench } from '../../store/StoreProvider';
import { MAX_POINTS_TEXT } from '../../store/customSlice';

/**
 * Past this many characters the box shows the points' first lines instead of
 * all of them: Chromium took about 0.9 s to lay out a 400,000-character
 * textarea after each keystroke (measured), and nobody edits 10,000 lines by
 * hand. The points are all kept and fitted.
 */
export const EDITABLE_POINTS_TEXT = 40_000;
const PREVIEW_LINES = 60;

/** The points box: editable text while it is small, a preview of a large paste with the count and a way to clear it. */
export function PointsBox({ id, hintId }: { id: string; hintId: string }) {
  const csv = useWorkbench((s) => s.custom.csv);
  const setCsv = useWorkbench((s) => s.setCustomCsv);
  const pastePoints = useWorkbench((s) => s.pastePoints);
  const large = csv.length > EDITABLE_POINTS_TEXT;
  const onPaste = (e: React.ClipboardEvent<HTMLTextAreaElement>) => {
    // The store places the paste (cut to whole lines if it would overfill the box), so a huge paste is never laid out whole.
    const text = e.clipboardData.getData('text');
    const el = e.currentTarget;
    e.preventDefault();
    if (large) pastePoints(text, 0, csv.length);
    else pastePoints(text, el.selectionStart, el.selectionEnd);
  };
  if (!large) {
    return <textarea id={id} rows={6} maxLength={MAX_POINTS_TEXT} value={csv} spellCheck={false} onChange={(e) => setCsv(e.target.value)} onPaste={onPaste} aria-describedby={hintId} />;
  }
  const lines = csv.split('\n');
  const more = lines.length - PREVIEW_LINES;
  return (
    <div className="points-preview">
      <textarea id={id} rows={6} readOnly value={`${lines.slice(0, PREVIEW_LINES).join('\n')}\n… ${more.toLocaleString('en')} more lines`} spellCheck={false} onPaste={onPaste} aria-describedby={hintId} />
      <p className="field-hint">
        {`${lines.filter((l) => l.trim() !== '').length.toLocaleString('en')} lines (${csv.length.toLocaleString('en')} characters): too many to edit here, all kept for the fit. A paste here replaces them. `}
        <button type="button" onClick={() => setCsv('')}>Clear the points</button>
      </p>
    </div>
  );
}
