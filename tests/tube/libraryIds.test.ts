import { expect, it } from 'vitest';
import { LIBRARY_TUBE_IDS, tubeLibrary } from '../../src/index';

it('the library\'s names without its records are the library\'s names, in its order', () => {
  expect(LIBRARY_TUBE_IDS).toEqual(tubeLibrary.map((t) => t.id));
});
