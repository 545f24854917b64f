import { tube2A3 } from '../../tube/library/2A3';
import { tube300B } from '../../tube/library/300B';
import { tube45 } from '../../tube/library/45';
import type { TubeRecord } from '../../tube/types';
import { fitBasisOf } from '../../tube/tubeSummary';
import { defineOutputTube, type OutputTube, type SingleEndedExample } from '../outputTube';

/** A library power triode seen as an output tube: its triode law, ratings and heater as recorded there. */
function asOutputTube(tube: TubeRecord, singleEnded: readonly SingleEndedExample[]): OutputTube {
  const r = tube.ratings;
  return defineOutputTube({
    id: tube.id,
    description: tube.description,
    construction: 'power triode',
    law: { kind: 'triode', tube },
    // What the curves rest on, said where the law is named: a power triode fitted to one data-sheet point extrapolates.
    lawSource: `Koren's triode law, the ${tube.id} record of the triode library. ${fitBasisOf(tube)}`,
    heater: tube.heaters[0]!,
    ratings: {
      maxPlateVoltage: r.maxPlateVoltage,
      maxPlateDissipation: r.maxPlateDissipation,
      maxScreenVoltage: null,
      maxScreenDissipation: null,
      ...(r.maxCathodeCurrent !== undefined ? { maxCathodeCurrent: r.maxCathodeCurrent } : {}),
      maxHeaterCathodeVoltage: r.maxHeaterCathodeVoltage,
      ...(r.maxHeaterCathodeVoltageCathodeNegative !== undefined ? { maxHeaterCathodeVoltageCathodeNegative: r.maxHeaterCathodeVoltageCathodeNegative } : {}),
      ...(r.maxGridResistanceCathodeBias !== undefined ? { maxGridResistanceCathodeBias: r.maxGridResistanceCathodeBias } : {}),
      ...(r.maxGridResistanceFixedBias !== undefined ? { maxGridResistanceFixedBias: r.maxGridResistanceFixedBias } : {}),
      source: r.source,
    },
    capacitances: tube.capacitances,
    singleEnded,
  });
}

export const output300B = asOutputTube(tube300B, []);

export const output2A3 = asOutputTube(tube2A3, [
  { connection: 'triode', va: 250, vg1: -45, ia: 60e-3, load: 2500, power: 3.5, thd: 0.05, source: 'data-sheet summary, Virtual Valve Museum 2A3 page (S)' },
]);

export const output45 = asOutputTube(tube45, [
  { connection: 'triode', va: 180, vg1: -31.5, ia: 31e-3, load: 2700, power: 0.825, thd: 0.05, source: 'RCA type 45 data, single tube class A1 (from memory)' },
  { connection: 'triode', va: 250, vg1: -50, ia: 34e-3, load: 3900, power: 1.6, thd: 0.05, source: 'RCA type 45 data, single tube class A1 (from memory)' },
]);
