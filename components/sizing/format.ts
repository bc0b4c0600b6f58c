/**
 * Number and unit text for the sizing screens: a few significant digits for results, no float
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
  if (rounded >= fixedFrom && rounded < fixedBelow) {
    return sign + new Intl.NumberFormat('en-US', { maximumSignificantDigits: significant, useGrouping: false }).format(rounded);
  }
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

/** A value with its unit, e.g. "1600 m²", "0.07806" for a pure number, "263.2 K". */
export function formatQuantity(value: number, unit: string, significant = 4): string {
  const shown = formatUnit(unit);
  const number = formatNumber(value, significant);
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
