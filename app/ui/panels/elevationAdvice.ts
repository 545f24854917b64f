import { volts } from '../../format';

/** The heater-elevation advice in words, for the build sheet and the card alike. */
export function elevationAdvice(e: { lo: number | null; hi: number | null; suggested: number; groundedOk: boolean }): string {
  if (e.groundedOk) return 'Heater–cathode voltages are within every rating with the heaters at ground.';
  const range = e.lo !== null && e.hi !== null ? `anywhere from ${volts(e.lo)} to ${volts(e.hi)}` : e.lo !== null ? `anywhere above ${volts(e.lo)}` : `anywhere below ${volts(e.hi ?? 0)}`;
  return `Elevate the heater supply to about ${volts(e.suggested)} DC (${range} keeps every stage within its heater–cathode rating).`;
}
