import { Button } from '@console/components/ui/button';
import { TextField } from '@console/components/ui/field';
import { ProblemAlert } from '@console/components/ui/alert';
import type { Session } from '@shared/schemas/auth';
import { signInInputSchema, useSignIn } from '../api/sign-in';
import { useValidatedFormSubmit } from '../utils/use-validated-form-submit';

export function SignInForm({ onSignedIn }: { onSignedIn: (session: Session) => void }) {
  const signIn = useSignIn({ onSuccess: onSignedIn });
  const { errors, onSubmit } = useValidatedFormSubmit(signInInputSchema, signIn);

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
