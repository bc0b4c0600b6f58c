import { evaluateSheet } from '@/shared/engine/evaluate';
import { REFERENCE_SAIL_OPTICS, UPDATED_SAIL_OPTICS_2015 } from '@/shared/sail/optics';
import { squareSailTemplate } from '@/shared/templates';

const opticalRows = [
  'reflectivity',
  'specular_fraction',
  'emissivity_front',
  'emissivity_back',
  'nonlambertian_front',
  'nonlambertian_back',
];

/** The square-sail sheet with its six optical rows taken from the given set of the materials library. */
function withOpticalSet(id: string) {
  const sheet = squareSailTemplate();
  return {
    ...sheet,
    parameters: sheet.parameters.map((parameter) =>
      opticalRows.includes(parameter.key) && parameter.material !== undefined
        ? { ...parameter, material: { ...parameter.material, id } }
        : parameter,
    ),
  };
}

/** Radiative equilibrium of an opaque flat film facing the Sun at 1 AU (McInnes 1999, ch. 2), computed here. */
function equilibriumKelvin(optics: typeof REFERENCE_SAIL_OPTICS): number {
  return Math.pow(((1 - optics.reflectivity) * 1361) / (5.670374419e-8 * (optics.emissivityFront + optics.emissivityBack)), 0.25);
}

describe('optical sets', () => {
  it('reads the 1999 reference set by default', () => {
    const { values, errors } = evaluateSheet(squareSailTemplate());
    expect(errors).toEqual([]);
    expect(values.reflectivity?.value).toBe(REFERENCE_SAIL_OPTICS.reflectivity);
    expect(values.emissivity_back?.value).toBe(REFERENCE_SAIL_OPTICS.emissivityBack);
    // McInnes 1999 ch. 2 (from memory): about 263 K at 1 AU with these coefficients.
    expect(values.sail_temperature?.value).toBeCloseTo(equilibriumKelvin(REFERENCE_SAIL_OPTICS), 8);
    expect(values.sail_temperature?.value).toBeCloseTo(263, 0);
  });

  it('switches all six rows to the 2015 update by the material the rows name, which runs about 29 K hotter at 1 AU', () => {
    // Heaton & Artusio-Glimpse 2015, AIAA SPACE 2015 (from memory): r 0.91, ε_f 0.025, ε_b 0.27, B_b 0.67.
    const reference = evaluateSheet(withOpticalSet('sail-optics-1999'));
    const updated = evaluateSheet(withOpticalSet('sail-optics-2015'));
    expect(updated.errors).toEqual([]);
    expect(opticalRows.map((key) => updated.values[key]?.value)).toEqual([0.91, 0.94, 0.025, 0.27, 0.79, 0.67]);
    expect(updated.values.sail_temperature?.value).toBeCloseTo(equilibriumKelvin(UPDATED_SAIL_OPTICS_2015), 8);
    const hotter = (updated.values.sail_temperature?.value ?? 0) - (reference.values.sail_temperature?.value ?? 0);
    expect(hotter).toBeCloseTo(29, 0);
  });

  it('says the temperature assumes an opaque film', () => {
    const row = squareSailTemplate().parameters.find((parameter) => parameter.key === 'sail_temperature');
    expect(row?.note).toMatch(/opaque film/);
  });
});
