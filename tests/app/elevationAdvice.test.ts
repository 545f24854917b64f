import { describe, expect, it } from 'vitest';
import { elevationAdvice, keepsWithin, remedyWords, wholeVoltsSuggested } from '../../app/ui/panels/elevationAdvice';

// Windows of our own making, in volts.
describe('the heater elevation in words and in whole volts', () => {
  it('rounds the suggestion to whole volts inside the window, and keeps a window under a volt wide to its edge', () => {
    expect(wholeVoltsSuggested({ lo: 23.2, hi: 108, suggested: 31.7, groundedOk: false })).toBe(32);
    expect(wholeVoltsSuggested({ lo: 23.2, hi: 23.4, suggested: 23.22, groundedOk: false })).toBe(23.2);
    expect(wholeVoltsSuggested({ lo: null, hi: 105, suggested: 0, groundedOk: true })).toBe(0);
  });

  it('says whether a held value keeps every stage inside, and never offers a potential below ground', () => {
    const e = { lo: -179, hi: 105, suggested: 0, groundedOk: true };
    expect(keepsWithin(e, 60)).toBe(true);
    expect(keepsWithin(e, 106)).toBe(false);
    expect(elevationAdvice(e, 60)).toBe('With the heaters held at 60 V, every stage is within its heater–cathode rating (anywhere up to 105 V would do).');
    expect(elevationAdvice({ lo: 23.2, hi: 108, suggested: 31.7, groundedOk: false }, 150)).toBe('Held at 150 V, the heaters leave a stage past its heater–cathode rating: hold them anywhere from 23.2 V to 108 V (about 31.7 V).');
    // Where ground will do, the remedy says so, not "about 0 V".
    expect(elevationAdvice(e, 150)).toBe('Held at 150 V, the heaters leave a stage past its heater–cathode rating: hold them anywhere up to 105 V, or return them to ground.');
    expect(remedyWords(e)).toBe('Return them to ground');
    expect(remedyWords({ lo: 23.2, hi: 108, suggested: 31.7, groundedOk: false })).toBe('Hold them at 32 V');
  });
});
