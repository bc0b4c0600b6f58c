import fs from 'node:fs';
import path from 'node:path';
import convert, { type Unit } from 'convert-units';
import { create, all } from 'mathjs';
import { HyperFormula } from 'hyperformula';
import {
  compatibleUnits,
  formatDimension,
  fromSI,
  normalizeUnitText,
  parseQuantity,
  parseUnit,
  sameDimension,
  siPrefixes,
  toSI,
  unitDefinitions,
} from '@/shared/engine/units';
import { hyperFormulaConfig } from '@/shared/engine/hyperformula-cells';
import { parameterKeyProblem } from '@/shared/schemas/sheet';

// An independent implementation of units, used here as a reference for factors only.
const math = create({ ...all });

function si(value: number, unit: string): number {
  const parsed = parseUnit(unit);
  if (!parsed.ok) throw new Error(parsed.message);
  return toSI(value, parsed.value);
}

describe('units', () => {
  // Each pair: our unit text, convert-units' name of the same unit, its SI unit in convert-units.
  it.each([
    ['mm', 'mm', 'm'],
    ['km', 'km', 'm'],
    ['ft', 'ft', 'm'],
    ['mi', 'mi', 'm'],
    ['g', 'g', 'kg'],
    ['mg', 'mg', 'kg'],
    ['lb', 'lb', 'kg'],
    ['tonne', 'mt', 'kg'],
    ['cm^2', 'cm2', 'm2'],
    ['ha', 'ha', 'm2'],
    ['km^2', 'km2', 'm2'],
    ['L', 'l', 'm3'],
    ['cm^3', 'cm3', 'm3'],
    ['deg', 'deg', 'rad'],
    ['arcmin', 'arcmin', 'rad'],
    ['km/h', 'km/h', 'm/s'],
    ['kPa', 'kPa', 'Pa'],
    ['psi', 'psi', 'Pa'],
    ['kW', 'kW', 'W'],
  ] as [string, Unit, Unit][])('converts %s to SI as convert-units does', (ours, theirs, siName) => {
    const reference = convert(3.7).from(theirs).to(siName);
    // convert-units rounds its imperial factors to about 6 digits (1 ft = 1/3.28084 m); ours are the exact ones.
    expect(Math.abs(si(3.7, ours) - reference)).toBeLessThanOrEqual(1e-6 * Math.abs(reference));
  });

  it('converts temperatures with their offsets as convert-units does', () => {
    expect(si(400, 'degC')).toBeCloseTo(convert(400).from('C').to('K'), 9);
    expect(si(212, 'degF')).toBeCloseTo(convert(212).from('F').to('K'), 9);
    const degC = parseUnit('degC');
    if (!degC.ok) throw new Error(degC.message);
    expect(fromSI(673.15, degC.value)).toBeCloseTo(400, 9);
  });

  // mathjs is the reference for compound units: our factor must equal its own conversion.
  it.each([
    'um',
    'nm',
    'g/m',
    'g/m^2',
    'kg/m^3',
    'mm/s^2',
    'W/m^2',
    'W/(m^2 K^4)',
    'm^3/s^2',
    'N',
    'uN',
    'kJ',
    'h',
    'day',
    'kohm',
    'mL',
    'lbf',
    'keV',
    'arcsec',
    'W/m^2 K',
    'm/s/s',
    'kg*m^2',
    '1/s',
  ])('converts %s to SI as mathjs does', (unit) => {
    expect(si(2.5, unit)).toBeCloseTo(math.unit(2.5, unit).toSI().toNumber(), 15);
  });

  it('defines the astronomical unit (IAU 2012 Resolution B2: 149 597 870 700 m exactly)', () => {
    expect(si(1, 'AU')).toBe(149_597_870_700);
  });

  it('defines percent and ppm as pure numbers', () => {
    expect(si(15, 'percent')).toBeCloseTo(0.15, 15);
    expect(si(3, 'ppm')).toBeCloseTo(3e-6, 20);
    expect(formatDimension(dimensionOf('percent'))).toBe('dimensionless');
  });

  it('normalises what engineers type', () => {
    expect(normalizeUnitText(' µm ')).toBe('um');
    expect(normalizeUnitText('kg·m²/s³')).toBe('kg m^2/s^3');
    expect(normalizeUnitText('s⁻¹')).toBe('s^-1');
    expect(normalizeUnitText('kΩ')).toBe('kohm');
    expect(normalizeUnitText('°C')).toBe('degC');
    expect(normalizeUnitText('°')).toBe('deg');
    expect(si(2, 'μm')).toBeCloseTo(2e-6, 18);
  });

  it('reads "/" as dividing by the next factor only, and brackets as a group', () => {
    expect(formatDimension(dimensionOf('W/m^2 K'))).toBe('kg s^-3 K');
    expect(formatDimension(dimensionOf('W/(m^2 K)'))).toBe('kg s^-3 K^-1');
    expect(formatDimension(dimensionOf('1/s'))).toBe('s^-1');
    expect(formatDimension(dimensionOf('m^0.5'))).toBe('m^0.5');
  });

  it('keeps the offset of a temperature scale only when it stands alone', () => {
    expect(si(0, 'degC')).toBeCloseTo(273.15, 12);
    expect(si(2, 'W/degC')).toBe(2);
  });

  // SI Brochure, 9th edition: prefixes on the gram (never the kilogram), an exact spelling before a prefixed one.
  it('reads prefixes as the SI does', () => {
    expect(si(1, 'kg')).toBe(1);
    expect(si(3, 'Mg')).toBeCloseTo(3000, 9);
    expect(si(1, 'dam')).toBeCloseTo(10, 12);
    expect(si(1, 'min')).toBe(60);
    expect(si(1, 'Pa')).toBe(1);
    expect(si(1, 'cd')).toBe(1);
    expect(si(2, 'mmol')).toBeCloseTo(2e-3, 15);
  });

  it('names dimensions in SI base units', () => {
    expect(formatDimension(dimensionOf('N'))).toBe('kg m s^-2');
    expect(formatDimension(dimensionOf('W/(m^2 K^4)'))).toBe('kg s^-3 K^-4');
    expect(formatDimension(dimensionOf(''))).toBe('dimensionless');
    expect(formatDimension(dimensionOf('deg'))).toBe('rad');
  });

  it('refuses unknown units with a message of our own naming the unit and the part that is wrong', () => {
    expect(refusal('furlong per fortnight')).toBe('unknown unit "furlong per fortnight": "furlong" is not in Trimsheet\'s list of units');
    expect(refusal('mdeg')).toBe('unknown unit "mdeg": "deg" takes no prefix, so "mdeg" is not a unit');
    expect(refusal('kkg')).toBe('unknown unit "kkg": "kkg" is not in Trimsheet\'s list of units');
    expect(refusal('m/')).toBe('unknown unit "m/": "/" must be followed by a unit');
    expect(refusal('(m s')).toBe('unknown unit "(m s": a "(" is not closed');
    expect(refusal('m^x')).toBe('unknown unit "m^x": "^" must be followed by a number');
    expect(refusal('m)')).toBe('unknown unit "m)": unexpected ")" at character 2');
  });

  // Units other tools accept that the list leaves out: the list is what Trimsheet documents, nothing more.
  it.each(['mile', 'hectare', 'ton', 'Wh', 'l', 'gram', 'meter', 'inch', 'bar', 'atm', 'kt', 'Da', 'mmin', 'kdegC'])(
    'refuses %s, which the documented list does not hold',
    (unit) => {
      expect(parseUnit(unit).ok).toBe(false);
    },
  );

  it('parses quantities with and without a unit', () => {
    expect(parseQuantity('60 m')).toMatchObject({ ok: true, value: { value: 60 } });
    expect(parseQuantity('-2.5e-3')).toEqual({ ok: true, value: { value: -0.0025, unit: undefined } });
    expect(parseQuantity('2.5um')).toMatchObject({ ok: true, value: { value: 2.5 } });
    expect(parseQuantity('sixty').ok).toBe(false);
    expect(parseQuantity('3 parsec-ish').ok).toBe(false);
  });
});

describe('parameter keys', () => {
  // HyperFormula is the judge of which names are usable as spreadsheet names.
  const hf = HyperFormula.buildEmpty(hyperFormulaConfig(1));
  afterAll(() => hf.destroy());

  it.each(['sail_side', 'boom_count', 'solar_irradiance_1au', 'film_thickness', 'x', 'rate_1', 'area', 'r', 'c', 'rx'])(
    'accepts %s, as HyperFormula does',
    (key) => {
      expect(parameterKeyProblem(key)).toBeUndefined();
      expect(hf.isItPossibleToAddNamedExpression(key, '=1')).toBe(true);
    },
  );

  it.each(['boom2', 'r1', 'rc', 'c2', 'r1c1', 'rc3', 'ab12', 'log10'])(
    'refuses %s, which HyperFormula reads as a cell reference',
    (key) => {
      expect(parameterKeyProblem(key)).toBeDefined();
      expect(hf.isItPossibleToAddNamedExpression(key, '=1')).toBe(false);
    },
  );

  it.each(['Sail_side', '1abc', 'sail-side', 'sail side', ''])('refuses %s, which is not snake_case', (key) => {
    expect(parameterKeyProblem(key)).toMatch(/snake_case/);
  });
});

function refusal(unit: string): string {
  const parsed = parseUnit(unit);
  if (parsed.ok) throw new Error(`${unit} was accepted`);
  return parsed.message;
}

function dimensionOf(unit: string): readonly number[] {
  const parsed = parseUnit(unit);
  if (!parsed.ok) throw new Error(parsed.message);
  return parsed.value.dimension;
}

describe('compatibleUnits', () => {
  it('offers the row unit first, then common units of its dimension only', () => {
    const mass = compatibleUnits('kg');
    expect(mass[0]).toBe('kg');
    expect(mass).toEqual(expect.arrayContaining(['g', 'tonne']));
    expect(mass).not.toContain('m');
    expect(compatibleUnits('mm/s^2').slice(0, 2)).toEqual(['mm/s^2', 'm/s^2']);
    expect(compatibleUnits('')).toEqual(['', 'percent', 'ppm']);
    expect(compatibleUnits('degC')).toEqual(['degC', 'K', 'degF']);
  });

  it('keeps a unit outside the picker first and adds the picker units of its dimension', () => {
    expect(compatibleUnits('mi')).toEqual(expect.arrayContaining(['mi', 'm', 'km']));
    expect(compatibleUnits('mi')[0]).toBe('mi');
  });

  it('offers only the unit itself when it is unknown', () => {
    expect(compatibleUnits('furlongz')).toEqual(['furlongz']);
  });

  it('offers units that all parse and share the dimension of the first', () => {
    for (const unit of ['m', 'kg/m^3', 'g/m^2', 'N', 'W/m^2', 'rad', 'AU', 'um']) {
      const offered = compatibleUnits(unit);
      const first = parseUnit(unit);
      if (!first.ok) throw new Error(first.message);
      for (const candidate of offered) {
        const parsed = parseUnit(candidate);
        expect(parsed.ok && sameDimension(parsed.value.dimension, first.value.dimension)).toBe(true);
      }
    }
  });
});

/** The rows of the tables under the headings of docs/units.md whose first cell is a spelling in backquotes. */
function documentedRows(): { heading: string; spellings: string[]; cells: string[] }[] {
  const text = fs.readFileSync(path.resolve(__dirname, '..', '..', '..', 'docs', 'units.md'), 'utf8');
  let heading = '';
  return text.split('\n').flatMap((line) => {
    if (line.startsWith('## ')) heading = line.slice(3).trim();
    if (!line.startsWith('| `')) return [];
    const cells = line
      .split('|')
      .slice(1, -1)
      .map((cell) => cell.trim());
    const spellings = [...(cells[0] ?? '').matchAll(/`([^`]+)`/g)].map((match) => match[1] ?? '');
    return [{ heading, spellings, cells }];
  });
}

describe('the documented unit list (docs/units.md)', () => {
  const rows = documentedRows();

  it('lists exactly the SI prefixes the engine reads, in the same order', () => {
    const documented = rows.filter((row) => row.heading === 'Prefixes').flatMap((row) => row.spellings);
    expect(documented).toEqual(siPrefixes.map((prefix) => prefix.ascii));
    expect(documented).toHaveLength(20);
  });

  it('lists exactly the units the engine accepts, with their spellings and whether they take prefixes', () => {
    const documented = rows
      .filter((row) => row.heading !== 'Prefixes')
      .map((row) => ({ spellings: row.spellings, prefixes: row.cells[row.cells.length - 1] === 'yes' }));
    expect(documented).toEqual(unitDefinitions.map((unit) => ({ spellings: [...unit.spellings], prefixes: unit.prefixes })));
  });

  it('names the extras the issue of our own notation asks for, with their sources', () => {
    const au = rows.find((row) => row.spellings.includes('AU'));
    expect(au?.cells.join(' ')).toContain('IAU 2012 Resolution B2');
    for (const extra of ['deg', 'percent', 'ppm']) expect(rows.some((row) => row.spellings.includes(extra))).toBe(true);
  });

  it('accepts every documented spelling, with every prefix where the list allows them and none where it does not', () => {
    for (const unit of unitDefinitions) {
      for (const spelling of unit.spellings) {
        expect(parseUnit(spelling).ok).toBe(true);
        for (const prefix of siPrefixes) {
          const prefixed = `${prefix.ascii}${spelling}`;
          // A prefixed spelling that is itself a unit of the list ("min", "ha", "Pa", "ft") is that unit.
          if (unitDefinitions.some((other) => other.spellings.includes(prefixed))) continue;
          expect([prefixed, parseUnit(prefixed).ok]).toEqual([prefixed, unit.prefixes]);
        }
      }
    }
  });
});
