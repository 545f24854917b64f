import type { TubeRecord } from '../types';
import { tube12AX7 } from './12AX7';
import { tube12AT7 } from './12AT7';
import { tube12AU7 } from './12AU7';
import { tube12AY7 } from './12AY7';
import { tube12BH7 } from './12BH7';
import { tube6SN7 } from './6SN7';
import { tube6CG7 } from './6CG7';
import { tube6SL7 } from './6SL7';
import { tube6DJ8 } from './6DJ8';
import { tube6922 } from './6922';
import { tube5687 } from './5687';
import { tube6N1P } from './6N1P';
import { tube300B } from './300B';
import { tube2A3 } from './2A3';
import { tube45 } from './45';
import { tubeEL84T } from './EL84T';
import { tubeEL34T } from './EL34T';
import { tube6V6T } from './6V6T';

/** The built-in tubes, in the order the chooser lists them. Read-only. */
export const tubeLibrary: readonly TubeRecord[] = Object.freeze([
  tube12AX7,
  tube12AT7,
  tube12AU7,
  tube12AY7,
  tube12BH7,
  tube6SN7,
  tube6CG7,
  tube6SL7,
  tube6DJ8,
  tube6922,
  tube5687,
  tube6N1P,
  tube300B,
  tube2A3,
  tube45,
  tubeEL84T,
  tubeEL34T,
  tube6V6T,
]);

/** A library tube by id (case-insensitive), or undefined. */
export function findTube(id: string): TubeRecord | undefined {
  const key = id.trim().toUpperCase();
  return tubeLibrary.find((t) => t.id.toUpperCase() === key);
}
