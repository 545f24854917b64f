import 'fake-indexeddb/auto';
import { cleanup } from '@testing-library/react';
import { afterEach, beforeEach } from 'vitest';
import { resetCustomTubes } from '../../app/keep/customTubes';

// Each test starts as a first visit: no autosave, no shelf, no shared link.
beforeEach(async () => {
  localStorage.clear();
  await resetCustomTubes();
  history.replaceState(null, '', '/');
});

// Each test unmounts what it rendered.
afterEach(() => cleanup());
