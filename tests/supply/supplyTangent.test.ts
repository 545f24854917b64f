import { describe, expect, it } from 'vitest';
import { solveOnSupply, solveSupply, supplyNear, supplyTangent, type ChainInput } from '../../src/index';
import { amplifier, supply } from '../helpers/smallAmplifierOnSupply';
import { expectClose } from '../helpers/expectClose';

// The reference here is the transient solve the tangent stands in for during a drag; that solve is itself held to
// ngspice's transient analysis in tests/spice (node DC within 1 %, ripple and rectifier peak within 10 %).

// Our own amplifier: a 12AU7 stage, its follower, an EL34 ultralinear output stage, on a C–R–C–R–C supply.
const feeds = [2, 1, 0];
const withOutputRk = (rk: number): ChainInput => ({ ...amplifier, stages: amplifier.stages.map((st, i) => (i === 2 ? { ...st, rk } : st)) as ChainInput['stages'] });

describe('the supply along its tangent, as a drag solves it', () => {
  const settled = solveOnSupply({ amplifier, supply, feeds, keepTangent: true });
  if (!settled.ok || !settled.tangent) throw new Error('the settled solve answers its tangent');
  const tangent = settled.tangent;
  const start = settled.supply.nodes.map((n) => n.dc);

  it('the settled solve is a transient one, and answers the tangent at its own loads', () => {
    expect(settled.supplyBy).toBe('transient');
    expect(tangent.loads).toEqual(settled.loads);
    // More current anywhere sags the reservoir: every slope of node 1's DC is negative.
    const dcOfNode1 = 5; // after the five supply-wide figures
    tangent.slopes.forEach((s) => expect(s[dcOfNode1]!).toBeLessThan(0));
  });

  it('the output stage drawing 8 mA more (its Rk 330 → 270 Ω): every node within 0.1 V of the transient solve, ripple and rectifier peak within 1 %', () => {
    const moved = withOutputRk(270);
    const full = solveOnSupply({ amplifier: moved, supply, feeds, start });
    const near = solveOnSupply({ amplifier: moved, supply, feeds, start, around: tangent });
    if (!full.ok || !near.ok) throw new Error('both solve');
    expect(near.supplyBy).toBe('tangent');
    expect(full.supplyBy).toBe('transient');
    expect(near.loads[0]! - settled.loads[0]!).toBeGreaterThan(0.006);
    near.supply.nodes.forEach((n, k) => {
      expectClose(n.dc, full.supply.nodes[k]!.dc, { abs: 0.1 }, `node ${k + 1} DC`);
      expectClose(n.ripplePp, full.supply.nodes[k]!.ripplePp, { rel: 0.01 }, `node ${k + 1} ripple`);
    });
    expectClose(near.supply.rectifierPeak, full.supply.rectifierPeak, { rel: 0.01 }, 'rectifier peak');
    near.bplus.forEach((b, i) => expectClose(b, full.bplus[i]!, { abs: 0.1 }, `stage ${i + 1} B+`));
    expectClose(near.amplifier.stages[2]!.op.ia, full.amplifier.stages[2]!.op.ia, { rel: 0.002 }, 'output stage current');
    // And it is the line that is right, not the old solution: the reservoir really moved.
    expect(settled.supply.nodes[0]!.dc - near.supply.nodes[0]!.dc).toBeGreaterThan(0.5);
  });

  it('nothing changed: the first round agrees with the start and the solve ends there', () => {
    const again = solveOnSupply({ amplifier, supply, feeds, start, around: tangent });
    expect(again.ok && again.iterations).toBe(1);
  });

  it('loads far from the tangent are solved in full, not stretched along it', () => {
    const far = withOutputRk(120);
    const r = solveOnSupply({ amplifier: far, supply, feeds, start, around: tangent });
    expect(r.ok && r.supplyBy).toBe('transient');
    const refused = supplyNear({ ...supply, loads: settled.loads }, tangent, settled.loads.map((a, k) => (k === 0 ? a + 0.1 : a)));
    expect(refused.ok).toBe(false);
    if (!refused.ok) expect(refused.message).toMatch(/solve it in full/);
  });

  it('a tangent taken from a supply with the wrong number of loads is a typed failure', () => {
    const bare = solveSupply({ ...supply, loads: [0.05, 0.005, 0.002] });
    if (!bare.ok) throw new Error(bare.message);
    const r = supplyTangent({ ...supply, loads: [0.05] }, bare);
    expect(r.ok).toBe(false);
  });
});
