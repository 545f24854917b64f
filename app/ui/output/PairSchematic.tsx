import { ohms, percentOf, volts } from '../../format';
import { Capacitor, Resistor, Winding } from '../schematic/parts';
import { Pentode, Triode } from '../schematic/tubes';
import { windingText } from './windingWords';
import { Dot, Ground, Wire } from '../schematic/wiring';
import { sameEntries, useDragPaced } from '../panels/useDragPaced';

/**
 * A push-pull pair as a schematic, our own drawing: the centre-tapped
 * primary with B+ at its tap, each end to one tube's plate, the secondary to
 * the speaker, each grid's resistor and its antiphase drive, and the shared
 * cathode resistor with its bypass (or the bias supply). The screens'
 * wiring is said in words under the tubes.
 */
const W = 460;
const H = 400;
const PX = 230;
const TOP = 46;
const CT = 116;
const BOT = 186;
const AX = 120;
const BX = 340;
const CY = 262;
const INK = '#1d2329';
const TEXT = '#4a535c';

export function PairSchematic() {
  const [o, solution] = useDragPaced((s) => [s.design.output, s.outputBench.pair === 'push-pull' ? s.outputBench.analysis.solution : null] as const, { equal: sameEntries });
  if (!solution) return null;
  const tube = solution.tube;
  const pentode = tube.law.kind === 'pentode';
  const Tube = ({ cx }: { cx: number }) => (pentode ? <Pentode cx={cx} cy={CY} r={34} /> : <Triode cx={cx} cy={CY} r={34} />);
  const screens = !pentode ? 'power triodes' : solution.feed.kind === 'tied' ? 'screens tied to the plates' : solution.feed.kind === 'tap' ? `screens on ${percentOf(o.ulTap)} taps` : `screens at ${volts(o.screenVolts)}`;
  const kY = CY + 64;
  return (
    <section className="panel schematic" aria-label="Push-pull output stage schematic">
      <div className="schematic-frame">
        <svg viewBox={`0 0 ${W} ${H}`} className="schematic-svg" role="img" aria-label={`Schematic: two ${tube.id} in push-pull, ${screens}, ${o.bias} bias, ${ohms(o.raa)} plate to plate into a ${ohms(o.speakerOhms)} speaker`}>
          {/* centre-tapped primary, B+ at the tap */}
          <Winding x={PX} y1={TOP} y2={CT} side={1} turns={3} />
          <Winding x={PX} y1={CT} y2={BOT} side={1} turns={3} />
          <Wire points={[[PX, CT], [160, CT]]} />
          <Dot x={PX} y={CT} />
          <text x={154} y={CT + 4} fontSize={12} fill={INK} textAnchor="end">{`B+ ${volts(o.bplus)}`}</text>
          <Wire points={[[PX, TOP], [AX, TOP], [AX, CY - 34]]} />
          <Wire points={[[PX, BOT], [PX, 204], [BX, 204], [BX, CY - 34]]} />
          <line x1={PX + 16} x2={PX + 16} y1={TOP} y2={BOT} stroke={INK} strokeWidth={2} />
          <line x1={PX + 21} x2={PX + 21} y1={TOP} y2={BOT} stroke={INK} strokeWidth={2} />
          <Winding x={PX + 38} y1={TOP + 30} y2={BOT - 30} side={-1} turns={3} />
          <Wire points={[[PX + 38, TOP + 30], [380, TOP + 30], [380, 96]]} />
          <Wire points={[[PX + 38, BOT - 30], [380, BOT - 30], [380, 134]]} />
          <g stroke={INK} strokeWidth={2} fill="#fff">
            <rect x={374} y={96} width={12} height={38} />
            <polygon points="386,96 402,82 402,148 386,134" />
          </g>
          <text x={408} y={112} fontSize={12} fill={INK}>{ohms(o.speakerOhms)}</text>
          <text x={PX + 30} y={BOT + 2} fontSize={12} fill={INK}>{`Raa ${ohms(o.raa)}`}</text>
          <text x={PX + 30} y={BOT + 16} fontSize={11} fill={TEXT}>{`DCR ${ohms(o.rPrimary)}${windingText(o) ? `, ${windingText(o)}` : ''}`}</text>
          {/* the tubes */}
          <Tube cx={AX} />
          <Tube cx={BX} />
          <text x={AX} y={CY + 52} fontSize={12} fontWeight={600} fill={INK} textAnchor="middle">{tube.id}</text>
          <text x={BX} y={CY + 52} fontSize={12} fontWeight={600} fill={INK} textAnchor="middle">{tube.id}</text>
          <text x={PX} y={CY - 6} fontSize={11} fill={TEXT} textAnchor="middle">{screens}</text>
          {/* grids, driven in antiphase, each with its resistor */}
          <Wire points={[[AX - 34, CY + 8], [40, CY + 8]]} />
          <Wire points={[[BX + 34, CY + 8], [420, CY + 8]]} />
          <text x={14} y={CY + 2} fontSize={12} fill={TEXT}>in +</text>
          <text x={426} y={CY + 2} fontSize={12} fill={TEXT}>in −</text>
          <Dot x={60} y={CY + 8} />
          <Dot x={400} y={CY + 8} />
          <Resistor x={60} y1={CY + 8} y2={CY + 90} />
          <Resistor x={400} y1={CY + 8} y2={CY + 90} />
          <text x={66} y={CY + 104} fontSize={11} fill={INK}>{`Rg ${ohms(o.rg)}`}</text>
          {o.bias === 'fixed' ? (
            <>
              <text x={60} y={CY + 120} fontSize={11} fill={TEXT} textAnchor="middle">{`to ${volts(o.vg)}`}</text>
              <text x={400} y={CY + 120} fontSize={11} fill={TEXT} textAnchor="middle">{`to ${volts(o.vg)}`}</text>
            </>
          ) : (
            <>
              <Ground x={60} y={CY + 98} />
              <Ground x={400} y={CY + 98} />
            </>
          )}
          {/* cathodes: joined, to the shared resistor and bypass, or to ground */}
          <Wire points={[[AX, CY + 34], [AX, kY], [BX, kY], [BX, CY + 34]]} />
          <Dot x={PX} y={kY} />
          {o.bias === 'cathode' ? (
            <g>
              <Resistor x={PX} y1={kY} y2={kY + 50} />
              <Wire points={[[PX, kY], [PX + 40, kY]]} />
              <Wire points={[[PX, kY + 50], [PX + 40, kY + 50]]} />
              <Capacitor at={PX + 40} from={kY} to={kY + 50} vertical polarised />
              <Ground x={PX} y={kY + 58} />
              <text x={PX - 12} y={kY + 30} fontSize={12} fill={INK} textAnchor="end">{`Rk ${ohms(o.rk)}`}</text>
              <text x={PX + 54} y={kY + 30} fontSize={11} fill={TEXT}>{`Vk ${volts(solution.vk)}`}</text>
            </g>
          ) : (
            <g>
              <Wire points={[[PX, kY], [PX, kY + 40]]} />
              <Ground x={PX} y={kY + 48} />
            </g>
          )}
        </svg>
      </div>
    </section>
  );
}
