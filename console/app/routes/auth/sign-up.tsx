import type { QueryClient } from '@tanstack/react-query';
import { Link, redirect, useNavigate, useSearchParams } from 'react-router';
import { AuthLayout } from '@console/components/layouts/auth-layout';
import { paths, safeRedirectTarget } from '@console/config/paths';
import { getSessionQueryOptions } from '@console/features/auth/api/get-session';
import { SignUpForm } from '@console/features/auth/components/sign-up-form';

export const clientLoader = (queryClient: QueryClient) => async () => {
  const session = await queryClient.ensureQueryData(getSessionQueryOptions());
  return session ? redirect(paths.app.root.getHref()) : null;
};

export default function SignUpRoute() {
  const navigate = useNavigate();
  const [searchParams] = useSearchParams();
  const redirectTo = searchParams.get('redirectTo');
  return (
    <AuthLayout
      title="Create your account"
      lead="Set up an organisation for your lab or production line. You can invite colleagues once you are in."
      footer={
        <p>
          Already have an account?{' '}
          <Link to={paths.auth.signIn.getHref(redirectTo)} className="font-semibold text-ink-800 underline underline-offset-2">
            Sign in
          </Link>
        </p>
      }
    >
      <SignUpForm onSignedUp={() => navigate(safeRedirectTarget(redirectTo), { replace: true })} />
    </AuthLayout>
  );
}
