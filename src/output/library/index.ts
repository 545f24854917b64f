import type { OutputTube } from '../outputTube';
import { output6550 } from './6550';
import { output6L6GC } from './6L6GC';
import { output6V6 } from './6V6';
import { outputEL34 } from './EL34';
import { outputEL84 } from './EL84';
import { outputKT88 } from './KT88';
import { output2A3, output300B, output45 } from './powerTriodes';

/** The output tubes, in the order the chooser lists them: pentodes and beam tetrodes, then power triodes. */
export const outputTubeLibrary: readonly OutputTube[] = Object.freeze([
  outputEL84,
  output6V6,
  outputEL34,
  output6L6GC,
  outputKT88,
  output6550,
  output300B,
  output2A3,
  output45,
]);

export function findOutputTube(id: string): OutputTube | undefined {
  return outputTubeLibrary.find((t) => t.id === id);
}
