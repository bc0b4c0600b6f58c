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
