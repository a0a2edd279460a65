import { describe, expect, it } from 'vitest';
import { parseConditions } from './conditions';

describe('parseConditions', () => {
  it('reads 800 W/m² and a module at 45,5 °C typed with a decimal comma', () => {
    expect(parseConditions({ irradianceWm2: '800', moduleTempC: '45,5' })).toEqual({ value: { irradianceWm2: 800, moduleTempC: 45.5 }, errors: {} });
  });

  it('names each field that is out of range or blank', () => {
    const { value, errors } = parseConditions({ irradianceWm2: '20', moduleTempC: '' });
    expect(value).toBeNull();
    expect(errors).toEqual({ irradianceWm2: 'Use at least 100 W/m²', moduleTempC: 'Enter the module temperature in °C' });
  });
});
