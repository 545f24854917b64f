import type { Result } from '../result';
import { solveLinks, type ChainLink, type LinkChainResult } from '../signal/solveLinks';
import type { ChainInput, ChainResult } from './chainTypes';
import { solveAmplifier } from './solveAmplifier';

/**
 * One entry for both shapes of chain: an amplifier `{ source, stages, load }`
 * of 1 to 8 stages, or the first version's array of one or two links, which
 * keeps its meaning and its result.
 */
export function solveChain(input: readonly ChainLink[]): Result<LinkChainResult>;
export function solveChain(input: ChainInput): Result<ChainResult>;
export function solveChain(input: readonly ChainLink[] | ChainInput): Result<LinkChainResult> | Result<ChainResult> {
  return Array.isArray(input) ? solveLinks(input as readonly ChainLink[]) : solveAmplifier(input as ChainInput);
}
