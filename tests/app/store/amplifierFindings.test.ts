import { describe, expect, it } from 'vitest';
import { createWorkbenchStore } from '../../../app/store/workbenchStore';
import { benchFindings } from '../../../app/store/amplifierFindings';
import { cardSections } from '../../../app/export/buildCard';

/** A 12AX7 follower direct-coupled to a 12AX7 plate near 250 V: its cathode sits above the 180 V heater–cathode rating (Tung-Sol 12AX7, design-centre). */
function overRatedFollower() {
  const store = createWorkbenchStore();
  store.getState().dropStage(0); // one voltage stage and its follower: the demo's input stage removed
  const s = store.getState();
  s.commit({ ...s.design, tubeId: '12AX7', bplus: 400, ra: 220e3, rk: 1500, rl: 100e3, stage2: { kind: 'follower', tubeId: '12AX7', ra: 22e3, rk: 150e3, rg: 470e3 } });
  return store;
}

describe('one ratings list for the amplifier', () => {
  it('a follower over its heater–cathode rating is a danger in the main list, tagged with its stage', () => {
    const store = overRatedFollower();
    const link = store.getState().analysis.signal.chain;
    expect(link?.ok && link.links[1]!.op.vk).toBeGreaterThan(180);
    const f = benchFindings(store.getState()).find((x) => x.kind === 'heater-cathode' && x.stage === 1);
    expect(f).toMatchObject({ severity: 'danger', stageName: 'Stage 2, 12AX7 cathode follower' });
    // Most severe first across stages.
    const order = { danger: 0, warning: 1, note: 2 };
    const list = benchFindings(store.getState());
    for (let k = 1; k < list.length; k++) expect(order[list[k]!.severity]).toBeGreaterThanOrEqual(order[list[k - 1]!.severity]);
  });

  it('the follower\'s danger stays in the list when the page reopens on the output stage (the bench\'s own signal pass waits then)', () => {
    const store = overRatedFollower();
    store.getState().setDrivesOutput(true);
    store.getState().setStageKind('output');
    const reopened = createWorkbenchStore();
    expect(reopened.getState().loadDocument({ title: 'reopened', design: store.getState().design })).toBeNull();
    expect(reopened.getState().design.stageKind).toBe('output');
    const f = benchFindings(reopened.getState()).find((x) => x.kind === 'heater-cathode' && x.stageName === 'Stage 2, 12AX7 cathode follower');
    expect(f).toMatchObject({ severity: 'danger' });
  });

  it('the build card carries every stage\'s findings, the follower\'s figures and the heater-elevation advice', () => {
    const store = overRatedFollower();
    const sections = cardSections(store.getState());
    const byHeading = Object.fromEntries(sections.map((x) => [x.heading, x.lines.join('\n')]));
    expect(byHeading['Ratings, every stage']).toMatch(/DANGER: Stage 2, 12AX7 cathode follower: Heater-to-cathode voltage/);
    expect(byHeading['Stage 2: 12AX7 cathode follower, direct-coupled']).toMatch(/heater–cathode \d+/);
    expect(byHeading['Heaters']).toMatch(/Elevate the heater supply to about/);
    // And the windings the whole amplifier's heaters need: both stages on one 12AX7 envelope (0.3 A at 6.3 V) and the EL34 (1.5 A).
    expect(byHeading['Heaters']).toMatch(/\nWinding 6\.3 V, 1\.8 A \(11\.3 VA\): 12AX7 \(6\.3 V, 0\.3 A\), EL34 \(6\.3 V, 1\.5 A\)$/);
  });
});

describe('the card\'s ratings list', () => {
  it('is the workbench\'s list line for line, every stage\'s notes included, whichever stage is on the bench', () => {
    const store = overRatedFollower();
    const expected = () => benchFindings(store.getState()).map((f) => `${f.severity.toUpperCase()}: ${f.stageName}: ${f.message}`);
    const ratings = () => cardSections(store.getState()).find((x) => x.heading === 'Ratings, every stage')!.lines;
    for (const kind of ['voltage', 'output'] as const) {
      store.getState().setStageKind(kind);
      expect(ratings()).toEqual(expected());
      expect(ratings().some((l) => l.startsWith('DANGER: Stage 2, 12AX7 cathode follower: Heater-to-cathode'))).toBe(true);
      // The margins of the stages off the bench as well as on it (the card once kept only the bench's).
      expect(ratings().some((l) => l.startsWith('NOTE: Stage 1'))).toBe(true);
      expect(ratings().some((l) => l.startsWith('NOTE: Output stage, EL34'))).toBe(true);
    }
  });
});
