import { useMemo } from 'react';
import { useShallow } from 'zustand/react/shallow';
import { PALETTE } from '../chart/palette';
import { useWorkbench } from '../../store/StoreProvider';
import { MiniChart } from './MiniChart';
import type { XYSpec } from './drawXY';

const W = 330;
const H = 210;

/**
 * The signal views: the transfer curve with the chosen level's span, the
 * harmonic spectrum, THD against output level, and the Bode plot. Each reads
 * the model's results from the store; none computes anything itself.
 */
export function SignalCharts() {
  // Field by field: during a drag only the swing path changes, which these views do not show.
  const signal = useWorkbench(
    useShallow(({ analysis: { signal: g } }) => ({ transfer: g.transfer, distortion: g.distortion, swing: g.swing, thdByLevel: g.thdByLevel, response: g.response, corners: g.corners })),
  );
  const level = useWorkbench((s) => s.design.levelRms);

  const transfer = useMemo<XYSpec>(() => {
    const pts = signal.transfer.map((t) => ({ x: t.vin, y: t.vout }));
    const ys = pts.map((p) => p.y);
    const span = Math.max(...pts.map((p) => Math.abs(p.x)));
    const d = signal.distortion;
    const peak = d.ok ? d.inputPeak : signal.swing.inputPeak;
    const lit = signal.transfer.filter((t) => Math.abs(t.vin) <= peak).map((t) => ({ x: t.vin, y: t.vout }));
    return {
      width: W,
      height: H,
      x: { domain: [-span, span], label: 'Grid swing (V)' },
      y: { domain: [Math.min(...ys), Math.max(...ys)], label: 'Output (V)' },
      series: [
        { key: 'transfer', points: pts, stroke: PALETTE.ink, width: 1.4 },
        { key: 'in-use', points: lit, stroke: PALETTE.point, width: 4 },
      ],
    };
  }, [signal.transfer, signal.distortion, signal.swing.inputPeak]);

  const spectrum = useMemo<XYSpec>(() => {
    const h = signal.distortion.ok ? signal.distortion.harmonicsDb : [];
    return {
      width: W,
      height: H,
      x: { domain: [1.4, 9.6], label: 'Harmonic', ticks: 8, format: (v) => (Number.isInteger(v) ? `H${v}` : '') },
      y: { domain: [-120, 0], label: 'dB below fundamental' },
      bars: h.map((db, k) => ({ x: k + 2, y: Math.max(db, -120), label: `H${k + 2}` })),
    };
  }, [signal.distortion]);

  const thd = useMemo<XYSpec>(() => {
    const pts = signal.thdByLevel.map((p) => ({ x: p.outputRms, y: p.thdPercent }));
    // The curve past the clean swing drawn dashed, from the last clean point on.
    const firstPast = signal.thdByLevel.findIndex((p) => p.pastClean);
    const clean = firstPast < 0 ? pts : pts.slice(0, firstPast);
    const past = firstPast < 0 ? [] : pts.slice(Math.max(0, firstPast - 1));
    const xs = pts.map((p) => p.x);
    const ys = pts.map((p) => p.y).filter((v) => v > 0);
    const d = signal.distortion;
    const edge = signal.swing.output.rms;
    const edgeThd = clean.length > 0 ? clean[clean.length - 1]!.y : ys[0] ?? 1;
    return {
      width: W,
      height: H,
      x: { domain: [Math.min(...xs), Math.max(...xs)], log: true, label: 'Output level (V rms)' },
      y: { domain: [Math.max(Math.min(...ys), 1e-4), Math.max(...ys) * 1.2], log: true, label: 'THD (%)' },
      series: [
        { key: 'thd', points: clean, stroke: PALETTE.load },
        { key: 'thd-past', points: past, stroke: PALETTE.load, dash: '4 3' },
      ],
      markers: [
        ...(edge > 0 ? [{ x: edge, y: edgeThd, color: PALETTE.bias, label: signal.swing.limitedBy === 'grid-current' ? 'grid current' : 'cutoff', below: true }] : []),
        ...(d.ok ? [{ x: level, y: d.thdPercent, color: PALETTE.point, label: `${d.thdPercent.toFixed(2)} %` }] : []),
      ],
    };
  }, [signal.thdByLevel, signal.distortion, signal.swing, level]);

  const bode = useMemo<XYSpec>(() => {
    const pts = signal.response.map((p) => ({ x: p.freqHz, y: p.magnitudeDb }));
    const top = Math.max(...pts.map((p) => p.y));
    const { lowHz, highHz, midbandDb } = signal.corners;
    const markers = [lowHz, highHz].filter((f): f is number => f !== null && f >= 1 && f <= 1e6).map((f) => ({ x: f, y: midbandDb - 3, color: PALETTE.bias, label: `${f < 1000 ? f.toPrecision(3) : `${(f / 1000).toPrecision(3)}k`} Hz`, below: true }));
    return {
      width: W,
      height: H,
      x: { domain: [1, 1e6], log: true, label: 'Frequency (Hz)' },
      y: { domain: [top - 30, top + 3], label: 'Gain (dB)' },
      series: [{ key: 'magnitude', points: pts, stroke: PALETTE.load }],
      markers,
    };
  }, [signal.response, signal.corners]);

  const phase = useMemo<XYSpec>(() => {
    const pts = unwrapPhase(signal.response.map((p) => ({ x: p.freqHz, y: p.phaseDeg })));
    const ys = pts.map((p) => p.y);
    const lo = Math.floor(Math.min(...ys) / 45) * 45;
    const hi = Math.ceil(Math.max(...ys) / 45) * 45;
    return {
      width: W,
      height: 150,
      x: { domain: [1, 1e6], log: true, label: 'Frequency (Hz)' },
      y: { domain: [lo, Math.max(hi, lo + 90)], label: 'Phase (°)', ticks: 4 },
      series: [{ key: 'phase', points: pts, stroke: PALETTE.bias }],
    };
  }, [signal.response]);

  return (
    <section className="panel signal-charts" aria-label="Signal views">
      <MiniChart title="Transfer curve (orange: the span in use)" spec={transfer} description="Output voltage against grid swing, from the model's large-signal solution" />
      <MiniChart title="Harmonics at the chosen level" spec={spectrum} description="Harmonics H2 to H9 in dB below the fundamental" />
      <MiniChart title="THD against output level (dashed: past the clean swing)" spec={thd} description="Total harmonic distortion against output level, across the clean limit (marked) and past it (dashed)" />
      <MiniChart title="Response, source to output (−3 dB points marked)" spec={bode} description="Gain in dB against frequency from 1 Hz to 1 MHz" />
      <MiniChart title="Phase, source to output" spec={phase} description="Phase in degrees against frequency" />
    </section>
  );
}

/** Display only: removes the ±360° jumps of a wrapped phase so an inverting stage reads as one continuous curve. */
function unwrapPhase(points: { x: number; y: number }[]): { x: number; y: number }[] {
  let offset = 0;
  return points.map((p, k) => {
    if (k > 0) {
      const step = p.y + offset - (points[k - 1]!.y + offset);
      if (step > 180) offset -= 360;
      else if (step < -180) offset += 360;
    }
    return { x: p.x, y: p.y + offset };
  });
}
