import type { KorenTriodeParams } from './types';

/**
 * Koren's own triode parameter sets (N. Koren, errata file for the Glass Audio
 * 1996 article, Table 1 "SPICE parameters for popular tube models"). Kept so
 * that each library record can say why it uses these or this project's fit.
 */
export const korenPublishedSets: Readonly<Record<string, KorenTriodeParams>> = {
  '12AX7': { mu: 100, ex: 1.4, kg1: 1060, kp: 600, kvb: 300 },
  '12AT7': { mu: 60, ex: 1.35, kg1: 460, kp: 300, kvb: 300 },
  '12AU7': { mu: 21.5, ex: 1.3, kg1: 1180, kp: 84, kvb: 300 },
  '6DJ8': { mu: 28, ex: 1.3, kg1: 330, kp: 320, kvb: 300 },
  '6922': { mu: 28, ex: 1.3, kg1: 330, kp: 320, kvb: 300 },
  '2A3': { mu: 4.2, ex: 1.4, kg1: 1500, kp: 60, kvb: 300 },
  '300B': { mu: 3.95, ex: 1.4, kg1: 1550, kp: 65, kvb: 300 },
};
