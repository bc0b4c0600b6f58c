import { ASTRONOMICAL_UNIT } from '@/shared/sail/constants';
import { REFERENCE_SAIL_OPTICS, type OpticalCoefficients } from '@/shared/sail/optics';
import { radiationPressure } from '@/shared/sail/radiation-pressure';
import { idealSailForce, opticalSailForce, sailForce } from '@/shared/sail/sail-force';

const AU = ASTRONOMICAL_UNIT.value;
const deg = (d: number): number => (d * Math.PI) / 180;
const perfectReflector: OpticalCoefficients = {
  reflectivity: 1,
  specularFraction: 1,
  emissivityFront: 0.5,
  emissivityBack: 0.5,
  nonLambertianFront: 2 / 3,
  nonLambertianBack: 2 / 3,
};

describe('idealSailForce', () => {
  it('gives about 5.8 N on an 800 m square sail facing the sun at 1 AU', () => {
    // common practice check: 800 m × 800 m at 1 AU, ideal 5.8 N
    expect(idealSailForce(800 * 800, 0, AU)).toBeCloseTo(5.8, 1);
  });

  it('gives about 5.2 N on the same sail at efficiency 0.9, about 5 N as quoted', () => {
    // common practice check: about 5 N; 5.2 N at η = 0.9
    const force = idealSailForce(800 * 800, 0, AU, 0.9);
    expect(force).toBeCloseTo(5.2, 1);
    expect(Math.abs(force - 5)).toBeLessThan(0.5);
  });

  it('falls as cos^2 of the cone angle', () => {
    // McInnes 1999, ch. 2: F = 2 P A cos^2 α
    const facing = idealSailForce(100, 0, AU);
    expect(idealSailForce(100, deg(60), AU)).toBeCloseTo(facing / 4, 12);
    expect(idealSailForce(100, deg(90), AU)).toBeCloseTo(0, 12);
    expect(idealSailForce(100, deg(-60), AU)).toBeCloseTo(facing / 4, 12);
  });

  it('names the bad parameter', () => {
    expect(() => idealSailForce(-1, 0, AU)).toThrow(/idealSailForce: area must not be negative/);
    expect(() => idealSailForce(1, 2, AU)).toThrow(/idealSailForce: coneAngle must be in/);
    expect(() => idealSailForce(1, 0, AU, 1.2)).toThrow(/idealSailForce: efficiency must be in \[0, 1\]/);
    expect(() => idealSailForce(1, 0, -AU)).toThrow(/radiationPressure: distance/);
  });
});

describe('opticalSailForce', () => {
  it('gives F_n(0) / (2 P A) ≈ 0.908 with the tabulated coefficients', () => {
    // McInnes 1999 after Wright 1992 (from memory): r 0.88, s 0.94, ε_f 0.05, ε_b 0.55, B_f 0.79, B_b 0.55 → 0.908
    const force = opticalSailForce(1, 0, AU, REFERENCE_SAIL_OPTICS);
    expect(force.normal / (2 * radiationPressure(AU))).toBeCloseTo(0.908, 3);
    expect(force.transverse).toBe(0);
  });

  it('reduces to the ideal sail for a perfect specular reflector', () => {
    // McInnes 1999, ch. 2: with r = s = 1 the optical model is the ideal sail
    for (const angle of [0, 20, 45, 70]) {
      const optical = opticalSailForce(50, deg(angle), AU, perfectReflector);
      expect(optical.normal).toBeCloseTo(idealSailForce(50, deg(angle), AU), 15);
      expect(optical.transverse).toBeCloseTo(0, 15);
    }
  });

  it('has the transverse component P A (1 − r s) cos α sin α and a force tilted towards the sun line', () => {
    // McInnes 1999, ch. 2: F_t = P A (1 − r s) cos α sin α
    const alpha = deg(40);
    const force = opticalSailForce(10, alpha, AU, REFERENCE_SAIL_OPTICS);
    const expected = radiationPressure(AU) * 10 * (1 - 0.88 * 0.94) * Math.cos(alpha) * Math.sin(alpha);
    expect(force.transverse).toBeCloseTo(expected, 15);
    expect(force.magnitude).toBeCloseTo(Math.hypot(force.normal, force.transverse), 15);
    // The in-plane component pulls the force off the normal towards the sun line: 0 < θ < α.
    expect(force.centreLineAngle).toBeGreaterThan(0);
    expect(force.centreLineAngle).toBeLessThan(alpha);
    expect(Math.hypot(force.radial, force.circumferential)).toBeCloseTo(force.magnitude, 15);
  });

  it('mirrors every signed component for a negative cone angle', () => {
    const up = opticalSailForce(10, deg(30), AU, REFERENCE_SAIL_OPTICS);
    const down = opticalSailForce(10, deg(-30), AU, REFERENCE_SAIL_OPTICS);
    expect(down.normal).toBeCloseTo(up.normal, 15);
    expect(down.radial).toBeCloseTo(up.radial, 15);
    expect(down.circumferential).toBeCloseTo(-up.circumferential, 15);
    expect(down.centreLineAngle).toBeCloseTo(-up.centreLineAngle, 15);
  });

  it('names a bad optical coefficient', () => {
    expect(() => opticalSailForce(1, 0, AU, { ...REFERENCE_SAIL_OPTICS, reflectivity: 1.5 })).toThrow(
      /opticalSailForce: reflectivity must be in \[0, 1\], got 1.5/,
    );
    expect(() =>
      opticalSailForce(1, 0, AU, { ...REFERENCE_SAIL_OPTICS, emissivityFront: 0, emissivityBack: 0 }),
    ).toThrow(/emissivityFront \+ emissivityBack must be greater than 0/);
  });
});

describe('sailForce', () => {
  it('dispatches to the ideal model with no in-plane component', () => {
    const force = sailForce({ kind: 'ideal', efficiency: 0.9 }, 100, deg(30), AU);
    expect(force.normal).toBeCloseTo(idealSailForce(100, deg(30), AU, 0.9), 15);
    expect(force.transverse).toBe(0);
    expect(force.centreLineAngle).toBeCloseTo(deg(30), 12);
  });

  it('dispatches to the optical model', () => {
    const force = sailForce({ kind: 'optical', optics: REFERENCE_SAIL_OPTICS }, 100, deg(30), AU);
    expect(force).toEqual(opticalSailForce(100, deg(30), AU, REFERENCE_SAIL_OPTICS));
  });
});
