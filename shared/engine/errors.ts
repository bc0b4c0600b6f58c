/** What can be wrong with one row of a sheet. */
export type EngineErrorCode =
  | 'invalid_key'
  | 'duplicate_key'
  | 'unknown_key'
  | 'unknown_unit'
  | 'syntax_error'
  | 'unknown_function'
  | 'wrong_argument_count'
  | 'invalid_argument'
  | 'dimension_mismatch'
  | 'cycle'
  | 'division_by_zero'
  | 'invalid_value'
  | 'unknown_material'
  | 'budget_error'
  | 'protected'
  | 'dependency_error';

/** An error of one row: the row's key, a stable code and a message that says what and where. */
export interface EngineError {
  readonly key: string;
  readonly code: EngineErrorCode;
  readonly message: string;
}

/** Builds an EngineError whose message starts with the key it is about. */
export function rowError(key: string, code: EngineErrorCode, detail: string): EngineError {
  return { key, code, message: `${key}: ${detail}` };
}

/**
 * The grid engine's error kinds (the cell error types of the library that evaluates formulas), each as our
 * own code and words. Its own words and error values ("#VALUE!", its messages) never reach a message:
 * they go to the log only, through `logEngineText`.
 */
const gridErrors: Readonly<Record<string, { code: EngineErrorCode; detail: string }>> = {
  DIV_BY_ZERO: { code: 'division_by_zero', detail: 'division by zero' },
  NUM: {
    code: 'invalid_value',
    detail: 'the result is not a finite number (a root or logarithm of a negative number, or an overflow)',
  },
  CYCLE: { code: 'cycle', detail: 'the formula refers to itself' },
  VALUE: { code: 'invalid_value', detail: 'a function was given a value it cannot use' },
  NAME: { code: 'invalid_value', detail: 'the formula names something Trimsheet does not know' },
  REF: { code: 'invalid_value', detail: 'the formula refers to a row that cannot be read' },
  NA: { code: 'invalid_value', detail: 'a value the formula needs is missing' },
};

const otherGridError = { code: 'invalid_value' as const, detail: 'the formula cannot be evaluated' };

/** The routine kinds a sheet meets every day (a zero divisor, a negative root, a cycle): not worth a log line. */
const routineGridErrors: ReadonlySet<string> = new Set(['DIV_BY_ZERO', 'NUM', 'CYCLE']);

/** Writes an engine library's own words to the log (never shown to people), saying whose row it was about. */
export function logEngineText(key: string, text: string): void {
  console.warn(`[engine] ${key}: ${text}`);
}

/** The error of row `key` for a grid engine error of kind `type` (its raw message, if any, is logged). */
export function gridError(key: string, type: string, rawMessage = ''): EngineError {
  const known = gridErrors[type] ?? otherGridError;
  if (!routineGridErrors.has(type)) logEngineText(key, `grid engine error ${type}${rawMessage ? `: ${rawMessage}` : ''}`);
  return rowError(key, known.code, known.detail);
}
