import { TRIODE_NOISE_RESISTANCE_GM, type ChainInput } from '../../src/index';
import { networkOf, prepareAmplifier } from '../../src/chain/solveAmplifier';

/**
 * ngspice's behavioural tubes make no noise of their own, so for a noise
 * analysis each tube's grid pin goes behind its equivalent noise resistance,
 * a real resistor of 2.5/gm at its operating point (the triode's law the
 * model takes, Valley and Wallman, from memory): `X… grid …` becomes
 * `X… qX…` with `RQX… grid qX… Req`. That resistor is exactly a noise
 * voltage at the grid, which the model carries as gm times it in the plate
 * current. gm is the model's at the chain's operating points (`chain`, as
 * solved: for a loop, the open loop's input with Rk ∥ Rf in its first
 * cathode, whose DC the loop shares).
 */
export function withTubeNoise(netlist: string, chain: ChainInput): string {
  const prepared = prepareAmplifier(chain);
  if (!prepared.ok) throw new Error(prepared.message);
  const reqs = new Map<string, number>();
  networkOf(chain, prepared).stages.forEach((s, i) => {
    reqs.set(`X${i}`, TRIODE_NOISE_RESISTANCE_GM / s.linear.gm);
    reqs.set(`X${i}b`, TRIODE_NOISE_RESISTANCE_GM / (s.linear.second?.gm ?? s.linear.gm));
  });
  return netlist
    .split('\n')
    .flatMap((line) => {
      const parts = line.split(' ');
      const name = parts[0]!;
      const req = reqs.get(name);
      if (req === undefined) return [line];
      // Pins: plate grid cathode for a triode; plate screen grid cathode for a pentode.
      const at = parts[parts.length - 1] === 'pent' ? 3 : 2;
      const grid = parts[at]!;
      parts[at] = `q${name}`;
      return [parts.join(' '), `RQ${name} ${grid} q${name} ${req.toPrecision(12)}`];
    })
    .join('\n');
}
