import { PALETTE } from '../chart/palette';
import { REGION_HATCH_ID } from './drawRegion';

/** The target region's hatch (diagonal lines over a faint tint), defined once per chart that draws a region. */
export function RegionHatch() {
  return (
    <defs>
      <pattern id={REGION_HATCH_ID} patternUnits="userSpaceOnUse" width={7} height={7} patternTransform="rotate(45)">
        <rect width={7} height={7} fill={PALETTE.rival} fillOpacity={0.1} />
        <line x1={0} y1={0} x2={0} y2={7} stroke={PALETTE.rival} strokeWidth={2} strokeOpacity={0.55} />
      </pattern>
    </defs>
  );
}
