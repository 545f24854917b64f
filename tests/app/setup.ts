import { cleanup } from '@testing-library/react';
import { afterEach, beforeEach } from 'vitest';

// Each test starts as a first visit: no autosave, no shelf, no shared link.
beforeEach(() => {
  localStorage.clear();
  history.replaceState(null, '', '/');
});

// Each test unmounts what it rendered.
afterEach(() => cleanup());
