import { describe, expect, it } from 'vitest';
import { latestOnly } from '../../../app/work/latestOnly';

/** A job that finishes when told to, recording what it was asked to do. */
function heldJob() {
  const started: number[] = [];
  const finish: (() => void)[] = [];
  const job = (n: number) => new Promise<number>((resolve) => {
    started.push(n);
    finish.push(() => resolve(n * 10));
  });
  return { job, started, finishNext: () => finish.shift()!() };
}

const settle = () => new Promise((r) => setTimeout(r, 0));

describe('latestOnly: one job at a time, only the newest waiting', () => {
  it('runs a burst as the job under way and the newest only; the ones between are cancelled without running', async () => {
    const held = heldJob();
    const run = latestOnly(held.job);
    const answers = [1, 2, 3, 4].map((n) => run(n));
    await settle();
    // The first runs; 2 and 3 were replaced while they waited.
    expect(held.started).toEqual([1]);
    expect(await answers[1]).toBe('cancelled');
    expect(await answers[2]).toBe('cancelled');
    held.finishNext();
    // The first's answer is stale by now; the newest starts straight after it.
    expect(await answers[0]).toBe('cancelled');
    await settle();
    expect(held.started).toEqual([1, 4]);
    held.finishNext();
    expect(await answers[3]).toBe(40);
  });

  it('answers a lone job as it is, and starts the next at once when nothing runs', async () => {
    const held = heldJob();
    const run = latestOnly(held.job);
    const first = run(5);
    held.finishNext();
    expect(await first).toBe(50);
    const second = run(6);
    await settle();
    expect(held.started).toEqual([5, 6]);
    held.finishNext();
    expect(await second).toBe(60);
  });

  it('a job that fails lets the waiting one run, and passes its failure on', async () => {
    let calls = 0;
    const run = latestOnly(async (n: number) => {
      calls++;
      if (n === 1) throw new Error('worker gone');
      return n;
    });
    const a = run(1);
    const b = run(2);
    await expect(a).rejects.toThrow('worker gone');
    expect(await b).toBe(2);
    expect(calls).toBe(2);
  });
});
