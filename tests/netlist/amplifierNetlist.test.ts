import { describe, expect, it } from 'vitest';
import { amplifierNetlist, findOutputTube, findTube, type ChainInput } from '../../src/index';

const chain: ChainInput = {
  source: { rsource: 600 },
  stages: [
    { kind: 'common-cathode', tube: findTube('12AT7')!, bplus: 300, ra: 56e3, rk: 820, bypassed: false, coupling: { kind: 'capacitor', cc: 470e-9, rg: 680e3 } },
    {
      kind: 'single-ended-output', tube: findOutputTube('EL34')!, connection: 'ultralinear', bplus: 330, screenVolts: 300, ulTap: 0.43, zPrimary: 3300, rPrimary: 120,
      bias: 'cathode', rk: 330, ck: 220e-6, vg: -20, speakerOhms: 8, thdLimit: 0.05, coupling: { kind: 'capacitor', cc: 330e-9, rg: 270e3 },
    },
  ],
};

// What the netlist does when run is held against ngspice in tests/spice/amplifierNetlist.spice.test.ts.
describe('amplifierNetlist: what it writes, and what it refuses', () => {
  it('a netlist with the design\u2019s parts, the model\u2019s figures as comments, and ngspice\u2019s control block', () => {
    const r = amplifierNetlist(chain, { title: 'Bench\r\nnotes', inputPeak: 0.1, feedback: { rf: 22e3, cf: 100e-12 } });
    if (!r.ok) throw new Error(r.message);
    const lines = r.text.split('\n');
    expect(lines[0]).toBe('* Bench notes: a netlist for ngspice');
    expect(lines).toContain('RA0 bp0 p0 56000.0000000');
    expect(lines).toContain('VS src 0 DC 0 AC 1 SIN(0 0.100000000000 1000)');
    expect(lines).toContain('CF sec k0 1.00000000000e-10');
    // With feedback, the model's figures are its open loop's (Rf's DC path in the first cathode) and its closed-loop gain.
    expect(r.text).toMatch(/^\* with Rf's DC path in the first cathode, loop open: midband gain -?[\d.]+; closed: [\d.]+ \([\d.]+ dB of feedback\)$/m);
    expect(lines.slice(-9)).toEqual(['.control', 'op', 'print all', 'ac dec 20 1 1meg', 'print vdb(out) vp(out)', 'tran 20u 40m 0 2u', 'fourier 1k v(out)', '.endc', '.end']);
    expect(r.text).not.toMatch(/NaN|Infinity|undefined/);
  });

  it('names the field it cannot write', () => {
    expect(amplifierNetlist(chain, { title: 't', inputPeak: -1 })).toMatchObject({ ok: false, field: 'inputPeak' });
    expect(amplifierNetlist(chain, { title: 't', inputPeak: 0.1, feedback: { rf: 0, cf: null } })).toMatchObject({ ok: false, field: 'feedback.rf' });
    expect(amplifierNetlist({ ...chain, stages: chain.stages.slice(0, 1) }, { title: 't', inputPeak: 0.1, feedback: { rf: 1e4, cf: null } })).toMatchObject({ ok: false, field: 'feedback' });
    expect(amplifierNetlist({ ...chain, stages: [] }, { title: 't', inputPeak: 0.1 })).toMatchObject({ ok: false, field: 'stages' });
    // A bypassed first cathode has no resistor for the feedback to return to: the model's loop refuses it, and so does the netlist.
    const bypassed = { ...chain, stages: [{ ...chain.stages[0]!, bypassed: true, ck: 100e-6 } as ChainInput['stages'][number], chain.stages[1]!] };
    expect(amplifierNetlist(bypassed, { title: 't', inputPeak: 0.1, feedback: { rf: 1e4, cf: null } })).toMatchObject({ ok: false, field: 'feedback' });
  });
});
