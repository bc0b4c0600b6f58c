import {
  REFERENCE_SAIL_OPTICS,
  REFERENCE_SAIL_OPTICS_SOURCE,
  UPDATED_SAIL_OPTICS_2015,
  UPDATED_SAIL_OPTICS_2015_SOURCE,
  type OpticalCoefficients,
} from '@/shared/sail/optics';

/** A material property value in SI with its unit (Trimsheet notation, docs/units.md) and its source. */
export interface SourcedValue {
  readonly value: number;
  readonly unit: string;
  readonly source: string;
}

/** The properties a material may carry. Optical ones describe the material as a sail face. */
export type MaterialPropertyName =
  | 'density'
  | 'temperatureLimit'
  | 'longTermTemperatureLimit'
  | 'reflectivity'
  | 'specularFraction'
  | 'emissivity'
  | 'nonLambertian'
  | 'emissivityFront'
  | 'emissivityBack'
  | 'nonLambertianFront'
  | 'nonLambertianBack';

/** What the material is used for on a sail craft; an optical set describes a whole coated sail's faces. */
export type MaterialKind = 'film' | 'coating' | 'boom' | 'optical-set';

/** One entry of the materials library. */
export interface Material {
  readonly id: string;
  readonly name: string;
  readonly kind: MaterialKind;
  readonly properties: Readonly<Partial<Record<MaterialPropertyName, SourcedValue>>>;
}

const POLYIMIDE = "Manufacturer's datasheet of PMDA-ODA polyimide film (from memory)";
const POLYIMIDE_LIFE =
  "Manufacturer's datasheet of PMDA-ODA polyimide film, service life in air (from memory): about 8 years at 250 °C against about 12 hours at 400 °C";
const PET = "Manufacturer's datasheet of biaxially oriented PET film (from memory)";
const CRC = 'CRC Handbook of Chemistry and Physics, density of the elements at 20 °C (from memory)';
const OPTICS = `${REFERENCE_SAIL_OPTICS_SOURCE}, as the sail's front (aluminium) or back (chromium) face`;

function density(value: number, source: string): SourcedValue {
  return { value, unit: 'kg/m^3', source };
}

function dimensionless(value: number, source: string): SourcedValue {
  return { value, unit: '', source };
}

/** The six optical coefficients of a coated sail as material properties, each with the set's source. */
function opticalSet(optics: OpticalCoefficients, source: string): Material['properties'] {
  return {
    reflectivity: dimensionless(optics.reflectivity, source),
    specularFraction: dimensionless(optics.specularFraction, source),
    emissivityFront: dimensionless(optics.emissivityFront, source),
    emissivityBack: dimensionless(optics.emissivityBack, source),
    nonLambertianFront: dimensionless(optics.nonLambertianFront, source),
    nonLambertianBack: dimensionless(optics.nonLambertianBack, source),
  };
}

/** Materials library: sail films, coatings and boom materials, every value with its source. */
export const materials: readonly Material[] = [
  {
    id: 'polyimide',
    name: 'Polyimide film (PMDA-ODA)',
    kind: 'film',
    properties: {
      density: density(1420, POLYIMIDE),
      // The top of the datasheet's range, about 400 °C: a short-term maximum (hours), not a service limit.
      temperatureLimit: { value: 673.15, unit: 'K', source: `${POLYIMIDE}: short-term maximum, about 400 °C` },
      // Years in sunlight: the datasheet's long service life holds up to about 250 °C.
      longTermTemperatureLimit: { value: 523.15, unit: 'K', source: POLYIMIDE_LIFE },
    },
  },
  {
    id: 'pet',
    name: 'Polyester film (biaxially oriented PET)',
    kind: 'film',
    properties: {
      density: density(1390, PET),
      // Service up to about 150 °C.
      temperatureLimit: { value: 423.15, unit: 'K', source: PET },
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
      density: density(7150, CRC),
      emissivity: dimensionless(REFERENCE_SAIL_OPTICS.emissivityBack, OPTICS),
      nonLambertian: dimensionless(REFERENCE_SAIL_OPTICS.nonLambertianBack, OPTICS),
    },
  },
  {
    id: 'sail-optics-1999',
    name: 'Aluminium-front, chromium-back sail: reference optical set (1999)',
    kind: 'optical-set',
    properties: opticalSet(REFERENCE_SAIL_OPTICS, REFERENCE_SAIL_OPTICS_SOURCE),
  },
  {
    id: 'sail-optics-2015',
    name: 'Aluminium-front, chromium-back sail: updated optical set (2015)',
    kind: 'optical-set',
    properties: opticalSet(UPDATED_SAIL_OPTICS_2015, UPDATED_SAIL_OPTICS_2015_SOURCE),
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
