import { percentOf as percent, volts, watts } from '../../format';
import { Figure } from '../panels/Figure';

/** What a settled cathode resistor's figures read: its cathode idle and settled, and the stage there with its grid(s) driven to 0 V. */
export interface SettledFigureValues {
  readonly idleVk: number;
  readonly vk: number;
  readonly full: { readonly power: number; readonly thd: number; readonly drive: number };
}

/**
 * A cathode resistor under full drive, for a single tube or a pair's shared
 * one: where its bias settles and the power and drive there. Worked out on
 * the full pass only, so a drag shows '…'; 'does not settle' where the
 * model found no settled bias.
 */
export function SettledBiasFigures({ settled, light, label, grids }: { settled: SettledFigureValues | null; light: boolean; label: string; grids: 'Grid' | 'Grids' }) {
  const wait = '…';
  const s = light ? null : settled;
  return (
    <dl className="figure-group" aria-label={label}>
      <Figure name="settled-vk" label="Vk idle → settled at full drive" value={light ? wait : s ? `${volts(s.idleVk)} → ${volts(s.vk)}` : 'does not settle'} chars={15} />
      <Figure name="settled-power" label={`${grids} driven to 0 V there`} value={s ? `${watts(s.full.power)} at ${percent(s.full.thd)} THD` : light ? wait : '—'} chars={20.5} />
      <Figure name="settled-drive" label={grids === 'Grids' ? 'Drive per grid there' : 'Drive there'} value={s ? `${volts(s.full.drive / Math.SQRT2)} rms` : light ? wait : '—'} chars={9} />
    </dl>
  );
}
