/**
 * Number and unit text for screens, the server and documents: a few significant digits for results, no float
 * noise, and units written the way engineers read them (m², µm, %).
 */

const superscripts: Readonly<Record<string, string>> = {
  '-': '⁻',
  '0': '⁰',
  '1': '¹',
  '2': '²',
  '3': '³',
  '4': '⁴',
  '5': '⁵',
  '6': '⁶',
  '7': '⁷',
  '8': '⁸',
  '9': '⁹',
};

function superscript(digits: string): string {
  return [...digits].map((character) => superscripts[character] ?? character).join('');
}

// Outside this range fixed notation needs more than a handful of zeros, so powers of ten read better.
const fixedBelow = 1e6;
const fixedFrom = 1e-3;

// Building a number format costs far more than using one, and every value on screen is formatted.
const fixedFormats = new Map<number, Intl.NumberFormat>();

function fixedFormat(significant: number): Intl.NumberFormat {
  let format = fixedFormats.get(significant);
  if (format === undefined) {
    format = new Intl.NumberFormat('en-US', { maximumSignificantDigits: significant, useGrouping: false });
    fixedFormats.set(significant, format);
  }
  return format;
}

/**
 * A number with at most `significant` significant digits: fixed notation between 0.001 and a million,
 * "4.54 × 10⁻⁶" outside it; "−" for negatives; non-finite numbers as "—".
 */
export function formatNumber(value: number, significant = 4): string {
  if (!Number.isFinite(value)) return '—';
  const sign = value < 0 ? '−' : '';
  const magnitude = Math.abs(value);
  if (magnitude === 0) return '0';
  const rounded = Number(magnitude.toPrecision(significant));
  if (rounded >= fixedFrom && rounded < fixedBelow) return sign + fixedFormat(significant).format(rounded);
  const [mantissa = '', exponent = ''] = rounded.toExponential(significant - 1).split('e');
  const trimmed = mantissa.includes('.') ? mantissa.replace(/0+$/, '').replace(/\.$/, '') : mantissa;
  return `${sign}${trimmed} × 10${superscript(String(Number(exponent)))}`;
}

/** A row's unit as it reads on screen: "m^2" → "m²", "um" → "µm", "percent" → "%", "" → "". */
export function formatUnit(unit: string): string {
  const text = unit.trim();
  if (text === '' || text === '1') return '';
  if (text === 'percent') return '%';
  if (text === 'deg') return '°';
  if (text === 'degC') return '°C';
  return text
    .replace(/\^\((-?\d+)\)|\^(-?\d+)/g, (_, bracketed?: string, bare?: string) => superscript(bracketed ?? bare ?? ''))
    .replace(/\bum\b/g, 'µm')
    .replace(/\*/g, '·');
}

// Units that take an SI prefix as they stand; a value of one of them that would need a power of ten gets a prefix instead.
const prefixable = new Set(['m', 'N', 'W', 'Pa', 'J', 's', 'Hz', 'V', 'A']);
const prefixes: readonly (readonly [number, string])[] = [
  [-12, 'p'],
  [-9, 'n'],
  [-6, 'µ'],
  [-3, 'm'],
  [3, 'k'],
  [6, 'M'],
  [9, 'G'],
];

/** The value and unit with an SI prefix when fixed notation would need a power of ten: 2.5e-6 m → 2.5 µm. */
function withPrefix(value: number, unit: string, significant: number): { value: number; unit: string } {
  const magnitude = Math.abs(Number(value.toPrecision(significant)));
  if (!prefixable.has(unit.trim()) || !Number.isFinite(value) || magnitude === 0 || (magnitude >= fixedFrom && magnitude < fixedBelow)) {
    return { value, unit };
  }
  const exponent = Math.max(-12, Math.min(9, Math.floor(Math.log10(magnitude) / 3) * 3));
  const prefix = prefixes.find(([power]) => power === exponent);
  return prefix === undefined ? { value, unit } : { value: value / 10 ** exponent, unit: `${prefix[1]}${unit.trim()}` };
}

/** A value with its unit, e.g. "1600 m²", "0.07806" for a pure number, "263.2 K", "2.5 µm" for 2.5e-6 m. */
export function formatQuantity(value: number, unit: string, significant = 4): string {
  const prefixed = withPrefix(value, unit, significant);
  const shown = formatUnit(prefixed.unit);
  const number = formatNumber(prefixed.value, significant);
  if (shown === '') return number;
  return shown === '°' ? `${number}°` : `${number} ${shown}`;
}

/**
 * A value as text to edit: all the digits a person typed (up to 12 significant ones, which hides the
 * noise of a unit conversion) and plain "e" notation, so the text parses back to the same number.
 */
export function editText(value: number): string {
  return String(Number(value.toPrecision(12)));
}
