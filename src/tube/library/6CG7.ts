import { defineTube } from '../defineTube';
import { spec6SN7 } from './6SN7';

/**
 * 6CG7 (6FQ7): the noval version of the 6SN7, with the same electrode
 * structure and so the same model; lower plate ratings. Values SI.
 */
export const tube6CG7 = defineTube({
  ...spec6SN7,
  id: '6CG7',
  description: 'Noval version of the 6SN7 (6FQ7): twin medium-mu triode.',
  heaters: [{ wiring: 'single', volts: 6.3, amps: 0.6, source: 'from memory' }],
  ratings: {
    maxPlateVoltage: 330,
    maxPlateDissipation: 4.0,
    maxHeaterCathodeVoltage: 200,
    source: 'design-maximum, from memory (dissipation low confidence)',
  },
  capacitances: { ...spec6SN7.capacitances, source: 'assumed as 6SN7 (same electrode structure): from memory' },
  typical: spec6SN7.typical.map((p) => ({ ...p, source: 'typical point: from memory' })),
});
