import { memo } from 'react';
import { Wiper, Capacitor, HResistor, Resistor } from './parts';
import { Triode } from './tubes';
import { Dot, Ground, Wire } from './wiring';
import type { BenchDesign } from '../../store/analysis';

/** The drawing's grid, in viewBox units. */
export const H = 400;
export const RAIL = 44;
export const X1 = 184;
export const X2 = 334;
export const GRID_Y = 190;
/** A capacitor-coupled follower's grid leak: where it stands and where it ends (at the divider). */
export const FOLLOWER_LEAK_X = 292;
export const FOLLOWER_LEAK_END = 252;
/**
 * With a stopper at the follower's grid, the leak rises from the wire after
 * the capacitor instead (the stopper takes the run to the grid, and below
 * the wire stand stage 1's name and figures): where it stands, and its top.
 */
export const STOPPED_LEAK_X = 263;
export const STOPPED_LEAK_TOP = 84;
/** Where a follower's stopper sits: from the corner to its grid. */
const FOLLOWER_STOPPER = { x1: 274, x2: X2 - 36 } as const;

interface DrawingProps {
  readonly kind: BenchDesign['stage2']['kind'];
  /** A follower fed through its capacitor into its own leak and bias (else straight from the plate). */
  readonly coupled: boolean;
  readonly bypassed: boolean;
  readonly hasLoad: boolean;
  /** A grid stopper between the leak and the grid. */
  readonly stopped: boolean;
  /** A grid stopper at the follower's grid (after its leak, when capacitor-coupled). */
  readonly followerStopped: boolean;
  /** The leak is a volume control: its wiper drawn as an arrow onto the track. */
  readonly potted: boolean;
  readonly tubeId: string;
  readonly tube2Id: string;
}

/**
 * The parts and wiring of the stage without its values. It changes only with
 * the circuit's shape, so a drag (which changes values, not wiring) never
 * renders it again.
 */
export const StageDrawing = memo(function StageDrawing({ kind, coupled, bypassed, hasLoad, stopped, followerStopped, potted, tubeId, tube2Id }: DrawingProps) {
  // The follower's grid wire from the corner: straight, or through its stopper.
  const toFollowerGrid = followerStopped ? (
    <>
      <Wire points={[[270, GRID_Y], [FOLLOWER_STOPPER.x1, GRID_Y]]} />
      <HResistor x1={FOLLOWER_STOPPER.x1} x2={FOLLOWER_STOPPER.x2} y={GRID_Y} />
    </>
  ) : (
    <Wire points={[[270, GRID_Y], [X2 - 36, GRID_Y]]} />
  );
  const leak = followerStopped ? (
    <>
      <Dot x={STOPPED_LEAK_X} y={130} />
      <Resistor x={STOPPED_LEAK_X} y1={STOPPED_LEAK_TOP} y2={130} />
    </>
  ) : (
    <>
      <Dot x={FOLLOWER_LEAK_X} y={GRID_Y} />
      <Resistor x={FOLLOWER_LEAK_X} y1={GRID_Y} y2={FOLLOWER_LEAK_END} />
    </>
  );
  const outX = kind === 'none' ? 300 : 404;
  const outY = kind === 'follower' ? 250 : 130;
  const fromX = kind === 'none' ? X1 : X2;
  return (
    <>
            <line x1={X1 - 30} x2={kind === 'none' ? X1 + 30 : X2 + 30} y1={RAIL} y2={RAIL} stroke="#1d2329" strokeWidth={3} />
            {/* input network: source impedance, coupling capacitor, grid leak, grid stopper */}
            <text x={4} y={GRID_Y + 4} fontSize={12} fill="#4a535c">in</text>
            <HResistor x1={18} x2={72} y={GRID_Y} />
            <Capacitor at={GRID_Y} from={72} to={112} vertical={false} />
            {stopped ? (
              <>
                <Wire points={[[112, GRID_Y], [124, GRID_Y]]} />
                <HResistor x1={124} x2={X1 - 36} y={GRID_Y} />
              </>
            ) : (
              <Wire points={[[112, GRID_Y], [X1 - 36, GRID_Y]]} />
            )}
            <Dot x={120} y={GRID_Y} />
            <Resistor x={120} y1={GRID_Y} y2={344} />
            {potted ? <Wiper x={120} y={268} /> : null}
            <Ground x={120} y={352} />
            {/* stage 1 */}
            <Resistor x={X1} y1={RAIL} y2={130} />
            <Dot x={X1} y={130} />
            <Wire points={[[X1, 130], [X1, 154]]} />
            <Triode cx={X1} cy={GRID_Y} />
            <text x={X1 + 40} y={176} fontSize={13} fontWeight={600} fill="#1d2329">{tubeId}</text>
            <Wire points={[[X1, 226], [X1, 250]]} />
            <Dot x={X1} y={250} />
            <Resistor x={X1} y1={250} y2={344} />
            <g opacity={bypassed ? 1 : 0.3}>
              <Wire points={[[X1, 250], [X1 + 46, 250]]} />
              <Wire points={[[X1, 344], [X1 + 46, 344]]} />
            </g>
            <Capacitor at={X1 + 46} from={250} to={344} vertical faded={!bypassed} polarised />
            <Ground x={X1} y={352} />
            {kind === 'follower' ? (
              <g>
                {coupled ? (
                  <>
                    <Capacitor at={130} from={X1} to={256} vertical={false} />
                    <Wire points={[[256, 130], [270, 130], [270, GRID_Y]]} />
                    {toFollowerGrid}
                    {/* The leak hangs short, to the divider (named by its voltage), clear of stage 1's bypass and the follower's Rk. */}
                    {leak}
                  </>
                ) : (
                  <>
                    <Wire points={[[X1, 130], [270, 130], [270, GRID_Y]]} />
                    {toFollowerGrid}
                  </>
                )}
                <Wire points={[[X2, RAIL], [X2, 154]]} />
                <Dot x={X2} y={RAIL} />
                <Triode cx={X2} cy={GRID_Y} />
                <text x={X2 + 40} y={176} fontSize={13} fontWeight={600} fill="#1d2329">{tube2Id}</text>
                <text x={X2 + 40} y={192} fontSize={11} fill="#4a535c">follower</text>
                <Wire points={[[X2, 226], [X2, 250]]} />
                <Dot x={X2} y={250} />
                <Resistor x={X2} y1={250} y2={344} />
                <Ground x={X2} y={352} />
              </g>
            ) : null}
            {kind === 'common-cathode' ? (
              <g>
                <Capacitor at={130} from={X1} to={256} vertical={false} />
                <Wire points={[[256, 130], [270, 130], [270, GRID_Y], [X2 - 36, GRID_Y]]} />
                <Dot x={270} y={GRID_Y} />
                <Resistor x={270} y1={GRID_Y} y2={344} />
                <Ground x={270} y={352} />
                <Resistor x={X2} y1={RAIL} y2={130} />
                <Dot x={X2} y={130} />
                <Wire points={[[X2, 130], [X2, 154]]} />
                <Triode cx={X2} cy={GRID_Y} />
                <text x={X2 + 40} y={176} fontSize={13} fontWeight={600} fill="#1d2329">{tube2Id}</text>
                <Wire points={[[X2, 226], [X2, 250]]} />
                <Resistor x={X2} y1={250} y2={344} />
                <Ground x={X2} y={352} />
              </g>
            ) : null}
            {/* output: coupling capacitor into the load */}
            <Wire points={[[fromX, outY], [outX - 50, outY]]} />
            <Capacitor at={outY} from={outX - 50} to={outX - 4} vertical={false} />
            <Wire points={[[outX - 4, outY], [outX, outY]]} />
            <text x={outX + 6} y={outY - 6} fontSize={12} fill="#4a535c">out</text>
            <Resistor x={outX} y1={outY} y2={344} faded={!hasLoad} />
            <Ground x={outX} y={352} />
    </>
  );
});
