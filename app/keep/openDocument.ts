import type { Failure } from '../../src/index';
import type { WorkbenchStore } from '../store/workbenchStore';
import { withKnownTubes, type DesignDocument } from './designFile';

/**
 * Opens a design on the bench, the one way every path does it (file, shelf,
 * link, autosave): tubes this browser does not know are stood in for and
 * named. Answers the model's failure (the design stays as it was) or a note
 * to add to the success message (null when there is nothing to add).
 */
export function openDocument(store: WorkbenchStore, doc: DesignDocument): { failure: Failure } | { failure: null; note: string | null } {
  // Against the tubes the page holds now: the library's and the user's in this browser.
  const known = withKnownTubes(doc, store.getState().registry);
  const failure = store.getState().loadDocument(known.doc);
  return failure ? { failure } : { failure: null, note: known.note };
}

/** A success message with the note after it, if any. */
export const withNote = (text: string, note: string | null) => (note ? `${text} ${note}` : text);
