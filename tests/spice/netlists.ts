import type { KorenTriodeParams } from '../../src/index';

/**
 * Netlists for the simulator cross-checks. Koren's triode law as a B-source,
 * in the signed form (1 + sgn E1)·|E1|^ex / kg1 that his SPICE models write as
 * (PWR + PWRS)/KG1. Capacitors of 1 F stand for "large" (bypass, coupling):
 * at 1 kHz their reactance is below 0.2 mΩ, far under any resistance here.
 */
const g = (x: number) => x.toPrecision(12);

export function triodeSubckt(name: string, p: KorenTriodeParams): string {
  return [
    `.subckt ${name} plate grid cathode`,
    `.param mu=${g(p.mu)} ex=${g(p.ex)} kg1=${g(p.kg1)} kp=${g(p.kp)} kvb=${g(p.kvb)}`,
    `.func e1(vp,vg) = (vp/kp)*ln(1+exp(kp*(1/mu + vg/sqrt(kvb + vp*vp))))`,
    `B1 plate cathode I = (1 + sgn(e1(v(plate,cathode),v(grid,cathode)))) * pwr(e1(v(plate,cathode),v(grid,cathode)),ex)/kg1`,
    `.ends ${name}`,
  ].join('\n');
}

export interface SpiceStage {
  readonly params: KorenTriodeParams;
  readonly bplus: number;
  readonly ra: number;
  readonly rk: number;
  readonly bypassed: boolean;
  readonly rl: number;
  readonly vbias: number;
}

/** One common-cathode stage: DC operating point, 1 kHz gain into RL, and output impedance at the plate (RL removed). */
export function stageNetlist(s: SpiceStage, measure: 'gain' | 'zout'): string {
  const lines = [
    '* common-cathode triode stage',
    triodeSubckt('tri', s.params),
    `VB bplus 0 DC ${g(s.bplus)}`,
    `RA bplus plate ${g(s.ra)}`,
    s.rk > 0 ? `RK cathode 0 ${g(s.rk)}` : 'VK cathode 0 DC 0',
    s.rk > 0 && s.bypassed ? 'CK cathode 0 1' : '',
    `VG grid 0 DC ${g(s.vbias)} AC ${measure === 'gain' ? 1 : 0}`,
    'X1 plate grid cathode tri',
    measure === 'gain' && Number.isFinite(s.rl) ? `CO plate out 1\nRL out 0 ${g(s.rl)}` : '',
    measure === 'zout' ? 'IZ 0 plate DC 0 AC 1' : '',
    measure === 'gain' && !Number.isFinite(s.rl) ? 'EO out 0 plate 0 1' : '',
    '.control',
    'set numdgt=12',
    'op',
    'print v(plate) v(cathode) i(vb)',
    'ac lin 1 1000 1000',
    measure === 'gain' ? 'print vr(out) vi(out)' : 'print vr(plate) vi(plate)',
    'quit 0', // ngspice -b exits 1 after a .control block that does not quit
    '.endc',
    '.end',
  ];
  return lines.filter((l) => l !== '').join('\n');
}

export interface SpiceChain {
  readonly stage: SpiceStage;
  readonly follower: { readonly params: KorenTriodeParams; readonly bplus: number; readonly rk: number };
}

/** A gain stage direct-coupled into a cathode follower: chain gain at 1 kHz and the follower's output impedance. */
export function chainNetlist(c: SpiceChain, measure: 'gain' | 'zout'): string {
  const s = c.stage;
  return [
    '* gain stage + direct-coupled cathode follower',
    triodeSubckt('tri1', s.params),
    triodeSubckt('tri2', c.follower.params),
    `VB bplus 0 DC ${g(s.bplus)}`,
    `VB2 bplus2 0 DC ${g(c.follower.bplus)}`,
    `RA bplus plate ${g(s.ra)}`,
    `RK cathode 0 ${g(s.rk)}`,
    s.bypassed ? 'CK cathode 0 1' : '',
    `VG grid 0 DC ${g(s.vbias)} AC ${measure === 'gain' ? 1 : 0}`,
    'X1 plate grid cathode tri1',
    'X2 bplus2 plate out tri2',
    `RK2 out 0 ${g(c.follower.rk)}`,
    measure === 'zout' ? 'IZ 0 out DC 0 AC 1' : '',
    '.control',
    'set numdgt=12',
    'op',
    'print v(plate) v(cathode) v(out) i(vb2)',
    'ac lin 1 1000 1000',
    'print vr(out) vi(out)',
    'quit 0', // ngspice -b exits 1 after a .control block that does not quit
    '.endc',
    '.end',
  ]
    .filter((l) => l !== '')
    .join('\n');
}
