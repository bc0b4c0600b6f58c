import type { AllowancePreset, BudgetIssue } from '@/shared/budget/types';

type Unknown = Record<string, unknown>;

function isRecord(value: unknown): value is Unknown {
  return typeof value === 'object' && value !== null && !Array.isArray(value);
}

function checkText(object: Unknown, field: string, issues: BudgetIssue[]): void {
  const value = object[field];
  if (typeof value !== 'string' || value.trim() === '') {
    issues.push({ path: field, message: 'must be a non-empty text' });
  }
}

/** Checks a list of {id, label}; returns the ids of its valid entries. */
function checkIdList(object: Unknown, field: string, issues: BudgetIssue[]): string[] {
  const list = object[field];
  if (!Array.isArray(list) || list.length === 0) {
    issues.push({ path: field, message: 'must be a non-empty list of { id, label }' });
    return [];
  }
  const ids: string[] = [];
  list.forEach((entry: unknown, index) => {
    const where = `${field}[${index}]`;
    if (!isRecord(entry) || typeof entry.id !== 'string' || !/^[a-z][a-z0-9_-]*$/.test(entry.id)) {
      issues.push({ path: `${where}.id`, message: 'must be an id of lower-case letters, digits, _ or -' });
      return;
    }
    if (typeof entry.label !== 'string' || entry.label.trim() === '') {
      issues.push({ path: `${where}.label`, message: 'must be a non-empty text' });
    }
    if (ids.includes(entry.id)) issues.push({ path: `${where}.id`, message: `duplicate id '${entry.id}'` });
    else ids.push(entry.id);
  });
  return ids;
}

function checkTable(table: unknown, maturities: string[], categories: string[], issues: BudgetIssue[]): void {
  if (!isRecord(table)) {
    issues.push({ path: 'table', message: 'must map each maturity to its row of allowances' });
    return;
  }
  for (const key of Object.keys(table)) {
    if (!maturities.includes(key)) issues.push({ path: `table.${key}`, message: `'${key}' is not a maturity of this preset` });
  }
  for (const maturity of maturities) {
    const row = table[maturity];
    if (!isRecord(row)) {
      issues.push({ path: `table.${maturity}`, message: 'missing row of allowances for this maturity' });
      continue;
    }
    for (const key of Object.keys(row)) {
      if (!categories.includes(key)) {
        issues.push({
          path: `table.${maturity}.${key}`,
          message: `'${key}' is not a category of this preset`,
        });
      }
    }
    for (const category of categories) {
      const cell = row[category];
      if (typeof cell !== 'number' || !Number.isFinite(cell) || cell < 0 || cell > 1) {
        issues.push({
          path: `table.${maturity}.${category}`,
          message: `must be an allowance fraction in [0, 1] (0–100 %), got ${cell === undefined ? 'nothing' : JSON.stringify(cell)}`,
        });
      }
    }
  }
}

/**
 * Checks a user-edited allowance preset without throwing.
 * @param value candidate preset (e.g. parsed JSON)
 * @returns the problems found, each with the path of the field or cell (e.g. "table.layout.harness");
 *   empty when the value is a valid AllowancePreset
 */
export function validatePreset(value: unknown): BudgetIssue[] {
  if (!isRecord(value)) return [{ path: '', message: 'a preset must be an object' }];
  const issues: BudgetIssue[] = [];
  for (const field of ['id', 'name', 'source', 'caveat']) checkText(value, field, issues);
  const maturities = checkIdList(value, 'maturities', issues);
  const categories = checkIdList(value, 'categories', issues);
  checkTable(value.table, maturities, categories, issues);
  const margin = value.systemMarginPercent;
  if (typeof margin !== 'number' || !Number.isFinite(margin) || margin < 0 || margin >= 100) {
    issues.push({ path: 'systemMarginPercent', message: 'must be a percentage in [0, 100)' });
  }
  if (value.systemMarginBasis !== 'allocation' && value.systemMarginBasis !== 'predicted') {
    issues.push({ path: 'systemMarginBasis', message: "must be 'allocation' or 'predicted' (what the system margin is a share of)" });
  }
  if (value.notice !== undefined && typeof value.notice !== 'string') {
    issues.push({ path: 'notice', message: 'must be a text when given' });
  }
  return issues;
}

/**
 * Narrows a value to an AllowancePreset when validatePreset finds no problem.
 * @param value candidate preset
 * @returns true when the value is a valid preset
 */
export function isValidPreset(value: unknown): value is AllowancePreset {
  return validatePreset(value).length === 0;
}
