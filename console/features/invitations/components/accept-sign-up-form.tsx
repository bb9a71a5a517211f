import { ProblemAlert } from '@console/components/ui/alert';
import { Button } from '@console/components/ui/button';
import { TextField } from '@console/components/ui/field';
import { useState, type FormEvent } from 'react';
import { fieldErrorsFromProblem } from '@console/lib/problem-message';
import { fieldErrorsFromIssues, focusFirstInvalidField, type FieldErrors } from '@console/utils/form-errors';
import { friendlyZodError } from '@console/utils/validation-messages';
import { PASSWORD_MIN_LENGTH } from '@shared/schemas/auth';
import type { Session } from '@shared/schemas/auth';
import { acceptInvitationInputSchema, useAcceptInvitation } from '../api/accept-invitation';

type AcceptSignUpFormProps = { token: string; email: string; organisationName: string; onJoined: (session: Session) => void };

/** A new person: the account is created for the invited address and joins in the same step. */
export function AcceptSignUpForm({ token, email, organisationName, onJoined }: AcceptSignUpFormProps) {
  const accept = useAcceptInvitation({ onSuccess: onJoined });
  const [clientErrors, setClientErrors] = useState<FieldErrors>({});
  const errors: FieldErrors = { ...fieldErrorsFromProblem(accept.error), ...clientErrors };
  // Checked against the request schema first, so a short password shows beside its field without a round trip.
  const onSubmit = (event: FormEvent<HTMLFormElement>) => {
    event.preventDefault();
    const form = event.currentTarget;
    const parsed = acceptInvitationInputSchema.safeParse(Object.fromEntries(new FormData(form)), { error: friendlyZodError });
    if (!parsed.success) {
      const found = fieldErrorsFromIssues(parsed.error.issues);
      setClientErrors(found);
      focusFirstInvalidField(form, found);
      return;
    }
    setClientErrors({});
    accept.mutate(parsed.data);
  };
  return (
    <form noValidate onSubmit={onSubmit} className="space-y-5">
      {accept.error && <ProblemAlert error={accept.error} />}
      <input type="hidden" name="token" value={token} />
      <TextField label="E-mail" value={email} readOnly disabled hint="The invitation is for this address." />
      <TextField label="Your name" name="displayName" autoComplete="name" error={errors.displayName} required />
      <TextField
        label="Password"
        name="password"
        type="password"
        autoComplete="new-password"
        minLength={PASSWORD_MIN_LENGTH}
        hint={`At least ${PASSWORD_MIN_LENGTH} characters. A short sentence is easier to remember than symbols.`}
        error={errors.password}
        required
      />
      <Button type="submit" className="w-full" isPending={accept.isPending}>
        {accept.isPending ? 'Creating your account…' : `Create account and join ${organisationName}`}
      </Button>
    </form>
  );
}
