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
