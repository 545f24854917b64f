import { render, screen, waitFor } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { App } from '../../../app/App';
import { bounded, customSpecs, customTubes, loadCustomTubes, MAX_KEPT_POINTS, removeFromPageForTests as clearPageOnly, saveCustomTube, type CustomTubeSpec } from '../../../app/keep/customTubes';
import { readDesignFile, withKnownTubes, writeDesignFile } from '../../../app/keep/designFile';
import { LEGACY_KEY } from '../../../app/keep/keptTubes';
import { DEMO_DESIGN } from '../../../app/store/demoDesign';
import { createWorkbenchStore } from '../../../app/store/workbenchStore';
import { korenPublishedSets } from '../../../src/index';
import { tubeRegistry } from '../../../app/store/tubeRegistry';

const spec = (name: string, points = 20): CustomTubeSpec => ({
  name,
  params: korenPublishedSets['12AU7']!,
  maxPlateVoltage: 300,
  maxPlateDissipation: 2.75,
  maxHeaterCathodeVoltage: 200,
  points: Array.from({ length: points }, (_, k) => ({ va: 50 + (k % 250), vg: -(k % 12), ia: 1e-3 + k * 1e-9 })),
  rmsPercent: 2,
});

/** A page reload as far as the user's tubes go: the page's list forgotten, read back from the browser's store. */
async function reloadTubes(): Promise<string[]> {
  clearPageOnly();
  return loadCustomTubes();
}

describe("the user's tubes are kept where the quota fits", () => {
  it('tubes well over 1 MB in all are kept (IndexedDB), and come back on the next load', async () => {
    // 80 tubes × 400 points ≈ 1.2 MB of JSON: past the 1 MB the old localStorage home held.
    for (let k = 0; k < 80; k++) expect(await saveCustomTube(spec(`Big ${k}`, MAX_KEPT_POINTS))).toBe(true);
    expect(JSON.stringify(customSpecs()).length).toBeGreaterThan(1e6);
    expect(await reloadTubes()).toEqual([]);
    expect(customSpecs()).toHaveLength(80);
    expect(tubeRegistry(customTubes()).lookup('Big 79')?.userMade).toBe(true);
  });

  it("a fit's points are kept in a bounded form: at most MAX_KEPT_POINTS, the first and last among them", () => {
    const big = spec('Many', 10_000);
    const b = bounded(big);
    expect(b.points).toHaveLength(MAX_KEPT_POINTS);
    expect(b.points[0]).toEqual(big.points[0]);
    expect(b.points.at(-1)).toEqual(big.points.at(-1));
  });

  it('tubes kept in localStorage by an earlier version move across, and a record that cannot be read is named while the rest load', async () => {
    localStorage.setItem(LEGACY_KEY, JSON.stringify({ format: 'quiescent-tubes', version: 1, tubes: [spec('Old one'), { name: 'Broken', params: { mu: -1 } }, spec('Old two')] }));
    clearPageOnly();
    const problems = await loadCustomTubes();
    expect(problems).toEqual(['Tube 2 (Broken): its Koren parameters are not usable']);
    expect(customSpecs().map((s) => s.name)).toEqual(['Old one', 'Old two']);
    expect(localStorage.getItem(LEGACY_KEY)).toBeNull(); // moved to IndexedDB
  });
});

describe('a design whose tube is missing', () => {
  it('opens with a stand-in and a message naming the tube, never as the demo', () => {
    const r = readDesignFile(writeDesignFile({ title: 'Borrowed', design: { ...DEMO_DESIGN, tubeId: 'Friend\'s 6SN7', bplus: 320, ra: 39e3 } }));
    if (!r.ok) throw new Error(r.message);
    const k = withKnownTubes(r.doc, tubeRegistry(customTubes()));
    expect(k.doc.design).toMatchObject({ tubeId: '12AU7', bplus: 320, ra: 39e3 });
    expect(k.note).toBe('The design uses “Friend\'s 6SN7”, which is neither in the library nor among your tubes in this browser: it opened with the 12AU7 in its place and every other value as saved. Import the tube (A tube of your own → Import tubes) and choose it again.');
  });

  it('an autosaved design on a user tube opens on that tube once the kept tubes have loaded', async () => {
    await saveCustomTube(spec('Mine'));
    clearPageOnly();
    localStorage.setItem('quiescent.autosave', writeDesignFile({ title: 'On my tube', design: { ...DEMO_DESIGN, tubeId: 'Mine', bplus: 290 } }));
    const store = createWorkbenchStore();
    render(<App store={store} />);
    await waitFor(() => expect(store.getState().design.tubeId).toBe('Mine'));
    expect(store.getState().design.bplus).toBe(290);
    expect(screen.getByText('Opened your last design with your own tube.')).toBeTruthy();
  });
});
