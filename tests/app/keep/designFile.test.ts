import { describe, expect, it } from 'vitest';
import { analyze } from '../../../app/store/analysis';
import { DEMO_DESIGN } from '../../../app/store/demoDesign';
import { readDesignFile, writeDesignFile } from '../../../app/keep/designFile';
import { readShareFragment, shareFragment } from '../../../app/keep/shareLink';

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
    const a = analyze(doc.design, null);
    const b = analyze(back.doc.design, null);
    if (!a.ok || !b.ok) throw new Error('both solve');
    expect(b.solution).toEqual(a.solution);
    expect(JSON.parse(text)).toMatchObject({ format: 'quiescent-design', version: 2, savedAt: '2026-12-02T10:00:00.000Z', design: { rl: null } });
  });

  const good = JSON.parse(writeDesignFile(doc)) as Record<string, unknown>;
  // A copy of a good file, to break one field at a time.
  type FileShape = { version: unknown; title: unknown; design: Record<string, unknown> };
  const variant = (patch: (f: FileShape) => void) => {
    const f = structuredClone(good) as unknown as FileShape;
    patch(f);
    return JSON.stringify(f);
  };

  it.each([
    ['truncated', writeDesignFile(doc).slice(0, 80), /^The file is not complete JSON \(cut short or damaged\): .+\. Nothing was opened\.$/],
    ['not a design file', JSON.stringify({ hello: 'world' }), /^This is not a Quiescent design file \(its "format" is not "quiescent-design"\)\. Nothing was opened\.$/],
    ['from the future', variant((f) => { f.version = 7; }), /^The file was written by a newer Quiescent \(format version 7\); this one reads up to version 2\. Nothing was opened\.$/],
    ['a wrong value', variant((f) => { f.design.ra = -5; }), /^design\.ra must be a number from 100 to 10000000 Ω \(found -5\)\. Nothing was opened\.$/],
    ['a wrong type', variant((f) => { f.design.bypassed = 'yes'; }), /^design\.bypassed must be true or false \(found "yes"\)\. Nothing was opened\.$/],
    ['a tube that is not a name', variant((f) => { f.design.tubeId = 42; }), /^design\.tubeId must name a tube \(text of at most 60 characters\) \(found 42\)\. Nothing was opened\.$/],
    ['no second stage', variant((f) => { delete f.design.stage2; }), /^design\.stage2 is missing\. Nothing was opened\.$/],
    ['no output stage', variant((f) => { delete f.design.output; }), /^design\.output is missing\. Nothing was opened\.$/],
    ['an unknown output tube', variant((f) => { (f.design.output as Record<string, unknown>).tubeId = '12AX7'; }), /^design\.output\.tubeId must name an output tube in the library \(found "12AX7"\)\. Nothing was opened\.$/],
    ['a positive grid bias', variant((f) => { (f.design.output as Record<string, unknown>).vg = 5; }), /^design\.output\.vg must be a number from -500 to 0 V \(found 5\)\. Nothing was opened\.$/],
    ['a driven output stage whose grid resistor is not RL', variant((f) => { f.design.drivesOutput = true; f.design.rl = 100e3; }), /^design\.rl must equal design\.output\.rg when the voltage stages drive the output stage \(found 100000 and 220000\)\. Nothing was opened\.$/],
    ['a join that is not true or false', variant((f) => { f.design.drivesOutput = 'yes'; }), /^design\.drivesOutput must be true or false \(found "yes"\)\. Nothing was opened\.$/],
    ['an unknown stage kind', variant((f) => { f.design.stageKind = 'push-pull'; }), /^design\.stageKind must be one of voltage, output \(found "push-pull"\)\. Nothing was opened\.$/],
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
