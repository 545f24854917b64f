/**
 * How the amplifier's small tubes are lit, as the builder chooses it on the
 * build sheet: on the mains transformer's heater winding (AC, with the
 * output tubes), or from a DC supply through a dropping resistor (common
 * practice for a low-level input stage, to keep heater hum out of it). The
 * output tubes and a rectifier tube always take their windings. Part of the
 * design: saved, shared, autosaved and undone with it.
 */
export interface HeaterChoice {
  /** Where the voltage stages' and the phase splitter's heaters are fed from. */
  readonly voltageStages: 'ac' | 'dc';
  /** The DC heater supply's voltage, V (used when `voltageStages` is 'dc'). */
  readonly dcVolts: number;
  /** Each tube type's heater wiring, by tube id (its record's `wiring` name); absent, the record's first. */
  readonly wiring: Readonly<Record<string, string>>;
  /**
   * The DC potential the small tubes' heater supply is held at, V, through a
   * divider from the lowest voltage stage's B+ (elevationDivider); absent or
   * 0, the heaters return to ground. Every voltage stage's and the
   * splitter's heater–cathode voltage is taken from it, and the output
   * tubes' where they share the small tubes' AC winding (heaterSharing.ts).
   */
  readonly elevationVolts?: number;
}

/** The heaters' potential to ground the design asks, V (0: at ground). */
export const elevationOf = (h: HeaterChoice): number => h.elevationVolts ?? 0;

/** The small tubes' heater potential as a model stage takes it: `heaterVolts` when held above ground, else nothing (the model's default, 0 V). */
export const heaterField = (h: HeaterChoice): { heaterVolts?: number } => (elevationOf(h) !== 0 ? { heaterVolts: elevationOf(h) } : {});

/** The bench's default: everything on the heater winding, 12.6 V offered for a DC supply (two 6.3 V heaters in series, or 12AX7-family in series wiring). */
export const DEFAULT_HEATERS: HeaterChoice = { voltageStages: 'ac', dcVolts: 12.6, wiring: {} };
