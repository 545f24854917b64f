import { useMemo } from 'react';
import type { LoopSquareWave } from '../../../src/index';
import { PALETTE } from '../chart/palette';
import { MiniChart } from '../signal/MiniChart';
import type { XYSpec } from '../signal/drawXY';

const W = 360;
const H = 150;

/** One square wave's chart: a period from the rising edge, open loop dashed, closed loop solid, each against its midband. */
function specOf(w: LoopSquareWave): XYSpec {
  const inMs = w.hz < 1000;
  const unit = inMs ? 1e3 : 1e6;
  const ys = [...w.open, ...w.closed];
  const top = Math.max(1.2, ...ys.map(Math.abs));
  return {
    width: W,
    height: H,
    x: { domain: [0, w.t[w.t.length - 1]! * unit], label: inMs ? 'Time (ms)' : 'Time (µs)', ticks: 5 },
    y: { domain: [-top, top], label: 'Output / midband', ticks: 4 },
    series: [
      { key: 'open', points: w.t.map((t, j) => ({ x: t * unit, y: w.open[j]! })), stroke: PALETTE.inkSoft, dash: '4 3', width: 1.2 },
      { key: 'closed', points: w.t.map((t, j) => ({ x: t * unit, y: w.closed[j]! })), stroke: PALETTE.load, width: 1.8 },
    ],
  };
}

/**
 * What a scope at the speaker would show for a square wave in, with the
 * loop closed (solid) and open (dashed): 100 Hz shows the low end's tilt,
 * 10 kHz the high end's rise and ringing. From the model's closed-loop
 * response (feedbackBand); drawn only for a loop with a steady state.
 */
export function LoopSquareWaves({ waves }: { waves: readonly LoopSquareWave[] }) {
  const specs = useMemo(() => waves.map(specOf), [waves]);
  if (waves.length === 0) return null;
  return (
    <div className="loop-square-waves" data-testid="loop-square-waves">
      {waves.map((w, i) => (
        <MiniChart
          key={w.hz}
          title={`${w.hz >= 1000 ? `${w.hz / 1000} kHz` : `${w.hz} Hz`} square wave at the speaker: closed loop solid, open loop dashed`}
          spec={specs[i]!}
          description={`One period of a ${w.hz} Hz square wave through the amplifier, closed loop and open loop, each against its midband gain`}
        />
      ))}
    </div>
  );
}
