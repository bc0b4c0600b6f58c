import { requireInRange } from '@/shared/sail/validate';

/**
 * Optical coefficients of a flat sail (McInnes 1999, ch. 2): reflectivity r, specular
 * fraction s, front and back emissivities ε_f, ε_b, front and back non-Lambertian
 * coefficients B_f, B_b. All dimensionless.
 */
export interface OpticalCoefficients {
  readonly reflectivity: number;
  readonly specularFraction: number;
  readonly emissivityFront: number;
  readonly emissivityBack: number;
  readonly nonLambertianFront: number;
  readonly nonLambertianBack: number;
}

/**
 * Aluminium-front, chromium-back coated polyimide sail. From memory: McInnes 1999,
 * tabulated after Wright 1992 (Space Sailing).
 */
export const REFERENCE_SAIL_OPTICS: OpticalCoefficients = {
  reflectivity: 0.88,
  specularFraction: 0.94,
  emissivityFront: 0.05,
  emissivityBack: 0.55,
  nonLambertianFront: 0.79,
  nonLambertianBack: 0.55,
};

/** Where REFERENCE_SAIL_OPTICS comes from. */
export const REFERENCE_SAIL_OPTICS_SOURCE =
  'McInnes 1999, Solar Sailing, ch. 2, after Wright 1992, Space Sailing (from memory); an update is in Heaton & Artusio-Glimpse, AIAA 2015';

/**
 * Checks a set of optical coefficients: r, s, ε_f, ε_b in [0, 1], ε_f + ε_b > 0,
 * B_f, B_b in [0, 1] (2/3 for a Lambertian surface). Throws a RangeError naming the coefficient.
 */
export function checkOptics(where: string, optics: OpticalCoefficients): OpticalCoefficients {
  requireInRange(where, 'reflectivity', optics.reflectivity, 0, 1);
  requireInRange(where, 'specularFraction', optics.specularFraction, 0, 1);
  requireInRange(where, 'emissivityFront', optics.emissivityFront, 0, 1);
  requireInRange(where, 'emissivityBack', optics.emissivityBack, 0, 1);
  requireInRange(where, 'nonLambertianFront', optics.nonLambertianFront, 0, 1);
  requireInRange(where, 'nonLambertianBack', optics.nonLambertianBack, 0, 1);
  if (optics.emissivityFront + optics.emissivityBack <= 0) {
    throw new RangeError(`${where}: emissivityFront + emissivityBack must be greater than 0, got 0`);
  }
  return optics;
}
