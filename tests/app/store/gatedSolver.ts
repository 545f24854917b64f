import { expect } from 'vitest';
import { createWorkbenchStore, type StoreOptions, type WorkbenchStore } from '../../../app/store/workbenchStore';
import { solveOnSupply, type AmplifierOnSupply } from '../../../src/index';

/** A supply solver that answers only when told to: the model worker's, slowed to the test's pace. */
export function gatedSolver() {
  const waiting: (() => void)[] = [];
  const solver = (input: AmplifierOnSupply) => new Promise<ReturnType<typeof solveOnSupply>>((resolve) => waiting.push(() => resolve(solveOnSupply(input))));
  return { solver, answer: () => waiting.splice(0).forEach((go) => go()), asked: () => waiting.length };
}

/** Waits (up to 5 s) for `test` to hold, and fails if it never does. */
export async function until(test: () => boolean): Promise<void> {
  for (let k = 0; k < 250 && !test(); k++) await new Promise((r) => setTimeout(r, 20));
  expect(test()).toBe(true);
}

/** A workbench on a gated solver, its supply's first solve answered. */
export async function solvedOnGate(options: Omit<StoreOptions, 'supplySolver'> = {}): Promise<{ store: WorkbenchStore; gate: ReturnType<typeof gatedSolver> }> {
  const gate = gatedSolver();
  const store = createWorkbenchStore({ ...options, supplySolver: gate.solver });
  await until(() => gate.asked() > 0);
  gate.answer();
  await until(() => store.getState().supplyView?.result.ok === true);
  return { store, gate };
}
