import { useMemo } from 'react';
import { PALETTE } from '../chart/palette';
import { MiniChart } from '../signal/MiniChart';
import type { XYSpec } from '../signal/drawXY';
import { useWorkbench } from '../../store/StoreProvider';

const W = 330;
const H = 170;
/** Mains cycles drawn: two, so a pulse and the sag between pulses both read whole. */
const CYCLES = 2;

/**
 * The rectifier's current pulses and the reservoir's voltage over two mains
 * cycles at the steady state: the model gives one rectified period (half a
 * cycle, or a whole one behind a half-wave rectifier); it repeats, so it is
 * drawn end to end as many times as two cycles hold.
 */
export function SupplyWaves() {
  const wave = useWorkbench((s) => (s.supplyView?.result.ok ? s.supplyView.result.supply.wave : null));
  const mainsHz = useWorkbench((s) => s.design.supply.mainsHz);
  const charts = useMemo(() => {
    if (!wave || wave.t.length === 0) return null;
    const period = wave.t.at(-1)!;
    const repeats = Math.max(1, Math.round(CYCLES / (period * mainsHz)));
    const along = (ys: readonly number[], scale: number) => {
      const pts = [{ x: 0, y: ys.at(-1)! * scale }];
      for (let r = 0; r < repeats; r++) wave.t.forEach((t, k) => pts.push({ x: (r * period + t) * 1e3, y: ys[k]! * scale }));
      return pts;
    };
    const current = along(wave.rectifierAmps, 1e3);
    const volts = along(wave.reservoirVolts, 1);
    const vs = volts.map((p) => p.y);
    const lo = Math.min(...vs);
    const hi = Math.max(...vs);
    const pad = Math.max((hi - lo) * 0.15, 0.05);
    const x = { domain: [0, repeats * period * 1e3] as const, label: 'Time (ms)' };
    const i: XYSpec = { width: W, height: H, x, y: { domain: [0, Math.max(...current.map((p) => p.y)) * 1.1 || 1], label: 'Rectifier (mA)' }, series: [{ key: 'i', points: current, stroke: PALETTE.limit }] };
    const v: XYSpec = { width: W, height: H, x, y: { domain: [lo - pad, hi + pad], label: 'Node 1 (V)' }, series: [{ key: 'v', points: volts, stroke: PALETTE.load }] };
    return { i, v };
  }, [wave, mainsHz]);
  if (!charts) return null;
  return (
    <div className="supply-waves">
      <MiniChart title="Rectifier current, two mains cycles" spec={charts.i} description="The rectifier's current pulses into the reservoir over two mains cycles" />
      <MiniChart title="Reservoir voltage (node 1)" spec={charts.v} description="The reservoir capacitor's voltage over the same two mains cycles: charged by each pulse, sagging between" />
    </div>
  );
}
