import { useState, type FormEvent } from 'react';
import { Button } from '@console/components/ui/button';
import { TextField } from '@console/components/ui/field';
import { ProblemAlert } from '@console/components/ui/alert';
import { fieldErrorsFromProblem } from '@console/lib/problem-message';
import { fieldErrorsFromIssues, focusFirstInvalidField, type FieldErrors } from '@console/utils/form-errors';
import { friendlyZodError } from '@console/utils/validation-messages';
import type { Session } from '@shared/schemas/auth';
import { signInInputSchema, useSignIn } from '../api/sign-in';

export function SignInForm({ onSignedIn }: { onSignedIn: (session: Session) => void }) {
  const [clientErrors, setClientErrors] = useState<FieldErrors>({});
  const signIn = useSignIn({ onSuccess: onSignedIn });
  const errors = { ...fieldErrorsFromProblem(signIn.error), ...clientErrors };

  const onSubmit = (event: FormEvent<HTMLFormElement>) => {
    event.preventDefault();
    const form = event.currentTarget;
    const parsed = signInInputSchema.safeParse(Object.fromEntries(new FormData(form)), { error: friendlyZodError });
    if (!parsed.success) {
      const found = fieldErrorsFromIssues(parsed.error.issues);
      setClientErrors(found);
      focusFirstInvalidField(form, found);
      return;
    }
    setClientErrors({});
    signIn.mutate(parsed.data);
  };

  return (
    <form noValidate onSubmit={onSubmit} className="space-y-5">
      {signIn.error && <ProblemAlert error={signIn.error} />}
      <TextField label="E-mail" name="email" type="email" autoComplete="username" error={errors.email} required />
      <TextField
        label="Password"
        name="password"
        type="password"
        autoComplete="current-password"
        error={errors.password}
        required
      />
      <Button type="submit" className="w-full" isPending={signIn.isPending}>
        {signIn.isPending ? 'Signing in…' : 'Sign in'}
      </Button>
    </form>
  );
}
