import { useQueryClient } from '@tanstack/react-query';
import { Link } from 'react-router';
import { Alert, ProblemAlert } from '@console/components/ui/alert';
import { Button, buttonClasses } from '@console/components/ui/button';
import { LoadingState } from '@console/components/ui/states';
import { paths } from '@console/config/paths';
import { isApiProblem } from '@console/lib/api-problem';
import { formatDateTime } from '@console/utils/format-date';
import { roleLabel, roleSummary } from '@console/utils/roles';
import type { Session } from '@shared/schemas/auth';
import type { InvitationLookup } from '@shared/schemas/invitations';
import { useAcceptInvitation } from '../api/accept-invitation';
import { lookUpInvitationQueryOptions, useInvitationLookup } from '../api/lookup-invitation';
import { AcceptSignUpForm } from './accept-sign-up-form';

type AcceptInvitationProps = {
  token: string;
  /** The signed-in session, null when signed out, undefined while it loads. */
  session: Session | null | undefined;
  onJoined: (session: Session) => void;
  signOut: { run: () => Promise<void>; isPending: boolean };
};

function InvitationSummary({ invitation }: { invitation: InvitationLookup }) {
  return (
    <dl className="grid grid-cols-[auto_minmax(0,1fr)] gap-x-4 gap-y-2 rounded-md border border-ink-200 bg-ink-50 px-4 py-3 text-sm">
      <dt className="font-semibold text-ink-600">Organisation</dt>
      <dd className="font-bold text-ink-900">{invitation.organisationName}</dd>
      <dt className="font-semibold text-ink-600">Role</dt>
      <dd>
        <span className="font-bold text-ink-900">{roleLabel(invitation.role)}</span>
        <span className="block text-xs text-ink-600">{roleSummary(invitation.role)}</span>
      </dd>
      <dt className="font-semibold text-ink-600">For</dt>
      <dd className="break-all text-ink-900">{invitation.email}</dd>
      <dt className="font-semibold text-ink-600">Valid until</dt>
      <dd className="text-ink-900">{formatDateTime(invitation.expiresAt)}</dd>
    </dl>
  );
}

function JoinAsCurrentUser({ token, session, organisationName, onJoined }: { token: string; session: Session; organisationName: string; onJoined: (session: Session) => void }) {
  const accept = useAcceptInvitation({ onSuccess: onJoined });
  return (
    <div className="space-y-4">
      {accept.error && <ProblemAlert error={accept.error} />}
      <Button className="w-full" isPending={accept.isPending} onClick={() => accept.mutate({ token })}>
        {accept.isPending ? 'Joining…' : `Join ${organisationName} as ${session.user.displayName}`}
      </Button>
    </div>
  );
}

function SignedInAsSomeoneElse({ session, invitedEmail, onSignOut, isSigningOut }: { session: Session; invitedEmail: string; onSignOut: () => void; isSigningOut: boolean }) {
  return (
    <div className="space-y-4">
      <Alert tone="warning" title="You are signed in with another address">
        <p>
          This invitation is for <strong>{invitedEmail}</strong>, but you are signed in as {session.user.email}. Sign out to
          accept it with the invited address.
        </p>
      </Alert>
      <Button variant="secondary" className="w-full" isPending={isSigningOut} onClick={onSignOut}>
        Sign out
      </Button>
    </div>
  );
}

function UnusableLink({ error }: { error: unknown }) {
  const spent = isApiProblem(error) && error.code === 'invitation_used';
  const stale = isApiProblem(error) && !spent && (error.status === 404 || error.status === 410);
  return (
    <div className="space-y-4">
      <ProblemAlert error={error} />
      {stale && (
        <p className="text-sm text-ink-600">
          Only the latest invitation e-mail works. Ask an owner or admin of the organisation to resend it.
        </p>
      )}
      <Link to={spent ? paths.app.root.getHref() : paths.auth.signIn.getHref()} className={buttonClasses('secondary', 'md', 'w-full')}>
        {spent ? 'Go to the console' : 'Go to sign-in'}
      </Link>
    </div>
  );
}

/** What to offer whoever opened the link: join as the signed-in user, sign in first, or sign up. */
export function AcceptInvitation({ token, session, onJoined, signOut }: AcceptInvitationProps) {
  const lookup = useInvitationLookup(token);
  const queryClient = useQueryClient();
  // Signing out empties the whole cache: fetch the invitation again for this page.
  const signOutHere = () => void signOut.run().then(() => queryClient.fetchQuery(lookUpInvitationQueryOptions(token)));

  if (lookup.isPending || session === undefined) return <LoadingState label="Reading the invitation…" />;
  if (lookup.isError) return <UnusableLink error={lookup.error} />;
  const invitation = lookup.data;
  const current = session;
  const acceptPath = paths.invitations.accept.getHref(token);

  return (
    <div className="space-y-6">
      <InvitationSummary invitation={invitation} />
      {current && current.user.email === invitation.email && (
        <JoinAsCurrentUser token={token} session={current} organisationName={invitation.organisationName} onJoined={onJoined} />
      )}
      {current && current.user.email !== invitation.email && <SignedInAsSomeoneElse session={current} invitedEmail={invitation.email} onSignOut={signOutHere} isSigningOut={signOut.isPending} />}
      {!current && invitation.accountExists && (
        <div className="space-y-3">
          <p className="text-sm text-ink-700">{invitation.email} already has a Sweepline account. Sign in with it to accept.</p>
          <Link to={paths.auth.signIn.getHref(acceptPath)} className={buttonClasses('primary', 'md', 'w-full')}>
            Sign in to accept
          </Link>
        </div>
      )}
      {!current && !invitation.accountExists && (
        <AcceptSignUpForm token={token} email={invitation.email} organisationName={invitation.organisationName} onJoined={onJoined} />
      )}
    </div>
  );
}
