import { cleanup } from '@testing-library/react';
import { afterEach } from 'vitest';

// jsdom lacks the SVG geometry calls d3 uses for pointer positions; tests that
// need them stub them locally. Each test unmounts what it rendered.
afterEach(() => cleanup());
