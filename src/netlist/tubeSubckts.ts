import type { KorenTriodeParams } from '../tube/types';

/**
 * Koren's laws as SPICE subcircuits (N. Koren, "Improved vacuum tube models
 * for SPICE simulations", 1996/2003): the triode in the signed form
 * (1 + sgn E1)·|E1|^ex / kg1 that his SPICE models write as (PWR + PWRS)/KG1,
 * the pentode as his plate and screen sources. Behavioural current sources in
 * ngspice's syntax (B-sources with `pwr`, `sgn`, `.func`).
 */
const g = (x: number) => x.toPrecision(12);

export interface SpiceCaps {
  readonly cgk: number;
  readonly cgp: number;
  readonly cpk: number;
}

/** The grid-current law (src/tube/gridCurrent.ts) as a B-source: onset, cathode kT/e and the tube's Rgrid. */
export interface SpiceGridCurrent {
  readonly onset: number;
  readonly vt: number;
  readonly rgrid: number;
}

export function triodeSubckt(name: string, p: KorenTriodeParams, caps?: SpiceCaps, grid?: SpiceGridCurrent): string {
  return [
    `.subckt ${name} plate grid cathode`,
    `.param mu=${g(p.mu)} ex=${g(p.ex)} kg1=${g(p.kg1)} kp=${g(p.kp)} kvb=${g(p.kvb)}`,
    `.func e1(vp,vg) = (vp/kp)*ln(1+exp(kp*(1/mu + vg/sqrt(kvb + vp*vp))))`,
    `B1 plate cathode I = (1 + sgn(e1(v(plate,cathode),v(grid,cathode)))) * pwr(e1(v(plate,cathode),v(grid,cathode)),ex)/kg1`,
    ...(grid ? [`BG grid cathode I = pwr(${g(grid.vt)}*ln(1+exp((v(grid,cathode)-(${g(grid.onset)}))/${g(grid.vt)})),1.5)/${g(grid.rgrid)}`] : []),
    ...(caps ? [`CGK grid cathode ${g(caps.cgk)}`, `CGP grid plate ${g(caps.cgp)}`, `CPK plate cathode ${g(caps.cpk)}`] : []),
    `.ends ${name}`,
  ].join('\n');
}

export function pentodeSubckt(p: { mu: number; ex: number; kg1: number; kg2: number; kp: number; kvb: number }): string {
  return [
    '.subckt pent plate screen grid cathode',
    `.param mu=${g(p.mu)} ex=${g(p.ex)} kg1=${g(p.kg1)} kg2=${g(p.kg2)} kp=${g(p.kp)} kvb=${g(p.kvb)}`,
    '.func e1(vs,vg) = (vs/kp)*ln(1+exp(kp*(1/mu + vg/vs)))',
    'B1 plate cathode I = (1 + sgn(e1(v(screen,cathode),v(grid,cathode)))) * pwr(e1(v(screen,cathode),v(grid,cathode)),ex)/kg1 * atan(v(plate,cathode)/kvb)',
    'B2 screen cathode I = 0.5*(1 + sgn(v(grid,cathode) + v(screen,cathode)/mu)) * pwr(v(grid,cathode) + v(screen,cathode)/mu, ex)/kg2',
    '.ends pent',
  ].join('\n');
}
