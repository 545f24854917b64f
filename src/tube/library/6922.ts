import { defineTube } from '../defineTube';
import { spec6DJ8 } from './6DJ8';

/**
 * 6922 (E88CC): the long-life 6DJ8. Same electrode structure and typical
 * figures, so the same model; a higher plate rating and a lower heater
 * current. Values SI (V, A, Ω, S, F, W).
 */
export const tube6922 = defineTube({
  ...spec6DJ8,
  id: '6922',
  description: 'Long-life frame-grid twin triode (E88CC); the 6DJ8 with a higher plate rating.',
  heaters: [{ wiring: 'single', volts: 6.3, amps: 0.3, source: 'from memory' }],
  ratings: { ...spec6DJ8.ratings, maxPlateVoltage: 220, source: 'E88CC/6922, from memory' },
  typical: [{ ...spec6DJ8.typical[0]!, source: 'Philips E88CC typical: from memory' }],
});
