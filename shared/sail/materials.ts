import { REFERENCE_SAIL_OPTICS, REFERENCE_SAIL_OPTICS_SOURCE } from '@/shared/sail/optics';

/** A material property value in SI with its unit (mathjs syntax) and its source. */
export interface SourcedValue {
  readonly value: number;
  readonly unit: string;
  readonly source: string;
}

/** The properties a material may carry. Optical ones describe the material as a sail face. */
export type MaterialPropertyName =
  'density' | 'temperatureLimit' | 'reflectivity' | 'specularFraction' | 'emissivity' | 'nonLambertian';

/** What the material is used for on a sail craft. */
export type MaterialKind = 'film' | 'coating' | 'boom';

/** One entry of the materials library. */
export interface Material {
  readonly id: string;
  readonly name: string;
  readonly kind: MaterialKind;
  readonly properties: Readonly<Partial<Record<MaterialPropertyName, SourcedValue>>>;
}

const KAPTON_HN = 'DuPont Kapton HN polyimide film datasheet (from memory)';
const MYLAR = 'DuPont Teijin Films Mylar polyester film datasheet (from memory)';
const CRC = 'CRC Handbook of Chemistry and Physics, density of the elements at 20 °C (from memory)';
const OPTICS = `${REFERENCE_SAIL_OPTICS_SOURCE}, as the sail's front (aluminium) or back (chromium) face`;

function density(value: number, source: string): SourcedValue {
  return { value, unit: 'kg/m^3', source };
}

function dimensionless(value: number, source: string): SourcedValue {
  return { value, unit: '', source };
}

/** Materials library: sail films, coatings and boom materials, every value with its source. */
export const materials: readonly Material[] = [
  {
    id: 'polyimide',
    name: 'Polyimide film (Kapton HN type)',
    kind: 'film',
    properties: {
      density: density(1420, KAPTON_HN),
      // Continuous service up to about 400 °C.
      temperatureLimit: { value: 673.15, unit: 'K', source: KAPTON_HN },
    },
  },
  {
    id: 'pet',
    name: 'Polyester film (PET, Mylar type)',
    kind: 'film',
    properties: {
      density: density(1390, MYLAR),
      // Service up to about 150 °C.
      temperatureLimit: { value: 423.15, unit: 'K', source: MYLAR },
    },
  },
  {
    id: 'aluminium',
    name: 'Aluminium coating (vapour-deposited, sail front)',
    kind: 'coating',
    properties: {
      density: density(2700, CRC),
      reflectivity: dimensionless(REFERENCE_SAIL_OPTICS.reflectivity, OPTICS),
      specularFraction: dimensionless(REFERENCE_SAIL_OPTICS.specularFraction, OPTICS),
      emissivity: dimensionless(REFERENCE_SAIL_OPTICS.emissivityFront, OPTICS),
      nonLambertian: dimensionless(REFERENCE_SAIL_OPTICS.nonLambertianFront, OPTICS),
    },
  },
  {
    id: 'chromium',
    name: 'Chromium coating (emissive, sail back)',
    kind: 'coating',
    properties: {
      density: density(7190, CRC),
      emissivity: dimensionless(REFERENCE_SAIL_OPTICS.emissivityBack, OPTICS),
      nonLambertian: dimensionless(REFERENCE_SAIL_OPTICS.nonLambertianBack, OPTICS),
    },
  },
  {
    id: 'cfrp',
    name: 'Carbon-fibre reinforced polymer laminate (about 60 % fibre volume)',
    kind: 'boom',
    properties: {
      density: density(1600, 'Typical carbon/epoxy laminate at about 60 % fibre volume (common practice)'),
    },
  },
  {
    id: 'stainless-steel',
    name: 'Stainless steel, austenitic (304 type), for tape-spring booms',
    kind: 'boom',
    properties: {
      density: density(8000, 'ASM Handbook, AISI 304 stainless steel (from memory)'),
    },
  },
  {
    id: 'beryllium-copper',
    name: 'Beryllium copper (C17200 type), for tape-spring booms',
    kind: 'boom',
    properties: {
      density: density(8250, 'ASM Handbook, C17200 beryllium copper (from memory)'),
    },
  },
];

/**
 * One property of one material of the library.
 * @param id material id (e.g. 'polyimide')
 * @param property property name (e.g. 'density', 'temperatureLimit')
 * @returns the value in SI with its unit and source, or undefined when the material is not in the
 *   library or has no published value for that property
 */
export function materialProperty(id: string, property: string): SourcedValue | undefined {
  const material = materials.find((m) => m.id === id);
  if (!material) return undefined;
  const properties: Readonly<Record<string, SourcedValue | undefined>> = material.properties;
  return Object.prototype.hasOwnProperty.call(properties, property) ? properties[property] : undefined;
}
