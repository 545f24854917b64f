import { afterEach, describe, expect, it } from 'vitest';
import { lookupTube, resetCustomTubes, saveCustomTube } from '../../../app/keep/customTubes';
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
    const first = lookupTube('My 12AU7');
    expect(first?.userMade).toBe(true);
    expect(lookupTube('My 12AU7')).toBe(first);
    // Saving again builds it anew, once.
    saveCustomTube({ ...spec, maxPlateDissipation: 3 });
    const second = lookupTube('My 12AU7');
    expect(second).not.toBe(first);
    expect(second?.ratings.maxPlateDissipation).toBe(3);
    expect(lookupTube('My 12AU7')).toBe(second);
  });
});
