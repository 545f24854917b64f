import { LIMIT_STROKES, PALETTE } from './palette';
import { REGION_HATCH_ID } from '../targets/drawRegion';
import { TARGET_DASH } from '../targets/targetStrokes';
import { TARGET_LABELS, type TargetName } from '../../../src/index';

export interface LegendItem {
  readonly label: string;
  readonly stroke: string;
  readonly dash: string | undefined;
  readonly width: number;
}

/** Key to the chart's lines: colour and line style together, so it reads in grayscale too. */
export const VOLTAGE_STAGE_LEGEND: readonly LegendItem[] = [
  { label: 'Plate curves (grid voltage marked)', stroke: PALETTE.ink, dash: undefined, width: 1.4 },
  { label: 'DC load line', stroke: PALETTE.load, dash: undefined, width: 2 },
  { label: 'AC load line (with RL)', stroke: PALETTE.load, dash: '9 5', width: 1.6 },
  { label: 'Cathode bias line', stroke: PALETTE.bias, dash: '2 3', width: 1.8 },
  { label: 'Rated plate dissipation', stroke: PALETTE.limit, dash: LIMIT_STROKES.dissipation.dash, width: LIMIT_STROKES.dissipation.width },
  { label: 'Maximum plate voltage', stroke: PALETTE.limit, dash: LIMIT_STROKES.maxPlateVoltage.dash, width: LIMIT_STROKES.maxPlateVoltage.width },
  { label: 'Span of the signal at the chosen level', stroke: PALETTE.pointWash, dash: undefined, width: 8 },
];

/** The voltage stage's key, with the grid-leak limit's curve when its grid returns through a leak (vg below 0 V). */
export function voltageStageLegend(gridLimit: number | null): readonly LegendItem[] {
  if (gridLimit === null || !(gridLimit < 0)) return VOLTAGE_STAGE_LEGEND;
  const limit = { label: `Grid-leak limit (${gridLimit.toFixed(2).replace('-', '−')} V): Rg's own drop biases the grid there with no Rk; above it the grid draws current`, stroke: PALETTE.limit, dash: LIMIT_STROKES.gridLeak.dash, width: LIMIT_STROKES.gridLeak.width };
  return [...VOLTAGE_STAGE_LEGEND.slice(0, -1), limit, VOLTAGE_STAGE_LEGEND[VOLTAGE_STAGE_LEGEND.length - 1]!];
}

export const OUTPUT_STAGE_LEGEND: readonly LegendItem[] = [
  { label: 'Plate curves at the screen voltage as wired (grid voltage marked)', stroke: PALETTE.ink, dash: undefined, width: 1.4 },
  { label: 'DC load line (primary resistance)', stroke: PALETTE.load, dash: undefined, width: 2 },
  { label: 'AC load line (primary impedance; drag its diamond handle)', stroke: PALETTE.load, dash: '9 5', width: 1.6 },
  { label: 'Rated plate dissipation', stroke: PALETTE.limit, dash: LIMIT_STROKES.dissipation.dash, width: LIMIT_STROKES.dissipation.width },
  { label: 'Maximum plate voltage', stroke: PALETTE.limit, dash: LIMIT_STROKES.maxPlateVoltage.dash, width: LIMIT_STROKES.maxPlateVoltage.width },
  { label: 'Swing to grid current or cutoff, sustained: the AC load line moved by the settled magnetising current', stroke: PALETTE.pointWash, dash: undefined, width: 8 },
];

export const PAIR_STAGE_LEGEND: readonly LegendItem[] = [
  { label: 'One tube\'s plate curves as wired (grid voltage marked)', stroke: PALETTE.ink, dash: undefined, width: 1.4 },
  { label: 'DC load line (its half of the primary)', stroke: PALETTE.load, dash: undefined, width: 2 },
  { label: 'Composite load line, both tubes conducting: Raa/2 (drag its diamond handle)', stroke: PALETTE.load, dash: '9 5', width: 1.6 },
  { label: 'One tube alone, its partner cut off: Raa/4 (also the composite load line)', stroke: PALETTE.load, dash: '2 4', width: 1.2 },
  { label: 'Composite characteristics, i1 − i2, the grids at Vgk ± x (from the bias to 0 V)', stroke: PALETTE.composite, dash: '1 3', width: 1 },
  { label: 'Rated plate dissipation', stroke: PALETTE.limit, dash: LIMIT_STROKES.dissipation.dash, width: LIMIT_STROKES.dissipation.width },
  { label: 'Maximum plate voltage', stroke: PALETTE.limit, dash: LIMIT_STROKES.maxPlateVoltage.dash, width: LIMIT_STROKES.maxPlateVoltage.width },
  { label: 'The path the tube takes with the grids driven to 0 V (solved with its partner)', stroke: PALETTE.pointWash, dash: undefined, width: 8 },
];

/** The phase splitter's key: a split-load's one triode, or a long-tailed pair's two (the second in the rival's colour). */
export function splitterLegend(ltp: boolean): readonly LegendItem[] {
  return [
    { label: 'Plate curves (grid voltage marked)', stroke: PALETTE.ink, dash: undefined, width: 1.4 },
    { label: ltp ? 'DC load line, first triode (its plate resistor with the shared tail)' : 'DC load line (plate and cathode resistors in series)', stroke: PALETTE.load, dash: undefined, width: 2 },
    ...(ltp ? [{ label: 'DC load line, second triode (its point the square)', stroke: PALETTE.rival, dash: '10 4', width: 1.6 }] : []),
    { label: 'Bias line (the grid held, the cathode on its resistor)', stroke: PALETTE.bias, dash: '5 3', width: 1.8 },
    { label: 'Rated plate dissipation', stroke: PALETTE.limit, dash: LIMIT_STROKES.dissipation.dash, width: LIMIT_STROKES.dissipation.width },
    { label: 'Maximum plate voltage', stroke: PALETTE.limit, dash: LIMIT_STROKES.maxPlateVoltage.dash, width: LIMIT_STROKES.maxPlateVoltage.width },
  ];
}

/** The follower's key: its plate at B+, its grid at the plate before it, the load in its cathode. */
export function followerLegend(vgrid: number): readonly LegendItem[] {
  return [
    { label: 'Plate curves (grid voltage marked)', stroke: PALETTE.ink, dash: undefined, width: 1.4 },
    { label: 'Cathode load line (B+ to B+/Rk)', stroke: PALETTE.load, dash: undefined, width: 2 },
    { label: 'AC load line (Rk with the next grid leak)', stroke: PALETTE.load, dash: '9 5', width: 1.6 },
    { label: `Bias line (grid at ${vgrid.toFixed(0)} V)`, stroke: PALETTE.bias, dash: '2 3', width: 1.8 },
    { label: 'Where Rk moves the point', stroke: PALETTE.point, dash: '1 4', width: 1.2 },
    { label: 'Rated plate dissipation', stroke: PALETTE.limit, dash: LIMIT_STROKES.dissipation.dash, width: LIMIT_STROKES.dissipation.width },
    { label: 'Maximum plate voltage', stroke: PALETTE.limit, dash: LIMIT_STROKES.maxPlateVoltage.dash, width: LIMIT_STROKES.maxPlateVoltage.width },
  ];
}

export function ChartLegend({ first, rival, items = VOLTAGE_STAGE_LEGEND, region = null, alongLine = false }: { first: string; rival: string | null; items?: readonly LegendItem[]; region?: readonly TargetName[] | null; alongLine?: boolean }) {
  return (
    <ul className="chart-legend" aria-label="Chart key">
      {rival ? (
        <li>
          <svg width="30" height="10" aria-hidden="true">
            <line x1="1" x2="29" y1="5" y2="5" stroke={PALETTE.rival} strokeWidth={1.6} strokeDasharray="6 3" />
          </svg>
          {`${rival} (dashed, square point) against ${first} (solid, round point)`}
        </li>
      ) : null}
      {items.map((it) => (
        <li key={it.label}>
          <svg width="30" height="10" aria-hidden="true">
            <line x1="1" x2="29" y1="5" y2="5" stroke={it.stroke} strokeWidth={it.width} strokeDasharray={it.dash} />
          </svg>
          {it.label}
        </li>
      ))}
      <li>
        <svg width="30" height="14" aria-hidden="true">
          <circle cx="15" cy="7" r="5" fill={PALETTE.point} stroke={PALETTE.ink} strokeWidth="1.5" />
        </svg>
        Operating point
      </li>
      {alongLine ? (
        <li>
          <svg width="30" height="14" aria-hidden="true">
            <line x1="5" x2="25" y1="7" y2="7" stroke={PALETTE.rival} strokeOpacity={0.35} strokeWidth={12} strokeLinecap="round" />
          </svg>
          Every target met along the follower&apos;s line (broad band; ringed: the best point)
        </li>
      ) : null}
      {region ? (
        <li>
          <svg width="30" height="14" aria-hidden="true">
            <rect x="1" y="1" width="28" height="12" fill={`url(#${REGION_HATCH_ID})`} stroke={PALETTE.rival} strokeWidth="0.8" />
          </svg>
          Every target met (hatched; ringed: the best point; the cursor readout names the targets failing elsewhere)
        </li>
      ) : null}
      {(region ?? []).map((k) => (
        <li key={k}>
          <svg width="30" height="10" aria-hidden="true">
            <line x1="1" x2="29" y1="5" y2="5" stroke={PALETTE.inkSoft} strokeWidth={1.6} strokeDasharray={TARGET_DASH[k]} />
          </svg>
          {`Edge of the ${TARGET_LABELS[k]} target`}
        </li>
      ))}
    </ul>
  );
}
