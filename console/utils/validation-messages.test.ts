import { describe, expect, it } from 'vitest';
import { createApiKeyRequestSchema } from '@shared/schemas/api-keys';
import { signUpRequestSchema } from '@shared/schemas/auth';
import { fieldErrorsFromIssues } from './form-errors';
import { friendlyZodError } from './validation-messages';

// The forms parse with the very schemas the API validates with (shared/schemas); these pin the words shown.
describe('friendly validation messages on the shared request schemas', () => {
  it('explains a sign-up that breaks the password and e-mail rules', () => {
    const parsed = signUpRequestSchema.safeParse(
      { email: 'not-an-address', password: 'short', displayName: 'Mara', organisationName: 'Kestrel Bay Acoustics' },
      { error: friendlyZodError },
    );
    expect(parsed.success).toBe(false);
    expect(fieldErrorsFromIssues(parsed.error?.issues ?? [])).toEqual({
      email: 'Enter an e-mail address such as name@lab.example.',
      password: 'Use at least 12 characters.',
    });
  });

  it('calls empty required fields required', () => {
    const parsed = signUpRequestSchema.safeParse(
      { email: '', password: '', displayName: '  ', organisationName: '' },
      { error: friendlyZodError },
    );
    const errors = fieldErrorsFromIssues(parsed.error?.issues ?? []);
    expect(errors.email).toBe('This field is required.');
    expect(errors.displayName).toBe('This field is required.');
    expect(errors.organisationName).toBe('This field is required.');
  });

  it('asks for at least one scope on a new key', () => {
    const parsed = createApiKeyRequestSchema.safeParse({ name: 'KB-65 line 2 rig', scopes: [] }, { error: friendlyZodError });
    expect(fieldErrorsFromIssues(parsed.error?.issues ?? [])).toEqual({ scopes: 'Choose at least one.' });
  });
});
