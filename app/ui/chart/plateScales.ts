import { scaleLinear, type ScaleLinear } from 'd3';
import type { PlateExtent } from '../../../src/index';

/** Drawing box of the plate chart in SVG user units; CSS scales the whole SVG. */
export interface ChartBox {
  readonly width: number;
  readonly height: number;
  readonly margin: { readonly top: number; readonly right: number; readonly bottom: number; readonly left: number };
}

export const CHART_BOX: ChartBox = { width: 760, height: 520, margin: { top: 18, right: 56, bottom: 46, left: 62 } };

export interface PlateScales {
  /** Plate–cathode voltage (V) → x. */
  readonly x: ScaleLinear<number, number>;
  /** Plate current (A) → y. Tick labels show mA. */
  readonly y: ScaleLinear<number, number>;
  readonly box: ChartBox;
}

/** Scales built in one place from the chart window (which covers every drawn series). */
export function plateScales(extent: PlateExtent, box: ChartBox = CHART_BOX): PlateScales {
  const { width, height, margin } = box;
  return {
    x: scaleLinear().domain([0, extent.vmax]).range([margin.left, width - margin.right]),
    y: scaleLinear().domain([0, extent.iaMax]).range([height - margin.bottom, margin.top]),
    box,
  };
}
