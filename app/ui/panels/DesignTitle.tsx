import { MAX_TITLE_CHARS } from '../../keep/designFile';
import { useWorkbench } from '../../store/StoreProvider';

/** The design's name, editable in place in the masthead. Shown only as text, never as markup. */
export function DesignTitle() {
  const title = useWorkbench((s) => s.title);
  const setTitle = useWorkbench((s) => s.setTitle);
  return (
    <input
      className="design-title"
      aria-label="Design title"
      value={title}
      maxLength={MAX_TITLE_CHARS}
      placeholder="Name this design"
      // As wide as its words: a long amplifier's title then takes a line of its own under the name instead of being cut off.
      style={{ flexBasis: `${title.length + 2}ch` }}
      onChange={(e) => setTitle(e.target.value)}
    />
  );
}
