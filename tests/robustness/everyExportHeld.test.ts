import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import * as Q from '../../src/index';

// The promise is for the whole public face: a function src/index.ts exports
// and no robustness run calls is a gap. Add it to everyExport.test.ts (raw
// input) or everyHelper.test.ts (typed input), or stop exporting it.
const runs = ['everyExport.test.ts', 'everyHelper.test.ts'].map((f) => readFileSync(new URL(f, import.meta.url), 'utf8')).join('\n');

describe('the robustness runs', () => {
  it('call every function the model exports', () => {
    const functions = Object.entries(Q).filter(([, v]) => typeof v === 'function').map(([k]) => k);
    expect(functions.length).toBeGreaterThan(50);
    expect(functions.filter((name) => !new RegExp(`\\bQ\\.${name}\\b`).test(runs))).toEqual([]);
  });
});
