import { ASTRONOMICAL_UNIT } from '@/shared/sail/constants';
import { radiationPressure } from '@/shared/sail/radiation-pressure';

const AU = ASTRONOMICAL_UNIT.value;

describe('radiationPressure', () => {
  it('is 4.54e-6 N/m^2 on a perfect absorber at 1 AU', () => {
    // McInnes 1999, ch. 2: P = S0 / c; 4.56e-6 N/m^2 there with S0 = 1368 W/m^2 (from memory), 4.54e-6 with IAU 2015 B3 S0 = 1361
    expect(radiationPressure(AU)).toBeCloseTo(4.54e-6, 8);
  });

  it('is 9.08e-6 N/m^2 on a perfect reflector at 1 AU', () => {
    // McInnes 1999, ch. 2: a perfect reflector feels twice the absorber's pressure
    expect(2 * radiationPressure(AU)).toBeCloseTo(9.08e-6, 8);
  });

  it('falls with the inverse square of distance', () => {
    // McInnes 1999, ch. 2: P(r) = P(1 AU) (1 AU / r)^2
    expect(radiationPressure(2 * AU)).toBeCloseTo(radiationPressure(AU) / 4, 15);
    expect(radiationPressure(0.5 * AU) / radiationPressure(AU)).toBeCloseTo(4, 12);
  });

  it.each([0, -AU, Number.NaN, Number.POSITIVE_INFINITY])('refuses distance %p with a RangeError naming it', (d) => {
    expect(() => radiationPressure(d)).toThrow(RangeError);
    expect(() => radiationPressure(d)).toThrow(/radiationPressure: distance/);
  });
});
