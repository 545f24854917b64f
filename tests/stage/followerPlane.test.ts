import { describe, expect, it } from 'vitest';
import { findTube, followerPlane, followerRkFor, plateCurrent, plateExtent, solveFollower } from '../../src/index';
import { expectClose } from '../helpers/expectClose';

// The follower's lines on its plate curves, from Ohm's law round its cathode loop (plate at B+, Vk = Ia·Rk, Vgk = Vgrid − Vk).
describe('a cathode follower on its own plate curves', () => {
  const au7 = findTube('12AU7')!;
  const ax7 = findTube('12AX7')!;
  const design = { tube: au7, bplus: 300, vgrid: 130, rk: 22e3, rl: 100e3 };
  const extent = plateExtent(au7, 300);

  it('the point is where the DC load line (Vpk = B+ − Ia·Rk) crosses the bias line (Vgk = Vgrid − Ia·Rk)', () => {
    const p = followerPlane(design, extent);
    if (!p.ok) throw new Error(p.message);
    const { op } = p.solution;
    const [top, foot] = p.overlay.dcLoad;
    expectClose(foot!.v, 300, { rel: 1e-12 }, 'the DC line meets the voltage axis at B+');
    expectClose(top!.i, 300 / 22e3, { rel: 1e-12 }, 'and the current axis at B+/Rk');
    expectClose(op.vpk, 300 - op.ia * 22e3, { rel: 1e-9 }, 'the point on the DC line');
    // Every bias-line point carries the current its grid voltage (Vgrid − Ia·Rk) gives at its plate voltage.
    for (const b of p.overlay.bias) expectClose(plateCurrent(au7, b.v, 130 - b.i * 22e3), b.i, { rel: 1e-6 }, 'bias line');
    // And it runs through the point: a follower's bias line spans a sliver of current, which sampling must not miss.
    const currents = p.overlay.bias.map((b) => b.i);
    expect(p.overlay.bias.length).toBeGreaterThan(10);
    expect(Math.min(...currents)).toBeLessThanOrEqual(op.ia);
    expect(Math.max(...currents)).toBeGreaterThanOrEqual(op.ia);
    // Through the coupling capacitor the 100k load shares the cathode: the AC line's slope is −1/(Rk ∥ RL).
    const [a, b] = p.overlay.acLoad;
    expectClose((a!.i - b!.i) / (b!.v - a!.v), 1 / 22e3 + 1 / 100e3, { rel: 1e-9 }, 'AC line slope');
  });

  it('the locus is where Rk can put the point: each of its points is a follower solved at some Rk', () => {
    const p = followerPlane(design, extent);
    if (!p.ok) throw new Error(p.message);
    expect(p.locus.length).toBeGreaterThan(10);
    for (const q of p.locus.filter((_, k) => k % 7 === 3)) {
      const rk = (300 - q.v) / q.i;
      const f = solveFollower({ ...design, rk });
      if (!f.ok) throw new Error(f.message);
      expectClose(f.op.ia, q.i, { rel: 1e-6 }, `at Rk ${rk.toFixed(0)} Ω`);
    }
  });

  it('the Rk for a current is the one that draws it (round trip through the solver), for both tubes', () => {
    for (const [tube, vgrid] of [[au7, 130], [ax7, 180]] as const) {
      for (const rk of [4.7e3, 22e3, 100e3, 470e3]) {
        const f = solveFollower({ tube, bplus: 300, vgrid, rk });
        if (!f.ok) continue;
        const back = followerRkFor({ tube, bplus: 300, vgrid }, f.op.ia);
        if (!back.ok) throw new Error(back.message);
        expectClose(back.rk, rk, { rel: 1e-6 }, `${tube.id} Rk ${rk}`);
        expect(back.reason).toBeNull();
      }
    }
  });

  it('more current than the grid allows is held where the grid meets its cathode, and says so', () => {
    const r = followerRkFor({ tube: au7, bplus: 300, vgrid: 130 }, 0.5);
    if (!r.ok) throw new Error(r.message);
    expect(r.reason).toMatch(/grid current/);
    const f = solveFollower({ tube: au7, bplus: 300, vgrid: 130, rk: r.rk });
    expect(f.ok && Math.abs(f.op.vgk)).toBeLessThan(1e-3);
    // Held inside a range asked for.
    const held = followerRkFor({ tube: au7, bplus: 300, vgrid: 130 }, 1e-6, [1e3, 220e3]);
    expect(held.ok && held.rk).toBe(220e3);
    expect(held.ok && held.reason).toMatch(/most/);
  });

  it('a follower its grid cuts off, or a bad current, is a typed failure', () => {
    expect(followerRkFor({ tube: au7, bplus: 100, vgrid: -80 }, 1e-3).ok).toBe(false);
    expect(followerRkFor({ tube: au7, bplus: 300, vgrid: 130 }, Number.NaN).ok).toBe(false);
    expect(followerRkFor({ tube: au7, bplus: 300, vgrid: 130 }, -1).ok).toBe(false);
  });
});
