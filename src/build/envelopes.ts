import type { TubeRecord } from '../tube/types';

/** One tube type's glass in the amplifier: how many sections the stages use and how many envelopes that takes. */
export interface EnvelopeCount {
  readonly tube: TubeRecord;
  readonly sectionsUsed: number;
  readonly envelopes: number;
}

/**
 * The envelopes (and so the heaters) a list of stages needs: stages on the
 * same twin triode share envelopes two sections to one (a follower on the
 * other half of its driver's 12AX7 adds no heater); single triodes take one
 * envelope each. In the order the types first appear.
 */
export function envelopesOf(stageTubes: readonly TubeRecord[]): EnvelopeCount[] {
  const byId = new Map<string, { tube: TubeRecord; sectionsUsed: number }>();
  for (const tube of stageTubes) {
    const entry = byId.get(tube.id) ?? { tube, sectionsUsed: 0 };
    entry.sectionsUsed++;
    byId.set(tube.id, entry);
  }
  // A record without a whole, positive count of sections (one read from an old or hand-edited file) is taken as one section per envelope.
  const perEnvelope = (t: TubeRecord) => (Number.isInteger(t.sections) && t.sections! >= 1 ? t.sections! : 1);
  return [...byId.values()].map(({ tube, sectionsUsed }) => ({ tube, sectionsUsed, envelopes: Math.ceil(sectionsUsed / perEnvelope(tube)) }));
}
