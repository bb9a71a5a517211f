// Every console URL in one place: `path` for the router, `getHref` for links.
export const paths = {
  auth: {
    signIn: {
      path: '/sign-in',
      getHref: (redirectTo?: string | null) =>
        redirectTo && redirectTo !== '/' ? `/sign-in?redirectTo=${encodeURIComponent(redirectTo)}` : '/sign-in',
    },
    signUp: {
      path: '/sign-up',
      getHref: (redirectTo?: string | null) =>
        redirectTo && redirectTo !== '/' ? `/sign-up?redirectTo=${encodeURIComponent(redirectTo)}` : '/sign-up',
    },
  },
  invitations: {
    // Public: opened from the invitation e-mail, signed in or not.
    accept: { path: '/invitations/:token', getHref: (token: string) => `/invitations/${encodeURIComponent(token)}` },
  },
  app: {
    root: { path: '/', getHref: () => '/' },
    overview: { path: '', getHref: () => '/' },
    members: { path: 'members', getHref: () => '/members' },
    usage: { path: 'usage', getHref: () => '/usage' },
    apiKeys: { path: 'api-keys', getHref: () => '/api-keys' },
    analyses: { path: 'analyses', getHref: (search?: string) => (search ? `/analyses?${search}` : '/analyses') },
    analysis: {
      path: 'analyses/:analysisId',
      getHref: (analysisId: string, besideId?: string) =>
        `/analyses/${encodeURIComponent(analysisId)}${besideId ? `?beside=${encodeURIComponent(besideId)}` : ''}`,
    },
    compare: {
      path: 'compare',
      getHref: (analysisIds: readonly string[] = []) => (analysisIds.length ? `/compare?ids=${analysisIds.map(encodeURIComponent).join(',')}` : '/compare'),
    },
    stimuli: { path: 'stimuli', getHref: () => '/stimuli' },
    production: { path: 'production', getHref: (search?: string) => (search ? `/production?${search}` : '/production') },
    calibrations: { path: 'calibrations', getHref: () => '/calibrations' },
    masks: { path: 'masks', getHref: () => '/masks' },
    mask: {
      path: 'masks/:maskId',
      getHref: (maskId: string, version?: number) => `/masks/${encodeURIComponent(maskId)}${version ? `?version=${version}` : ''}`,
    },
    webhooks: { path: 'webhooks', getHref: () => '/webhooks' },
    webhook: { path: 'webhooks/:endpointId', getHref: (endpointId: string) => `/webhooks/${encodeURIComponent(endpointId)}` },
    developer: { path: 'developer', getHref: () => '/developer' },
    devOutbox: { path: 'dev/outbox', getHref: () => '/dev/outbox' },
  },
} as const;

/** Only same-console paths may be followed after sign-in, so a crafted link cannot send the user elsewhere. */
export function safeRedirectTarget(candidate: string | null | undefined): string {
  const isConsolePath =
    !!candidate &&
    candidate.startsWith('/') &&
    !candidate.startsWith('//') &&
    !candidate.startsWith('/\\') &&
    !/^\/(v1|docs)(\/|$|\?)/.test(candidate);
  if (!candidate || !isConsolePath) {
    return paths.app.root.getHref();
  }
  return candidate;
}
