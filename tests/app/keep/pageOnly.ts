import { removeFromPageForTests } from '../../../app/keep/customTubes';

/** Forgets the page's list of user tubes without touching the browser's store: what a reload does. */
export function clearPageOnly(): void {
  removeFromPageForTests();
}
