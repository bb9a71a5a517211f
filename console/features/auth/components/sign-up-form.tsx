import { Button } from '@console/components/ui/button';
import { TextField } from '@console/components/ui/field';
import { ProblemAlert } from '@console/components/ui/alert';
import type { Session } from '@shared/schemas/auth';
import { PASSWORD_MIN_LENGTH, signUpInputSchema, useSignUp } from '../api/sign-up';
import { useValidatedFormSubmit } from '../utils/use-validated-form-submit';

export function SignUpForm({ onSignedUp }: { onSignedUp: (session: Session) => void }) {
  const signUp = useSignUp({ onSuccess: onSignedUp });
  const { errors, onSubmit } = useValidatedFormSubmit(signUpInputSchema, signUp);

  return (
    <form noValidate onSubmit={onSubmit} className="space-y-5">
      {signUp.error && <ProblemAlert error={signUp.error} />}
      <TextField label="Your name" name="displayName" autoComplete="name" error={errors.displayName} required />
      <TextField label="Work e-mail" name="email" type="email" autoComplete="email" error={errors.email} required />
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
      <TextField
        label="Organisation"
        name="organisationName"
        autoComplete="organization"
        hint="Your lab or company. You become its owner and can invite others later."
        error={errors.organisationName}
        required
      />
      <Button type="submit" className="w-full" isPending={signUp.isPending}>
        {signUp.isPending ? 'Creating your organisation…' : 'Create account'}
      </Button>
    </form>
  );
}
