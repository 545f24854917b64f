import { describe, expect, it } from 'vitest';
import { analyze } from '../../../app/store/analysis';
import { DEMO_DESIGN } from '../../../app/store/demoDesign';
import { readDesignFile, writeDesignFile } from '../../../app/keep/designFile';
import { readShareFragment, shareFragment } from '../../../app/keep/shareLink';
import { IDEAL_CC, voltageStages } from '../../../app/store/stagePlans';
import type { BenchDesign } from '../../../app/store/analysis';
import { NO_TARGETS } from '../../../app/store/targetPlan';
import { LIBRARY_TUBES } from '../../../app/store/tubeRegistry';

const doc = {
  title: 'Phono second stage',
  design: {
    ...DEMO_DESIGN,
    ra: 33e3,
    rl: Infinity,
    stage2: { ...DEMO_DESIGN.stage2, kind: 'follower' as const },
    stageKind: 'output' as const,
    output: { ...DEMO_DESIGN.output, tubeId: 'KT88', connection: 'pentode' as const, bias: 'fixed' as const, vg: -28.5 },
    // A preamp stage and an output stage kept apart: RL is the preamp's own load.
    drivesOutput: false,
  },
};

describe('design files', () => {
  it('round-trip: save then open gives the identical design, title and figures', () => {
    const text = writeDesignFile(doc, new Date('2026-12-02T10:00:00Z'));
    const back = readDesignFile(text);
    if (!back.ok) throw new Error(back.message);
    expect(back.doc).toEqual(doc);
    const a = analyze(doc.design, LIBRARY_TUBES, null);
    const b = analyze(back.doc.design, LIBRARY_TUBES, null);
    if (!a.ok || !b.ok) throw new Error('both solve');
    expect(b.solution).toEqual(a.solution);
    expect(JSON.parse(text)).toMatchObject({ format: 'quiescent-design', version: 3, savedAt: '2026-12-02T10:00:00.000Z', design: { rl: null } });
  });

  const good = JSON.parse(writeDesignFile(doc)) as Record<string, unknown>;
  // A copy of a good file, to break one field at a time.
  type FileShape = { version: unknown; title: unknown; design: Record<string, unknown> };
  const variant = (patch: (f: FileShape) => void) => {
    const f = structuredClone(good) as unknown as FileShape;
    patch(f);
    return JSON.stringify(f);
  };

  /** A gain stage as version 3 lists it. */
  const GAIN = { kind: 'common-cathode', tubeId: '12AX7', bplus: 250, ra: 100e3, rk: 1500, bypassed: true, ck: 22e-6, cc: 47e-9, rg: 470e3 };

  it.each([
    ['truncated', writeDesignFile(doc).slice(0, 80), /^The file is not complete JSON \(cut short or damaged\): .+\. Nothing was opened\.$/],
    ['not a design file', JSON.stringify({ hello: 'world' }), /^This is not a Quiescent design file \(its "format" is not "quiescent-design"\)\. Nothing was opened\.$/],
    ['from the future', variant((f) => { f.version = 7; }), /^The file was written by a newer Quiescent \(format version 7\); this one reads up to version 3\. Nothing was opened\.$/],
    ['a wrong value', variant((f) => { f.design.ra = -5; }), /^design\.ra must be a number from 100 to 10000000 Ω \(found -5\)\. Nothing was opened\.$/],
    ['a wrong type', variant((f) => { f.design.bypassed = 'yes'; }), /^design\.bypassed must be true or false \(found "yes"\)\. Nothing was opened\.$/],
    ['a tube that is not a name', variant((f) => { f.design.tubeId = 42; }), /^design\.tubeId must name a tube \(text of at most 60 characters\) \(found 42\)\. Nothing was opened\.$/],
    ['no second stage', variant((f) => { delete f.design.stage2; }), /^design\.stage2 is missing\. Nothing was opened\.$/],
    ['no output stage', variant((f) => { delete f.design.output; }), /^design\.output is missing\. Nothing was opened\.$/],
    ['an unknown output tube', variant((f) => { (f.design.output as Record<string, unknown>).tubeId = '12AX7'; }), /^design\.output\.tubeId must name an output tube in the library \(found "12AX7"\)\. Nothing was opened\.$/],
    ['a positive grid bias', variant((f) => { (f.design.output as Record<string, unknown>).vg = 5; }), /^design\.output\.vg must be a number from -500 to 0 V \(found 5\)\. Nothing was opened\.$/],
    ['a driven output stage whose grid resistor is not RL', variant((f) => { f.design.drivesOutput = true; f.design.rl = 100e3; }), /^design\.rl must equal design\.output\.rg when the voltage stages drive the output stage \(found 100000 and 220000\)\. Nothing was opened\.$/],
    ['a join that is not true or false', variant((f) => { f.design.drivesOutput = 'yes'; }), /^design\.drivesOutput must be true or false \(found "yes"\)\. Nothing was opened\.$/],
    ['an unknown stage kind', variant((f) => { f.design.stageKind = 'push-pull'; }), /^design\.stageKind must be one of voltage, follower, output \(found "push-pull"\)\. Nothing was opened\.$/],
    ['a missing value', variant((f) => { delete f.design.ra; }), /^design\.ra must be a number from 100 to 10000000 Ω \(found undefined\)\. Nothing was opened\.$/],
    ['a section that is not an object', variant((f) => { f.design.stage2 = 5; }), /^design\.stage2 must be an object \(found 5\)\. Nothing was opened\.$/],
    ['a nested value out of range', variant((f) => { (f.design.stage2 as Record<string, unknown>).rk = 0; }), /^design\.stage2\.rk must be a number from 1 to 10000000 Ω \(found 0\)\. Nothing was opened\.$/],
    ['a chain stage with a missing value', variant((f) => { const { rg: _rg, ...rest } = GAIN; f.design.after = [rest]; }), /^design\.after\[0\]\.rg must be a number from 1000 to 100000000 Ω \(found undefined\)\. Nothing was opened\.$/],
    ['a chain side that is not a list', variant((f) => { f.design.after = { kind: 'follower' }; }), /^design\.after must be a list of stages \(found \{"kind":"follower"\}\)\. Nothing was opened\.$/],
    ['a chain stage of an unknown kind', variant((f) => { f.design.after = [{ ...GAIN, kind: 'pentode' }]; }), /^design\.after\[0\]\.kind must be one of common-cathode, follower \(found "pentode"\)\. Nothing was opened\.$/],
    ['a chain stage with a bad value', variant((f) => { f.design.before = [{ ...GAIN, ra: 5 }]; }), /^design\.before\[0\]\.ra must be a number from 100 to 10000000 Ω \(found 5\)\. Nothing was opened\.$/],
    ['a later stage without a coupling capacitor', variant((f) => { f.design.after = [{ ...GAIN, cc: null }]; }), /^design\.after\[0\]\.cc must be a coupling capacitor: only the first stage may be direct-coupled \(to the source\)\. Nothing was opened\.$/],
    ['a follower after a follower', variant((f) => { f.design.after = [{ kind: 'follower', tubeId: '12AU7', rk: 22e3 }]; }), /^design\.after\[0\] is a cathode follower with no gain stage right before it to be coupled to\. Nothing was opened\.$/],
    ['a bench stage direct-coupled after another', variant((f) => { f.design.before = [GAIN]; f.design.cin = null; }), /^design\.cin must be a coupling capacitor: only the first stage may be direct-coupled \(to the source\)\. Nothing was opened\.$/],
    ['too many stages', variant((f) => { f.design.before = Array.from({ length: 6 }, () => GAIN); }), /^The file holds 8 voltage stages; an amplifier here has at most 7\. Nothing was opened\.$/],
  ])('%s gets its own message', (_label, text, message) => {
    const r = readDesignFile(text);
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.message).toMatch(message);
  });

  it('opens a version 1 file (before output stages) with the default output stage, showing the voltage stage', () => {
    const v1 = variant((f) => {
      f.version = 1;
      delete f.design.output;
      delete f.design.stageKind;
    });
    const r = readDesignFile(v1);
    if (!r.ok) throw new Error(r.message);
    expect(r.doc.design.stageKind).toBe('voltage');
    expect(r.doc.design.output).toEqual(DEMO_DESIGN.output);
    expect(r.doc.design.ra).toBe(33e3);
  });

  it('an amplifier (voltage stage driving the output stage) round-trips; a file from before the join opens with the stages apart', () => {
    const joined = { title: 'Small amplifier', design: { ...DEMO_DESIGN, drivesOutput: true, rl: DEMO_DESIGN.output.rg } };
    const back = readDesignFile(writeDesignFile(joined));
    expect(back.ok && back.doc).toEqual(joined);
    const before = readDesignFile(variant((f) => { delete f.design.drivesOutput; }));
    expect(before.ok && before.doc.design.drivesOutput).toBe(false);
  });

  it('each bench\'s targets round-trip apart; a file written before the output stage had its own opens with none set for it', () => {
    const withTargets = { ...doc, design: { ...doc.design, targets: { ...NO_TARGETS, minGain: 30, maxZout: 20e3 }, followerTargets: { ...NO_TARGETS, maxZout: 400 }, outputTargets: { ...NO_TARGETS, minPowerW: 8, powerThd: 0.05, maxZout: 1.5 } } };
    const back = readDesignFile(writeDesignFile(withTargets));
    expect(back.ok && back.doc).toEqual(withTargets);
    const older = readDesignFile(variant((f) => { delete f.design.outputTargets; delete f.design.followerTargets; }));
    expect(older.ok && older.doc.design.outputTargets).toEqual(NO_TARGETS);
    expect(older.ok && older.doc.design.followerTargets).toEqual(NO_TARGETS);
    const bad = readDesignFile(variant((f) => { f.design.outputTargets = { ...NO_TARGETS, minPowerW: -3 }; }));
    expect(!bad.ok && bad.message).toMatch(/^design\.outputTargets\.minPowerW /);
  });

  it('a chain of four voltage stages round-trips, the bench on the third', () => {
    const chain = {
      title: 'Four-stage line amplifier',
      design: {
        ...DEMO_DESIGN,
        tubeId: '12AX7', ra: 100e3, rk: 1500,
        before: [{ ...GAIN, cc: 470e-9, rg: 1e6 }, { ...GAIN, tubeId: '12AU7', ra: 22e3, rk: 1e3 }] as BenchDesign['before'],
        stage2: { ...DEMO_DESIGN.stage2, kind: 'follower' as const, tubeId: '12AU7', rk: 47e3 },
        after: [] as BenchDesign['after'],
      },
    };
    const back = readDesignFile(writeDesignFile(chain));
    if (!back.ok) throw new Error(back.message);
    expect(back.doc).toEqual(chain);
    expect(voltageStages(back.doc.design).map((p) => p.kind)).toEqual(['common-cathode', 'common-cathode', 'common-cathode', 'follower']);
    // A follower listed first in 'after' opens held by the bench's stage, as the bench holds it.
    const listed = readDesignFile(variant((f) => { (f.design.stage2 as Record<string, unknown>).kind = 'none'; f.design.after = [{ kind: 'follower', tubeId: '12AU7', rk: 33e3 }]; }));
    if (!listed.ok) throw new Error(listed.message);
    expect(listed.doc.design.stage2).toMatchObject({ kind: 'follower', tubeId: '12AU7', rk: 33e3 });
    expect(listed.doc.design.after).toEqual([]);
  });

  it('grid stoppers round-trip on the bench and on a stage off it; a file from before them opens with none; a bad one is named', () => {
    const stopped = {
      title: 'Guitar input',
      design: { ...DEMO_DESIGN, rstopper: 68e3, before: [{ ...GAIN, cc: 470e-9, rg: 1e6, rstopper: 10e3 }] as BenchDesign['before'] },
    };
    const back = readDesignFile(writeDesignFile(stopped));
    if (!back.ok) throw new Error(back.message);
    expect(back.doc).toEqual(stopped);
    expect(voltageStages(back.doc.design).map((p) => (p.kind === 'common-cathode' ? (p.rstopper ?? 0) : null))).toEqual([10e3, 68e3]);
    const older = readDesignFile(variant((f) => { delete f.design.rstopper; }));
    if (!older.ok) throw new Error(older.message);
    expect(older.doc.design.rstopper).toBe(0);
    const bad = readDesignFile(variant((f) => { f.design.rstopper = 5; }));
    expect(bad.ok).toBe(false);
    if (!bad.ok) expect(bad.message).toBe('design.rstopper must be 0 or a number from 10 to 1000000 Ω (found 5). Nothing was opened.');
  });

  it('a follower\'s and a splitter\'s grid stoppers round-trip (the bench\'s follower, one off the bench, the split-load); a file from before them opens with none; a bad one is named', () => {
    const stopped = {
      title: 'Line stage',
      design: {
        ...DEMO_DESIGN,
        stage2: { ...DEMO_DESIGN.stage2, kind: 'follower' as const, tubeId: '12AU7', rk: 47e3, rstopper: 22e3 },
        before: [{ ...GAIN, cc: 470e-9, rg: 1e6 }, { kind: 'follower', tubeId: '12AU7', rk: 33e3, rstopper: 4.7e3 }] as BenchDesign['before'],
        // Driving the pair, the last voltage stage's RL is the splitter's leak.
        rl: DEMO_DESIGN.output.splitter.rg,
        output: { ...DEMO_DESIGN.output, pair: 'push-pull' as const, splitter: { ...DEMO_DESIGN.output.splitter, rstopper: 10e3 } },
      },
    };
    const back = readDesignFile(writeDesignFile(stopped));
    if (!back.ok) throw new Error(back.message);
    expect(back.doc).toEqual(stopped);
    expect(voltageStages(back.doc.design).map((p) => (p.kind === 'follower' ? (p.rstopper ?? 0) : null))).toEqual([null, 4.7e3, null, 22e3]);
    const follows = variant((f) => { f.design.stage2 = { kind: 'follower', tubeId: '12AU7', ra: 22e3, rk: 47e3, rg: 470e3 }; });
    const older = readDesignFile(follows);
    if (!older.ok) throw new Error(older.message);
    expect(older.doc.design.stage2.rstopper ?? 0).toBe(0);
    const bad = readDesignFile(variant((f) => { f.design.stage2 = { kind: 'follower', tubeId: '12AU7', ra: 22e3, rk: 47e3, rg: 470e3, rstopper: -1 }; }));
    expect(bad.ok).toBe(false);
    if (!bad.ok) expect(bad.message).toBe('design.stage2.rstopper must be 0 or a number from 10 to 1000000 Ω (found -1). Nothing was opened.');
    const badOff = readDesignFile(variant((f) => { f.design.after = [{ kind: 'follower', tubeId: '12AU7', rk: 33e3, rstopper: 2e6 }]; }));
    expect(badOff.ok).toBe(false);
    if (!badOff.ok) expect(badOff.message).toBe('design.after[0].rstopper must be 0 or a number from 10 to 1000000 Ω (found 2000000). Nothing was opened.');
    const badSplitter = readDesignFile(variant((f) => { (f.design.output as Record<string, Record<string, unknown>>).splitter!.rstopper = 'none'; }));
    expect(badSplitter.ok).toBe(false);
    if (!badSplitter.ok) expect(badSplitter.message).toBe('design.output.splitter.rstopper must be 0 or a number from 10 to 1000000 Ω (found "none"). Nothing was opened.');
  });

  it('a version 2 file with a second gain stage opens as the same two-stage chain', () => {
    const v2 = variant((f) => {
      f.version = 2;
      delete f.design.before;
      delete f.design.after;
      f.design.stage2 = { kind: 'common-cathode', tubeId: '12AU7', ra: 22e3, rk: 1e3, rg: 470e3 };
    });
    const r = readDesignFile(v2);
    if (!r.ok) throw new Error(r.message);
    expect(r.doc.design.before).toEqual([]);
    // The second gain stage is held as the chain holds any stage after the bench's.
    expect(r.doc.design.stage2.kind).toBe('none');
    expect(r.doc.design.after).toHaveLength(1);
    // Same meaning as before version 3: the second stage on stage 1's B+, its bypass and coupling ideal.
    expect(voltageStages(r.doc.design)[1]).toEqual({ kind: 'common-cathode', tubeId: '12AU7', bplus: doc.design.bplus, ra: 22e3, rk: 1e3, bypassed: true, ck: null, cc: IDEAL_CC, rg: 470e3 });
  });

  it('refuses a 10 MB file before parsing it', () => {
    const big = 'x'.repeat(10_000_000);
    expect(readDesignFile(big)).toEqual({ ok: false, message: 'The file is 10.0 MB; a design file is at most 1 MB. Nothing was opened.' });
  });

  it('keeps script-like text as plain text', () => {
    const r = readDesignFile(variant((f) => { f.title = '<script>alert("x")</script><img src=x onerror=alert(1)>'; }));
    expect(r.ok && r.doc.title).toBe('<script>alert("x")</script><img src=x onerror=alert(1)>');
  });
});

describe('share links', () => {
  it('carry the design in the fragment and read back identically', () => {
    const hash = shareFragment(doc);
    expect(hash).toMatch(/^#design=[A-Za-z0-9_-]+$/);
    const r = readShareFragment(hash);
    expect(r).toEqual({ ok: true, doc });
  });

  it('ignore a hash that is not a design, and report a damaged one', () => {
    expect(readShareFragment('#top')).toBeNull();
    expect(readShareFragment('#design=')).toMatchObject({ ok: false });
    const damaged = shareFragment(doc).slice(0, 60);
    const r = readShareFragment(damaged);
    expect(r?.ok).toBe(false);
    if (r && !r.ok) expect(r.message).toMatch(/^The shared link could not be opened: The file is not complete JSON/);
  });
});
