import { ohms, percentOf, volts } from '../../format';
import { Capacitor, Resistor, Winding } from '../schematic/parts';
import { Pentode, Triode } from '../schematic/tubes';
import { Dot, Ground, Wire } from '../schematic/wiring';
import { sameEntries, useDragPaced } from '../panels/useDragPaced';
import { useWorkbench } from '../../store/StoreProvider';
import { PairSchematic } from './PairSchematic';
import { windingText } from './windingWords';

/**
 * The output stage as a schematic: the tube (pentode or triode symbol) with
 * its screen wired as chosen, the output transformer and speaker, and the
 * bias network. Values are edited in the form beside it; the drawing follows.
 */
const W = 420;
const H = 400;
const RAIL = 40;
const CX = 190;
const CY = 240;
const PRI_X = 190;
const PRI_TOP = 62;
const PRI_BOT = 160;
const SEC_X = 232;
const TEXT = '#4a535c';
/** Where an ultralinear tap's wire runs down, left of the primary and right of its labels. */
const TAP_X = 156;

export function OutputSchematic() {
  const pair = useWorkbench((s) => s.outputBench.pair === 'push-pull');
  return pair ? <PairSchematic /> : <SingleEndedSchematic />;
}

function SingleEndedSchematic() {
  // Values follow a drag at a readable pace; the figures strip carries them live.
  const [o, a] = useDragPaced((s) => [s.design.output, s.outputBench.pair === 'single-ended' ? s.outputBench.analysis : null] as const, { equal: sameEntries });
  if (!a) return null;
  const { op, tube } = a.solution;
  const pentode = tube.law.kind === 'pentode';
  const conn = op.connection;
  const tapY = PRI_TOP + (PRI_BOT - PRI_TOP) * o.ulTap;
  const screenY = CY - 4;
  const gridY = CY + 8;
  const kTop = CY + 40;
  return (
    <section className="panel schematic" aria-label="Output stage schematic">
      <div className="schematic-frame">
        <svg viewBox={`0 0 ${W} ${H}`} className="schematic-svg" role="img" aria-label={`Schematic: ${tube.id} single-ended output stage, ${conn} connection, ${o.bias} bias, ${ohms(o.zPrimary)} primary into a ${ohms(o.speakerOhms)} speaker`}>
          <line x1={PRI_X - 40} x2={PRI_X + 30} y1={RAIL} y2={RAIL} stroke="#1d2329" strokeWidth={3} />
          <text x={PRI_X - 40} y={RAIL - 10} fontSize={12} fill="#1d2329">{`B+ ${volts(o.bplus)}`}</text>
          {/* output transformer: primary from B+ to the plate, secondary to the speaker */}
          <Wire points={[[PRI_X, RAIL], [PRI_X, PRI_TOP]]} />
          <Winding x={PRI_X} y1={PRI_TOP} y2={PRI_BOT} side={1} />
          <line x1={SEC_X - 14} x2={SEC_X - 14} y1={PRI_TOP} y2={PRI_BOT} stroke="#1d2329" strokeWidth={2} />
          <line x1={SEC_X - 9} x2={SEC_X - 9} y1={PRI_TOP} y2={PRI_BOT} stroke="#1d2329" strokeWidth={2} />
          <Winding x={SEC_X} y1={PRI_TOP + 20} y2={PRI_BOT - 20} side={-1} turns={3} />
          <Wire points={[[SEC_X, PRI_TOP + 20], [330, PRI_TOP + 20], [330, 92]]} />
          <Wire points={[[SEC_X, PRI_BOT - 20], [330, PRI_BOT - 20], [330, 130]]} />
          <g stroke="#1d2329" strokeWidth={2} fill="#fff">
            <rect x={324} y={92} width={12} height={38} />
            <polygon points="336,92 352,78 352,144 336,130" />
          </g>
          <text x={358} y={108} fontSize={12} fill="#1d2329">{ohms(o.speakerOhms)}</text>
          <text x={358} y={123} fontSize={11} fill={TEXT}>speaker</text>
          <text x={TAP_X - 8} y={96} fontSize={12} fill="#1d2329" textAnchor="end">{`Zpri ${ohms(o.zPrimary)}`}</text>
          <text x={TAP_X - 8} y={111} fontSize={11} fill={TEXT} textAnchor="end">{`DCR ${ohms(o.rPrimary)}`}</text>
          <text x={TAP_X - 8} y={126} fontSize={11} fill={TEXT} textAnchor="end">{`${a.turnsRatio.toFixed(1)} : 1`}</text>
          {windingText(o) ? <text x={TAP_X - 8} y={141} fontSize={11} fill={TEXT} textAnchor="end">{windingText(o)}</text> : null}
          <Wire points={[[PRI_X, PRI_BOT], [PRI_X, CY - 40]]} />
          {pentode ? <Pentode cx={CX} cy={CY} /> : <Triode cx={CX} cy={CY} r={40} />}
          <text x={CX + 48} y={CY + 34} fontSize={13} fontWeight={600} fill="#1d2329">{tube.id}</text>
          <text x={CX + 48} y={CY + 50} fontSize={11} fill={TEXT}>{`Vpk ${volts(op.vpk)}, Ia ${(op.ip * 1e3).toPrecision(3)} mA`}</text>
          {/* the screen, wired as chosen */}
          {pentode && conn === 'pentode' ? (
            <g>
              <Wire points={[[CX + 40, screenY], [300, screenY], [300, 196]]} />
              <text x={306} y={192} fontSize={12} fill="#1d2329">{`Vg2 ${volts(o.screenVolts)}`}</text>
            </g>
          ) : null}
          {pentode && conn === 'triode' ? (
            <g>
              <Wire points={[[CX + 40, screenY], [262, screenY], [262, 180], [PRI_X, 180]]} />
              <Dot x={PRI_X} y={180} />
              <text x={270} y={screenY + 16} fontSize={11} fill={TEXT}>screen tied to plate</text>
            </g>
          ) : null}
          {pentode && conn === 'ultralinear' ? (
            <g>
              <Wire points={[[CX + 40, screenY], [276, screenY], [276, 176], [TAP_X, 176], [TAP_X, tapY], [PRI_X - 4, tapY]]} />
              <Dot x={PRI_X - 4} y={tapY} />
              <text x={282} y={screenY + 4} fontSize={11} fill={TEXT}>{`tap ${percentOf(o.ulTap)}`}</text>
            </g>
          ) : null}
          {/* control grid: grid resistor to ground, or to the bias supply */}
          <Wire points={[[CX - 40, gridY], [110, gridY]]} />
          <Dot x={110} y={gridY} />
          <Wire points={[[110, gridY], [40, gridY]]} />
          <text x={16} y={gridY + 4} fontSize={12} fill={TEXT}>in</text>
          <Resistor x={110} y1={gridY} y2={350} />
          <text x={84} y={300} fontSize={12} fill="#1d2329" textAnchor="end">{`Rg ${ohms(o.rg)}`}</text>
          {o.bias === 'fixed' ? (
            <text x={110} y={370} fontSize={12} fill="#1d2329" textAnchor="middle">{`to ${volts(o.vg)} bias`}</text>
          ) : (
            <Ground x={110} y={358} />
          )}
          {/* cathode */}
          {o.bias === 'cathode' ? (
            <g>
              <Wire points={[[CX, kTop], [CX, 300]]} />
              <Dot x={CX} y={300} />
              <Resistor x={CX} y1={300} y2={360} />
              <Wire points={[[CX, 300], [CX + 46, 300]]} />
              <Wire points={[[CX, 360], [CX + 46, 360]]} />
              <Capacitor at={CX + 46} from={300} to={360} vertical polarised />
              <Ground x={CX} y={368} />
              <text x={CX - 14} y={334} fontSize={12} fill="#1d2329" textAnchor="end">{`Rk ${ohms(o.rk)}`}</text>
              <text x={CX + 62} y={334} fontSize={11} fill={TEXT}>{`Vk ${volts(op.vk)}`}</text>
            </g>
          ) : (
            <g>
              <Wire points={[[CX, kTop], [CX, 352]]} />
              <Ground x={CX} y={360} />
            </g>
          )}
        </svg>
      </div>
    </section>
  );
}
