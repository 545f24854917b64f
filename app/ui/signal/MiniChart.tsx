import { useEffect, useRef } from 'react';
import { drawXY, type XYSpec } from './drawXY';

/** React shell for one small chart: owns the <svg>, redraws when the spec changes. */
export function MiniChart({ title, spec, description }: { title: string; spec: XYSpec; description: string }) {
  const layer = useRef<SVGGElement>(null);
  useEffect(() => {
    if (layer.current) drawXY(layer.current, spec);
  }, [spec]);
  return (
    <figure className="mini-chart">
      <figcaption>{title}</figcaption>
      <svg viewBox={`0 0 ${spec.width} ${spec.height}`} role="img" aria-label={description}>
        <g ref={layer} />
      </svg>
    </figure>
  );
}
