import { useMemo } from 'react';
import { PALETTE } from '../chart/palette';
import { milliamps, volts } from '../../format';
import { MiniChart } from '../signal/MiniChart';
import type { XYSpec } from '../signal/drawXY';
import { splitterPlaneOf } from '../../store/splitterPlane';
import { useWorkbench } from '../../store/StoreProvider';

const W = 330;
const H = 230;

/** The phase splitter's triode on its plate curves: the DC load line, the bias line and the operating point. */
export function SplitterChart({ tubeId, ltp }: { tubeId: string; ltp: boolean }) {
  const plane = useWorkbench(splitterPlaneOf);
  const spec = useMemo<XYSpec | null>(() => {
    if (!plane) return null;
    const { vmax, iaMax } = plane.sheet.extent;
    const mA = (p: { v: number; i: number }) => ({ x: p.v, y: p.i * 1e3 });
    return {
      width: W,
      height: H,
      x: { domain: [0, vmax], label: 'Vpk (V)' },
      y: { domain: [0, iaMax * 1e3], label: 'Ia (mA)' },
      series: [
        ...plane.sheet.family.map((c) => ({ key: `vg${c.vg}`, points: c.points.filter((p) => p.i <= iaMax * 1.05).map(mA), stroke: PALETTE.ink, width: 1 })),
        { key: 'load', points: plane.load.map(mA), stroke: PALETTE.load, width: 1.8 },
        { key: 'bias', points: plane.bias.map(mA), stroke: PALETTE.bias, width: 1.4, dash: '5 3' },
        ...(plane.second ? [{ key: 'load2', points: plane.second.load.map(mA), stroke: PALETTE.rival, width: 1.4, dash: '8 4' }] : []),
      ],
      markers: [
        // A pair's two points sit close together: their values are in the table above, not on the chart.
        { x: plane.point.v, y: plane.point.i * 1e3, color: PALETTE.point, ...(plane.second ? {} : { label: `${volts(plane.point.v)}, ${milliamps(plane.point.i)}` }) },
        ...(plane.second ? [{ x: plane.second.point.v, y: plane.second.point.i * 1e3, color: PALETTE.rival }] : []),
      ],
    };
  }, [plane]);
  if (!spec) return null;
  return (
    <MiniChart
      title={`${tubeId} ${ltp ? 'long-tailed pair: each triode\'s DC load line (the second green, long-dashed), the bias line (dashed), both points (the second green)' : 'split-load: DC load line (solid), bias line (dashed), operating point'}`}
      spec={spec}
      description={`Plate curves of the phase splitter's ${tubeId} with its DC load line, bias line and operating point`}
    />
  );
}
