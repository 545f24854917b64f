import { describe, expect, it } from 'vitest';
import { analyzeOutput, findOutputTube, humOnSupply, outputPartsList, solveOnSupply, solveOnSupplyInRounds, solveSupply, supplyHum, type ChainInput } from '../../src/index';
import { solveOutput } from '../../src/output/solveOutput';
import { averageCurrents, cleanLimit, SWEEP_SAMPLES } from '../../src/output/outputSignal';
import { designOf } from '../../src/chain/singleEndedKind';
import type { SingleEndedLink } from '../../src/chain/chainTypes';
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

  it('a bleeder across the reservoir draws its voltage over its resistance (Ohm\'s law): the same supply as that current drawn there, every node lower', () => {
    const bled = solveOnSupply({ amplifier, supply, feeds: [2, 1, 0], bleederOhms: 22e3 });
    const none = solveOnSupply({ amplifier, supply, feeds: [2, 1, 0] });
    if (!bled.ok || !none.ok) throw new Error('both solve');
    const v0 = bled.supply.nodes[0]!.dc;
    expectClose(bled.bleederAmps, v0 / 22e3, { abs: 0.01 / 22e3 }, 'the bleeder at the reservoir\'s voltage, to the rounds\' 10 mV');
    expect(none.bleederAmps).toBe(0);
    // Its current is node 1's load with the output stage's, and the supply is the one that current drawn there gives.
    expectClose(bled.loads[0]!, bled.amplifier.stages[2]!.supplyCurrent + bled.bleederAmps, { rel: 1e-9 }, 'node 1 carries the bleeder');
    const asLoad = solveOnSupply({ amplifier, supply: { ...supply, loads: [bled.bleederAmps, 0, 0] }, feeds: [2, 1, 0] });
    if (!asLoad.ok) throw new Error(asLoad.message);
    asLoad.supply.nodes.forEach((n, k) => expectClose(bled.supply.nodes[k]!.dc, n.dc, { abs: 0.02 }, `node ${k + 1}`));
    bled.supply.nodes.forEach((n, k) => expect(n.dc).toBeLessThan(none.supply.nodes[k]!.dc - 0.5));
    expect(bled.supply.nodes[0]!.ripplePp).toBeGreaterThan(none.supply.nodes[0]!.ripplePp);
    // Whatever bleederFor sizes is taken (1 Ω to 10 MΩ: a supply of tens of millifarads asks a few hundred ohms); nothing else.
    for (const bad of [0, 0.5, Number.NaN, 1e8]) expect(solveOnSupply({ amplifier, supply, feeds: [2, 1, 0], bleederOhms: bad })).toMatchObject({ ok: false, field: 'bleederOhms' });
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

describe('a pentode output stage\'s screens on a node of their own', () => {
  // The small amplifier's EL34 pentode-connected, its plates on the reservoir and its screens fed straight from node 2
  // (after the 1k section), the input stage on node 3 and the follower on node 2 as well.
  const pentode: ChainInput = { ...amplifier, stages: amplifier.stages.map((s) => (s.kind === 'single-ended-output' ? { ...s, connection: 'pentode' as const } : s)) };
  const onNode2 = () => {
    const r = solveOnSupply({ amplifier: pentode, supply, feeds: [2, 1, 0], screenFeeds: [null, null, 1] });
    if (!r.ok) throw new Error(r.message);
    return r;
  };

  it('the screens sit at their node and draw their current there; the plates\' node carries the rest (Kirchhoff\'s current law, Ohm\'s law through each section)', () => {
    const r = onNode2();
    const [n0, n1, n2] = r.supply.nodes.map((n) => n.dc);
    expectClose(r.screenVolts[2]!, n1!, { abs: 0.01 }, 'screens at node 2');
    expect(r.screenVolts.slice(0, 2)).toEqual([null, null]);
    expectClose(r.bplus[2]!, n0!, { abs: 0.01 }, 'plates on the reservoir');
    // The output stage alone, at the B+ and screen voltage it was solved at: its screen current is node 2's share.
    const stage = { ...(pentode.stages[2] as SingleEndedLink), bplus: r.bplus[2]!, screenVolts: r.screenVolts[2]! };
    const alone = solveOutput(stage.tube, designOf(stage));
    if (!alone.ok) throw new Error(alone.message);
    const [input, follower, out] = r.amplifier.stages;
    expectClose(r.loads[0]!, out!.supplyCurrent - alone.op.ig2, { rel: 1e-3 }, 'the reservoir carries the cathode current less the screens\'');
    expectClose(r.loads[1]!, follower!.supplyCurrent + alone.op.ig2, { rel: 1e-3 }, 'node 2 carries the follower and the screens');
    expectClose(n0! - n1!, (input!.supplyCurrent + follower!.supplyCurrent + alone.op.ig2) * 1e3, { rel: 0.002 }, '1k section');
    expectClose(n1! - n2!, input!.supplyCurrent * 10e3, { rel: 0.002 }, '10k section');
    // Every current drawn is drawn once: the nodes' loads add to the stages' currents.
    expectClose(r.loads.reduce((a, b) => a + b, 0), input!.supplyCurrent + follower!.supplyCurrent + out!.supplyCurrent, { rel: 1e-9 }, 'total');
  });

  it('at full power the screens\' node carries their average driven to the clean limit, which rises over their idle', () => {
    const r = onNode2();
    const stage = { ...(pentode.stages[2] as SingleEndedLink), bplus: r.bplus[2]!, screenVolts: r.screenVolts[2]! };
    const alone = solveOutput(stage.tube, designOf(stage));
    if (!alone.ok) throw new Error(alone.message);
    // The same cycle solved again by the dropper's own figure (checked against ngspice in tests/spice/screenCurrent.spice.test.ts).
    const driven = averageCurrents(alone, cleanLimit(alone, stage.zPrimary, SWEEP_SAMPLES).at.drive);
    const [, follower, out] = r.amplifier.stages;
    const full = r.atFullPower!;
    expectClose(full.loads[1]! - follower!.supplyCurrent, driven.ig2, { rel: 1e-3 }, 'the screens at full power');
    expect(driven.ig2).toBeGreaterThan(1.5 * alone.op.ig2);
    expectClose(out!.fullPowerCurrent!, driven.ik, { rel: 1e-3 }, 'the cathode\'s average at full power');
    expectClose(full.loads[0]!, driven.ik - driven.ig2, { rel: 1e-3 }, 'the plates\' node at full power');
  });

  it('the stage\'s parts and findings take the screens as fed from their node: no dropper from B+, no note asking for a node', () => {
    const r = onNode2();
    const stage = pentode.stages[2] as SingleEndedLink;
    const design = { ...designOf({ ...stage, bplus: r.bplus[2]!, screenVolts: r.screenVolts[2]! }), tubeId: 'EL34', rg: 220e3 };
    // Below B+, the screens would otherwise be fed through a dropper.
    const tube = findOutputTube('EL34')!;
    const dropped = analyzeOutput(tube, design);
    const fed = analyzeOutput(tube, { ...design, screenFromNode: true });
    if (!dropped.ok || !fed.ok) throw new Error('both analyse');
    const resistors = (a: typeof fed) => outputPartsList(a, 'E24').resistors.map((l) => l.ref);
    expect(resistors(dropped)).toContain('Rs');
    expect(resistors(fed)).not.toContain('Rs');
    // Above B+ with no node named, the stage asks for one; with its node named, it does not.
    const above = { ...design, screenVolts: design.bplus + 20 };
    const asks = (a: ReturnType<typeof analyzeOutput>) => a.ok && a.findings.some((f) => f.kind === 'screen-supply');
    expect(asks(analyzeOutput(tube, above))).toBe(true);
    expect(asks(analyzeOutput(tube, { ...above, screenFromNode: true }))).toBe(false);
  });

  it('the screens\' hum comes from their own node: all of its ripple reaches them, and the plates\' from theirs', () => {
    const input = { amplifier: pentode, supply, feeds: [2, 1, 0], screenFeeds: [null, null, 1] };
    const r = solveOnSupply(input);
    if (!r.ok) throw new Error(r.message);
    // The stages as the supply placed them, by hand: the output stage at the reservoir's B+ and its screens at node 2.
    const atNodes = { ...pentode, stages: pentode.stages.map((s, k) => (k === 2 ? { ...s, bplus: r.bplus[k]!, screenVolts: r.screenVolts[k]!, screenFromNode: true } : { ...s, bplus: r.bplus[k]! })) } as ChainInput;
    const perVolt = supplyHum(atNodes, r.amplifier, 50);
    if (!perVolt.ok) throw new Error(perVolt.message);
    expect(perVolt.screenShare[2]).toBe(1);
    const hum = humOnSupply(input, r);
    if (!hum.ok) throw new Error(hum.message);
    const [reservoir, node2] = r.supply.nodes.map((n) => n.rippleRms);
    expectClose(hum.screens[2]!, Math.abs(perVolt.screenPerVolt[2]!) * node2!, { rel: 1e-12 }, 'the screens\' share, on node 2\'s ripple');
    expectClose(hum.volts[2]!, Math.abs(perVolt.perVolt[2]!) * reservoir! + hum.screens[2]!, { rel: 1e-12 }, 'the stage\'s share, its plates on the reservoir\'s');
  });

  it('refuses a screen node for a stage without screens of its own, or a node the supply does not have', () => {
    expect(solveOnSupply({ amplifier: pentode, supply, feeds: [2, 1, 0], screenFeeds: [1, null, null] })).toMatchObject({ ok: false, field: 'screenFeeds', message: expect.stringMatching(/^Stage 1 has no screens of its own/) });
    // The ultralinear stage's screens are on the primary's taps.
    expect(solveOnSupply({ amplifier, supply, feeds: [2, 1, 0], screenFeeds: [null, null, 1] })).toMatchObject({ ok: false, field: 'screenFeeds' });
    expect(solveOnSupply({ amplifier: pentode, supply, feeds: [2, 1, 0], screenFeeds: [null, null, 3] })).toMatchObject({ ok: false, field: 'screenFeeds' });
    expect(solveOnSupply({ amplifier: pentode, supply, feeds: [2, 1, 0], screenFeeds: [null, 1] })).toMatchObject({ ok: false, field: 'screenFeeds' });
  });
});
