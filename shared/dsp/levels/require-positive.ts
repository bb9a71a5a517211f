import { EngineError } from '../errors';

/** Throw EngineError `code` unless `value` is a finite number > 0. */
export function requirePositiveFinite(value: number, field: string, code = 'level_input_invalid'): void {
  if (!(typeof value === 'number' && Number.isFinite(value) && value > 0)) {
    throw new EngineError(code, `${field} must be a finite number greater than 0, got ${String(value)}.`, { field });
  }
}

/** Throw EngineError `code` unless `value` is a finite number. */
export function requireFinite(value: number, field: string, code = 'level_input_invalid'): void {
  if (!(typeof value === 'number' && Number.isFinite(value))) {
    throw new EngineError(code, `${field} must be a finite number, got ${String(value)}.`, { field });
  }
}
