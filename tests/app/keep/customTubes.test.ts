import { afterEach, describe, expect, it } from 'vitest';
import { customTubes, resetCustomTubes, saveCustomTube } from '../../../app/keep/customTubes';
import { tubeRegistry } from '../../../app/store/tubeRegistry';
import { createWorkbenchStore } from '../../../app/store/workbenchStore';
import { korenPublishedSets } from '../../../src/index';

const spec = {
  name: 'My 12AU7',
  params: korenPublishedSets['12AU7']!,
  maxPlateVoltage: 300,
  maxPlateDissipation: 2.75,
  maxHeaterCathodeVoltage: 200,
  points: [{ va: 250, vg: -8.5, ia: 10.5e-3 }],
  rmsPercent: 3,
};

describe("the user's tubes", () => {
  afterEach(() => resetCustomTubes());

  it('a user tube is built once per id: every look-up (a drag makes one a frame) returns the same record', () => {
    saveCustomTube(spec);
    const lookup = (id: string) => tubeRegistry(customTubes()).lookup(id);
    const first = lookup('My 12AU7');
    expect(first?.userMade).toBe(true);
    expect(lookup('My 12AU7')).toBe(first);
    // Saving again builds it anew, once.
    saveCustomTube({ ...spec, maxPlateDissipation: 3 });
    const second = lookup('My 12AU7');
    expect(second).not.toBe(first);
    expect(second?.ratings.maxPlateDissipation).toBe(3);
    expect(lookup('My 12AU7')).toBe(second);
  });

  it('the store holds the registry: a saved tube is in it after the list is read again, and the registry is replaced, never changed', () => {
    const store = createWorkbenchStore();
    const before = store.getState().registry;
    expect(before.lookup('My 12AU7')).toBeUndefined();
    expect(before.lookup('12AX7')?.id).toBe('12AX7');
    saveCustomTube(spec);
    store.getState().refreshTubes();
    const after = store.getState().registry;
    expect(after).not.toBe(before);
    expect(before.lookup('My 12AU7')).toBeUndefined();
    expect(after.lookup('My 12AU7')?.userMade).toBe(true);
    expect(store.getState().tubes.some((t) => t.id === 'My 12AU7')).toBe(true);
  });
});
