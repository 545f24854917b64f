import { describe, expect, it } from 'vitest';
import { createWorkbenchStore } from '../../../app/store/workbenchStore';

describe('the plate curves drawn, on every bench', () => {
  it('with 24 curves asked for, the voltage stages still join the output stage, single-ended or a pair, and its chart draws them', () => {
    const store = createWorkbenchStore({ supplySolver: null });
    store.getState().setDrivesOutput(false);
    store.getState().setCurveCount(24);
    // Joining had been refused: "Plate curves must be a whole number from 1 to 12 (got 24)".
    store.getState().setDrivesOutput(true);
    expect(store.getState().design.drivesOutput).toBe(true);
    store.getState().setStageKind('output');
    const single = store.getState().outputBench.analysis.sheet.family.length;
    expect(single).toBeGreaterThan(12);
    store.getState().setOutputPair('push-pull');
    expect(store.getState().design.output.pair).toBe('push-pull');
    expect(store.getState().errors.outputPair).toBeUndefined();
  });
});
