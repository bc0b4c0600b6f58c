import type { Parameter, Sheet } from '@/shared/schemas/sheet';

/**
 * Demo sheets of any size for benchmarks and cross-checks: a tenth of the rows are length
 * inputs in m, km or mm, the rest are formulas over up to three earlier rows nearby, so the
 * dependency cone of one input stays typical of a real sheet. Values stay bounded (means and
 * mixtures of lengths). Deterministic for a given size.
 */
export function syntheticSheet(size: number): Sheet {
  let seed = 12345;
  const random = (): number => {
    seed = (seed * 1103515245 + 12345) % 2147483648;
    return seed / 2147483648;
  };
  const units = ['m', 'km', 'mm'] as const;
  const parameters: Parameter[] = [];
  const pick = (index: number): string => `p_${Math.max(0, index - 1 - Math.floor(random() * Math.min(index, 40)))}`;
  for (let index = 0; index < size; index += 1) {
    const key = `p_${index}`;
    const unit = units[index % units.length] ?? 'm';
    const base = { key, label: `Parameter ${index}`, subsystem: `Group ${index % 7}`, unit };
    if (index < 3 || random() < 0.1) {
      parameters.push({ ...base, value: 1 + Math.floor(random() * 1000) / 10 });
      continue;
    }
    const [a, b, c] = [pick(index), pick(index), pick(index)];
    const shapes = [
      `=(${a} + ${b}) / 2`,
      `=SQRT(${a} * ${b})`,
      `=MAX(${a}, ${b}) * 0.9 + ${c} * 0.1`,
      `=ABS(${a} - ${b}) + ${c}`,
      `=IF(${a} > ${b}, ${a}, ${b}) * 0.5 + MIN(${b}, ${c}) * 0.5`,
      `=(${a} * ${b}) / (${a} + ${b})`,
    ];
    parameters.push({ ...base, formula: shapes[Math.floor(random() * shapes.length)] ?? `=${a}` });
  }
  return { name: `Synthetic sheet of ${size} parameters`, parameters };
}
