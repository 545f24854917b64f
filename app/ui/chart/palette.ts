/**
 * One colour, one meaning. Chosen for this product; each passes WCAG AA's 3:1
 * for graphics against the sheet colour, and the line styles (solid, dashed,
 * dotted, weight) keep them apart in grayscale.
 */
export const PALETTE = {
  sheet: '#fbfaf5',
  gridMajor: '#d8d6cc',
  gridMinor: '#ecebe4',
  ink: '#1d2329',
  inkSoft: '#4a535c',
  /** Ratings limits: dissipation hyperbola, maximum plate voltage. */
  limit: '#b42318',
  /** Load lines (DC solid, AC dashed). */
  load: '#0f5f8a',
  /** Cathode bias line. */
  bias: '#6b3fa0',
  /** The operating point. */
  point: '#c25e00',
  /** The stretch of load line a signal covers: a wash of the point's colour. */
  pointWash: 'rgba(194, 94, 0, 0.28)',
  /** The second tube in a comparison. */
  rival: '#2f6b3a',
  /** A push-pull pair's composite characteristics. */
  composite: '#8a5a14',
} as const;

/** Line styles of the ratings limits, drawn and keyed from this one place. */
export const LIMIT_STROKES = {
  dissipation: { dash: '7 4', width: 1.6 },
  maxPlateVoltage: { dash: '2 4', width: 1.2 },
  /** A leaked grid's limit: the plate curve where its own current biases it, dash-dot so it reads apart from the other two. */
  gridLeak: { dash: '8 3 2 3', width: 1.4 },
} as const;
