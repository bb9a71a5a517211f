import { useState, type FormEvent } from 'react';
import type { z } from 'zod';
import { fieldErrorsFromProblem } from '@console/lib/problem-message';
import { fieldErrorsFromIssues, focusFirstInvalidField, type FieldErrors } from '@console/utils/form-errors';
import { friendlyZodError } from '@console/utils/validation-messages';

type SubmittingMutation<Input> = { error: unknown; mutate: (input: Input) => void };

/**
 * Submit handling of the sign-in and sign-up forms: the form's fields are checked against `schema` before anything
 * is sent, so a typo shows beside its field (with the keyboard moved there) without a round trip. The server's own
 * field problems show in the same places; a client message wins while it stands.
 */
export function useValidatedFormSubmit<Schema extends z.ZodType>(schema: Schema, mutation: SubmittingMutation<z.output<Schema>>) {
  const [clientErrors, setClientErrors] = useState<FieldErrors>({});
  const errors: FieldErrors = { ...fieldErrorsFromProblem(mutation.error), ...clientErrors };

  const onSubmit = (event: FormEvent<HTMLFormElement>) => {
    event.preventDefault();
    const form = event.currentTarget;
    const parsed = schema.safeParse(Object.fromEntries(new FormData(form)), { error: friendlyZodError });
    if (!parsed.success) {
      const found = fieldErrorsFromIssues(parsed.error.issues);
      setClientErrors(found);
      focusFirstInvalidField(form, found);
      return;
    }
    setClientErrors({});
    mutation.mutate(parsed.data);
  };

  return { errors, onSubmit };
}
