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
export const REFERENCE_SAIL_OPTICS_SOURCE = 'McInnes 1999, Solar Sailing, ch. 2, after Wright 1992, Space Sailing (from memory)';

/**
 * The same aluminium-front, chromium-back sail as updated from measurements: reflectivity 0.91, back emissivity
 * 0.27 and back non-Lambertian coefficient 0.67, so it runs about 29 K hotter at 1 AU. From memory: Heaton &
 * Artusio-Glimpse, "An Update to the NASA Reference Solar Sail Thrust Model", AIAA SPACE 2015.
 */
export const UPDATED_SAIL_OPTICS_2015: OpticalCoefficients = {
  reflectivity: 0.91,
  specularFraction: 0.94,
  emissivityFront: 0.025,
  emissivityBack: 0.27,
  nonLambertianFront: 0.79,
  nonLambertianBack: 0.67,
};

/** Where UPDATED_SAIL_OPTICS_2015 comes from. */
export const UPDATED_SAIL_OPTICS_2015_SOURCE =
  'Heaton & Artusio-Glimpse 2015, An Update to the NASA Reference Solar Sail Thrust Model, AIAA SPACE 2015 (from memory)';
