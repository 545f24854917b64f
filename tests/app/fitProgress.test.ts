import { describe, expect, it, vi } from 'vitest';

// A worker whose reports can arrive late, as they may from a real one: the progress channel and the answer are separate.
const fake = vi.hoisted(() => ({ reports: [] as ((done: number, of: number) => void)[], finish: [] as ((v: unknown) => void)[] }));
vi.mock('../../app/work/offThread', () => ({
  createOffThread: () => ({
    fit: (_csv: string, _typ: string, onProgress: (done: number, of: number) => void) =>
      new Promise((resolve) => {
        fake.reports.push(onProgress);
        fake.finish.push(resolve);
      }),
    readTubes: () => Promise.resolve('cancelled'),
    cancel: () => fake.finish.at(-1)?.('cancelled'),
  }),
}));

const { createWorkbenchStore } = await import('../../app/store/workbenchStore');

describe('a fit\'s progress', () => {
  it('a report that lands after its fit was cancelled does not hold the bench busy: the next fit runs', async () => {
    const store = createWorkbenchStore();
    const first = store.getState().fitCustom();
    fake.reports[0]!(3, 10);
    store.getState().cancelCustomWork();
    await first;
    expect(store.getState().custom).toMatchObject({ busy: null, note: 'Fit cancelled: nothing changed.' });
    fake.reports[0]!(10, 10); // late, from the cancelled job
    expect(store.getState().custom.busy).toBeNull();
    void store.getState().fitCustom();
    expect(fake.reports).toHaveLength(2); // the second fit started
    expect(store.getState().custom.note).toBeNull();
  });
});
