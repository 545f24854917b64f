import { describe, expect, it } from 'vitest';
import { solveOnSupply, solveOnSupplyInRounds, solveSupply, type ChainInput } from '../../src/index';
import { amplifier, supply } from '../helpers/smallAmplifierOnSupply';
import { expectClose } from '../helpers/expectClose';

// Our own small amplifier on its own supply (tests/helpers/smallAmplifierOnSupply.ts).

describe('the amplifier on its supply, solved as one', () => {
  it('every stage runs at the voltage its node delivers under the whole amplifier\'s current (Ohm\'s law through each section)', () => {
    const r = solveOnSupply({ amplifier, supply, feeds: [2, 1, 0] });
    if (!r.ok) throw new Error(r.message);
    const [n0, n1, n2] = r.supply.nodes.map((n) => n.dc);
    expectClose(r.bplus[2]!, n0!, { abs: 0.01 }, 'output stage on the reservoir');
    expectClose(r.bplus[1]!, n1!, { abs: 0.01 }, 'follower on node 2');
    expectClose(r.bplus[0]!, n2!, { abs: 0.01 }, 'input stage on node 3');
    const [input, follower] = r.amplifier.stages;
    // Each section drops its downstream current through its resistor.
    expectClose(n1! - n2!, input!.supplyCurrent * 10e3, { rel: 0.002 }, '10k section');
    expectClose(n0! - n1!, (input!.supplyCurrent + follower!.supplyCurrent) * 1e3, { rel: 0.002 }, '1k section');
    expect(r.iterations).toBeGreaterThan(1);
  });

  it('started from a nearby steady state (as while a stage is dragged), a small change settles to the same solution in fewer rounds', () => {
    const before = solveOnSupply({ amplifier, supply, feeds: [2, 1, 0] });
    if (!before.ok) throw new Error(before.message);
    // The input stage's plate resistor moved a little, as one drag frame moves it.
    const moved = { ...amplifier, stages: amplifier.stages.map((st, i) => (i === 0 ? { ...st, ra: 27.5e3 } : st)) as ChainInput['stages'] };
    const cold = solveOnSupply({ amplifier: moved, supply, feeds: [2, 1, 0] });
    const warm = solveOnSupply({ amplifier: moved, supply, feeds: [2, 1, 0], start: before.supply.nodes.map((n) => n.dc) });
    if (!cold.ok || !warm.ok) throw new Error('both solve');
    warm.supply.nodes.forEach((n, k) => expectClose(n.dc, cold.supply.nodes[k]!.dc, { abs: 0.02 }, `node ${k + 1}`));
    expect(warm.iterations).toBeLessThan(cold.iterations);
    // A start that does not fit the supply (wrong length, not a voltage) is ignored, not trusted.
    const ignored = solveOnSupply({ amplifier: moved, supply, feeds: [2, 1, 0], start: [300, Number.NaN] });
    expect(ignored.ok && ignored.iterations).toBe(cold.iterations);
  });

  it('more current from the reservoir sags every node, and the input stage with them', () => {
    const light = solveOnSupply({ amplifier, supply, feeds: [2, 1, 0] });
    const loaded = solveOnSupply({ amplifier, supply: { ...supply, loads: [0.03, 0, 0] }, feeds: [2, 1, 0] });
    if (!light.ok || !loaded.ok) throw new Error('both solve');
    expect(loaded.bplus[2]!).toBeLessThan(light.bplus[2]! - 2);
    expect(loaded.amplifier.stages[0]!.op.ia).toBeLessThan(light.amplifier.stages[0]!.op.ia);
  });

  it('two channels on one supply: every section carries both channels\' current (Ohm\'s law), so every node sags further', () => {
    const stereo = solveOnSupply({ amplifier, supply, feeds: [2, 1, 0], channels: 2 });
    const mono = solveOnSupply({ amplifier, supply, feeds: [2, 1, 0] });
    if (!stereo.ok || !mono.ok) throw new Error('both solve');
    const [n0, n1, n2] = stereo.supply.nodes.map((n) => n.dc);
    const [input, follower] = stereo.amplifier.stages;
    expectClose(n1! - n2!, 2 * input!.supplyCurrent * 10e3, { rel: 0.002 }, '10k section, two channels');
    expectClose(n0! - n1!, 2 * (input!.supplyCurrent + follower!.supplyCurrent) * 1e3, { rel: 0.002 }, '1k section, two channels');
    expect(stereo.bplus[2]!).toBeLessThan(mono.bplus[2]! - 2);
    expectClose(stereo.loads[2]!, 2 * input!.supplyCurrent, { rel: 1e-12 }, 'node 3 carries both input stages');
    expect(solveOnSupply({ amplifier, supply, feeds: [2, 1, 0], channels: 1.5 })).toMatchObject({ ok: false, field: 'channels' });
  });

  it('at full power the output stage\'s average current moves, and every node sags by the reservoir\'s change (the sections\' currents are the same)', () => {
    const r = solveOnSupply({ amplifier, supply, feeds: [2, 1, 0] });
    if (!r.ok) throw new Error(r.message);
    const out = r.amplifier.stages[2]!;
    expect(out.fullPowerCurrent).toBeDefined();
    expect(Math.abs(out.fullPowerCurrent! - out.supplyCurrent)).toBeGreaterThan(1e-5);
    const full = r.atFullPower!;
    expectClose(full.loads[0]!, r.loads[0]! + out.fullPowerCurrent! - out.supplyCurrent, { rel: 1e-12 }, 'the reservoir\'s load');
    expect(full.loads.slice(1)).toEqual(r.loads.slice(1));
    const idle = r.supply.nodes.map((n) => n.dc);
    const sag = full.volts[0]! - idle[0]!;
    // Ohm's law through each section: the drops are unchanged, so each node moves as the reservoir does.
    for (const k of [1, 2]) expectClose(full.volts[k]! - idle[k]!, sag, { abs: 0.01 }, `node ${k + 1}`);
    // The same supply solved directly with those loads.
    const direct = solveSupply({ ...supply, loads: full.loads });
    if (!direct.ok) throw new Error(direct.message);
    expectClose(full.volts[0]!, direct.nodes[0]!.dc, { abs: 0.01 }, 'reservoir at full power');
  });

  it('in rounds, pausing after each, it reaches the same solution (a page runs it between frames)', () => {
    const whole = solveOnSupply({ amplifier, supply, feeds: [2, 1, 0] });
    if (!whole.ok) throw new Error(whole.message);
    const rounds = solveOnSupplyInRounds({ amplifier, supply, feeds: [2, 1, 0] });
    let pauses = 0;
    let r = rounds.next();
    while (!r.done) {
      pauses++;
      r = rounds.next();
    }
    expect(pauses).toBe(whole.iterations);
    expect(r.value).toEqual(whole);
  });

  it('a supply too weak for the stages says which node gives out and what to change', () => {
    const weak = solveOnSupply({ amplifier, supply: { ...supply, secondaryRms: 10 }, feeds: [2, 1, 0] });
    expect(weak).toMatchObject({ ok: false, reason: 'supply-too-low', field: 'secondaryRms', message: expect.stringMatching(/^The supply cannot deliver the stages' current: node \d falls to /) });
    // A low but able supply still solves, its stages at what it gives.
    const low = solveOnSupply({ amplifier, supply: { ...supply, secondaryRms: 60 }, feeds: [2, 1, 0] });
    if (!low.ok) throw new Error(low.message);
    expect(low.bplus[2]!).toBeLessThan(85);
  });

  it('names a stage without a node', () => {
    expect(solveOnSupply({ amplifier, supply, feeds: [2, 1] })).toMatchObject({ ok: false, field: 'feeds' });
    // Found by a fresh robustness seed: no supply at all threw.
    expect(solveOnSupply({ amplifier, supply: null as never, feeds: [0, 0, 0] })).toMatchObject({ ok: false, field: 'supply' });
    expect(solveOnSupply({ amplifier, supply, feeds: [2, 1, 3] })).toMatchObject({ ok: false, field: 'feeds' });
  });
});
