import { isApiProblem } from '@console/lib/api-problem';
import { createStimulusRequestSchema, type CreateStimulusRequest, type StimulusType } from '@shared/schemas/stimuli';
import { STIMULUS_FIELDS } from './stimulus-fields';

export type StimulusFormErrors = Record<string, string>;
export type BuiltStimulusRequest = { ok: true; request: CreateStimulusRequest } | { ok: false; errors: StimulusFormErrors };

/** Accepts "1,5" as well as "1.5": labs type decimals in their own convention. */
function parseNumber(text: string): number | undefined {
  const cleaned = text.trim().replace(',', '.').replace(/^\u2212/, '-');
  if (cleaned === '') return undefined;
  const value = Number(cleaned);
  return Number.isFinite(value) ? value : Number.NaN;
}

/**
 * The request for the form's values: required fields must be numbers, empty optional fields are left out so
 * the engine's defaults apply. Ranges and consistency (stop below Nyquist…) are the engine's to judge.
 */
export function buildStimulusRequest(type: StimulusType, name: string, values: Record<string, string>): BuiltStimulusRequest {
  const errors: StimulusFormErrors = {};
  const parameters: Record<string, number> = {};
  for (const field of STIMULUS_FIELDS[type]) {
    const value = parseNumber(values[field.name] ?? '');
    if (value === undefined) {
      if (field.required) errors[field.name] = 'This field is required.';
      continue;
    }
    if (Number.isNaN(value)) errors[field.name] = 'Enter a number, such as 20 or 0.5.';
    else if (field.integer && !Number.isInteger(value)) errors[field.name] = 'Enter a whole number.';
    else parameters[field.name] = value;
  }
  const trimmedName = name.trim();
  if (trimmedName.length > 100) errors.name = 'Use at most 100 characters.';
  if (Object.keys(errors).length > 0) return { ok: false, errors };
  const parsed = createStimulusRequestSchema.safeParse({ type, ...(trimmedName ? { name: trimmedName } : {}), parameters });
  if (!parsed.success) {
    for (const issue of parsed.error.issues) {
      const key = issue.path[0] === 'parameters' ? String(issue.path[1] ?? 'parameters') : String(issue.path[0] ?? 'form');
      errors[key] ??= issue.message;
    }
    return { ok: false, errors };
  }
  return { ok: true, request: parsed.data };
}

/**
 * Field messages from a refused creation: the engine points into the request ("#/parameters/stopHz"), so the
 * message lands on that parameter's input.
 */
export function stimulusErrorsFromProblem(error: unknown): StimulusFormErrors {
  if (!isApiProblem(error)) return {};
  const errors: StimulusFormErrors = {};
  for (const fieldError of error.fieldErrors) {
    const segments = fieldError.pointer.replace(/^#/, '').split('/').filter(Boolean).map((segment) => decodeURIComponent(segment).replace(/~1/g, '/').replace(/~0/g, '~'));
    const key = segments[0] === 'parameters' && segments[1] ? segments[1] : segments[0];
    if (key && !(key in errors)) errors[key] = fieldError.detail;
  }
  return errors;
}

/** The form's starting values for a type: every required field pre-filled, optional ones empty. */
export function defaultStimulusValues(type: StimulusType): Record<string, string> {
  return Object.fromEntries(STIMULUS_FIELDS[type].map((field) => [field.name, field.defaultValue ?? '']));
}
