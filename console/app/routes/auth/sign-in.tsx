import type { QueryClient } from '@tanstack/react-query';
import { Link, redirect, useNavigate, useSearchParams } from 'react-router';
import { AuthLayout } from '@console/components/layouts/auth-layout';
import { paths, safeRedirectTarget } from '@console/config/paths';
import { getSessionQueryOptions } from '@console/features/auth/api/get-session';
import { SignInForm } from '@console/features/auth/components/sign-in-form';

// Someone already signed in has nothing to do here.
export const clientLoader = (queryClient: QueryClient) => async () => {
  const session = await queryClient.ensureQueryData(getSessionQueryOptions());
  return session ? redirect(paths.app.root.getHref()) : null;
};

export default function SignInRoute() {
  const navigate = useNavigate();
  const [searchParams] = useSearchParams();
  const redirectTo = searchParams.get('redirectTo');
  return (
    <AuthLayout
      title="Sign in"
      lead="Welcome back. Sign in to manage your organisation, keys and measurements."
      footer={
        <p>
          New to Sweepline?{' '}
          <Link to={paths.auth.signUp.getHref(redirectTo)} className="font-semibold text-ink-800 underline underline-offset-2">
            Create an account
          </Link>
        </p>
      }
    >
      <SignInForm onSignedIn={() => navigate(safeRedirectTarget(redirectTo), { replace: true })} />
    </AuthLayout>
  );
}
