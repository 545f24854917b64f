import { fail, type Result } from '../result';
import type { AmplifierOnSupply, AmplifierOnSupplyResult } from './solveOnSupply';
import { placedOnSupply } from './solveOnSupply';
import { humAtOutput, supplyHum, type HumAtOutput } from './supplyHum';

/**
 * The hum an amplifier solved on its supply leaves at its output: the
 * amplifier as the supply placed it (each stage at its node's B+, screens on
 * a node of their own at theirs), each stage's share per volt (supplyHum, at
 * the supply's mains), times the ripple on its node, and its screens' share
 * times the ripple on theirs (their own node's, or their plates').
 */
export function humOnSupply(input: AmplifierOnSupply, solved: AmplifierOnSupplyResult): Result<HumAtOutput> {
  if (typeof input !== 'object' || input === null || typeof solved !== 'object' || solved === null || !Array.isArray(solved.bplus) || !Array.isArray(solved.screenVolts)) {
    return fail('invalid-input', 'Give the amplifier on its supply and its solution');
  }
  const nodes = solved.supply?.nodes;
  if (!Array.isArray(nodes) || !Array.isArray(input.feeds) || typeof input.amplifier !== 'object' || input.amplifier === null || !Array.isArray(input.amplifier.stages)) {
    return fail('invalid-input', 'The solution must give every node, and the amplifier every stage and its node');
  }
  const hum = supplyHum(placedOnSupply(input.amplifier, solved.bplus, solved.screenVolts), solved.amplifier, input.supply?.mainsHz, input.supply?.rectifier?.kind === 'silicon-half-wave');
  if (!hum.ok) return hum;
  const ripple = (node: unknown) => (typeof node === 'number' ? (nodes[node]?.rippleRms ?? 0) : null);
  const plates = input.feeds.map((node) => ripple(node) ?? 0);
  const screens = input.feeds.map((_, k) => ripple(input.screenFeeds?.[k]) ?? plates[k]!);
  return humAtOutput(hum, plates, screens);
}
