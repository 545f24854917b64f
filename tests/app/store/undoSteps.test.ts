import { describe, expect, it } from 'vitest';
import { voltageStages } from '../../../app/store/stagePlans';
import { createWorkbenchStore } from '../../../app/store/workbenchStore';

/** A store on the test's clock, which stands still unless moved: every change lands within the second that merges typing. */
function stillClock() {
  const store = createWorkbenchStore({ supplySolver: null, now: () => 1_000_000 });
  return store;
}

describe('undo steps: a value typed is one step however many keystrokes; an action is a step of its own however quick', () => {
  it('two gain stages added in the same second are two steps', () => {
    const store = stillClock();
    const stages = () => voltageStages(store.getState().design).length;
    const start = stages();
    store.getState().addStage(0, 'common-cathode');
    store.getState().addStage(0, 'common-cathode');
    expect(stages()).toBe(start + 2);
    store.getState().undo();
    expect(stages()).toBe(start + 1);
    store.getState().undo();
    expect(stages()).toBe(start);
  });

  it('a value typed and a tube chosen straight after are two steps; the value\u2019s keystrokes one', () => {
    const store = stillClock();
    const ra = store.getState().design.ra;
    const tube = store.getState().design.tubeId;
    for (const text of ['3', '33', '33k']) store.getState().editField('ra', text);
    expect(store.getState().design.ra).toBe(33e3);
    store.getState().chooseTube('12AT7');
    expect(store.getState().design.tubeId).toBe('12AT7');
    store.getState().undo();
    expect(store.getState().design.tubeId).toBe(tube);
    expect(store.getState().design.ra).toBe(33e3);
    store.getState().undo();
    expect(store.getState().design.ra).toBe(ra);
  });

  it('a follower added (the stage put on the bench, then its follower) is one step', () => {
    const store = stillClock();
    const before = store.getState().design;
    const stages = voltageStages(before).length;
    store.getState().addStage(0, 'follower');
    expect(voltageStages(store.getState().design).length).toBe(stages + 1);
    store.getState().undo();
    expect(voltageStages(store.getState().design).length).toBe(stages);
    expect(store.getState().past.length).toBe(0);
  });
});
