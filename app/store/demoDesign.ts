import { TABLE_THD } from '../../src/index';
import { pairDefaults } from './outputPlan';
import { NO_TARGETS } from './targetPlan';
import type { BenchDesign } from './analysis';
import { autoTitle } from './autoTitle';
import { DEMO_SUPPLY } from './supplyPlan';
import { DEFAULT_HEATERS } from './heaterChoice';

/**
 * The design the bench opens on: a small amplifier of our own making, three
 * stages from input jack to speaker on its own supply (DEMO_SUPPLY). A 12AX7
 * input stage (below) drives, through 470 nF into 1 MΩ, the driver on the
 * bench: a 12AU7 section on a 275 V rail, plate resistor 27 kΩ, cathode
 * resistor 1.2 kΩ bypassed by 100 µF, driving the output stage's 220 kΩ grid
 * resistor through 1 µF; distortion read at 2 V rms out. The source is 1 kΩ.
 */
export const DEMO_DESIGN: BenchDesign = {
  tubeId: '12AU7',
  bplus: 275,
  ra: 27e3,
  rk: 1200,
  bypassed: true,
  rl: 220e3,
  series: 'E24',
  snap: true,
  rsource: 1e3,
  cin: 470e-9,
  rg: 1e6,
  rstopper: 0,
  volume: null,
  ck: 100e-6,
  cout: 1e-6,
  levelRms: 2,
  thdLimit: TABLE_THD,
  targets: NO_TARGETS,
  followerTargets: NO_TARGETS,
  outputTargets: NO_TARGETS,
  stage2: { kind: 'none', tubeId: '12AU7', ra: 22e3, rk: 22e3, rg: 470e3 },
  // The input stage: a 12AX7 section, 100 kΩ plate, 1.5 kΩ cathode left unbypassed (its feedback keeps the gain near 30
  // and the distortion low), fed from the source through 470 nF into 1 MΩ.
  before: [{ kind: 'common-cathode', tubeId: '12AX7', bplus: 275, ra: 100e3, rk: 1500, bypassed: false, ck: null, cc: 470e-9, rg: 1e6 }],
  after: [],
  stageKind: 'voltage',
  drivesOutput: true,
  output: {
    // The output stage the bench offers first: an EL34 with its screen on a
    // 43 % ultralinear tap, 3.5 kΩ primary of 130 Ω, self-biased by 330 Ω.
    tubeId: 'EL34',
    connection: 'ultralinear',
    bplus: 330,
    screenVolts: 300,
    ulTap: 0.43,
    zPrimary: 3500,
    rPrimary: 130,
    bias: 'cathode',
    rk: 330,
    vg: -22,
    rg: 220e3,
    speakerOhms: 8,
    thdLimit: 0.05,
    // Single-ended; as a pair the EL34s would run into 7 kΩ plate to plate, matched.
    ...pairDefaults(3500),
  },
  supply: DEMO_SUPPLY,
  heaters: DEFAULT_HEATERS,
  // No global feedback: the open-loop figures are the demo's own.
  feedbackRf: null,
  feedbackCf: null,
};

/** The demo's title is its automatic one, so it follows the first change the user makes. */
export const DEMO_TITLE = autoTitle(DEMO_DESIGN);
