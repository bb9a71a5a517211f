import { z } from 'zod';
import { sessionSchema, signInRequestSchema, signUpRequestSchema, switchOrganisationRequestSchema } from '@shared/schemas/auth';
import { defineRoute } from '@server/http/define-route';
import { currentSession, signIn, signUp, switchOrganisation } from './auth.service';
import { signOut } from './sign-out';

const COOKIE_NOTE = 'Sets the `swl_session` cookie (httpOnly, SameSite=Lax, 12 hours, refreshed while in use).';

export const authRoutes = [
  defineRoute({
    method: 'post',
    path: '/auth/sign-up',
    operationId: 'signUp',
    summary: 'Create an account',
    description: `Creates a user and a new organisation with the user as owner, and signs in. ${COOKIE_NOTE}`,
    tags: ['Sign-in'],
    auth: 'public',
    request: { body: signUpRequestSchema },
    responses: {
      201: { description: 'Signed up and signed in.', schema: sessionSchema, headers: { location: { description: 'URL of the new session (GET /v1/auth/session).', schema: z.string() } } },
    },
    problems: ['email_already_registered', 'csrf_origin_mismatch'],
    handler: async ({ deps, res, body }) => ({ status: 201, body: await signUp(deps, res, body), headers: { Location: '/v1/auth/session' } }),
  }),
  defineRoute({
    method: 'post',
    path: '/auth/sign-in',
    operationId: 'signIn',
    summary: 'Sign in',
    description:
      `${COOKIE_NOTE} After 5 failed attempts for one account, or 20 from one address, within 15 minutes further ` +
      'attempts are refused with 429 and Retry-After. A wrong e-mail and a wrong password get the same answer.',
    tags: ['Sign-in'],
    auth: 'public',
    request: { body: signInRequestSchema },
    responses: { 200: { description: 'Signed in.', schema: sessionSchema } },
    problems: ['invalid_credentials', 'sign_in_throttled', 'no_organisation', 'csrf_origin_mismatch'],
    handler: async ({ deps, req, res, body }) => ({
      status: 200,
      body: await signIn(deps, res, body, req.ip ?? req.socket.remoteAddress ?? 'unknown'),
    }),
  }),
  defineRoute({
    method: 'post',
    path: '/auth/sign-out',
    operationId: 'signOut',
    summary: 'Sign out',
    description:
      'Ends the console session on every server process (the session id is refused from now on, even from a copy of the cookie) and clears the cookie. Always succeeds.',
    tags: ['Sign-in'],
    auth: 'public',
    responses: { 204: { description: 'Signed out.' } },
    problems: ['csrf_origin_mismatch'],
    handler: async ({ deps, req, res }) => {
      await signOut(deps, req, res);
      return { status: 204 };
    },
  }),
  defineRoute({
    method: 'get',
    path: '/auth/session',
    operationId: 'getSession',
    summary: 'Current session',
    description: 'The signed-in user, active organisation, memberships and permissions.',
    tags: ['Sign-in'],
    auth: 'session',
    responses: { 200: { description: 'The session.', schema: sessionSchema } },
    handler: async ({ deps, res, user }) => ({ status: 200, body: await currentSession(deps, res, user) }),
  }),
  defineRoute({
    method: 'post',
    path: '/auth/active-organisation',
    operationId: 'switchOrganisation',
    summary: 'Switch the active organisation',
    description: 'Makes another of your organisations the active one and re-issues the session cookie.',
    tags: ['Sign-in'],
    auth: 'session',
    request: { body: switchOrganisationRequestSchema },
    responses: { 200: { description: 'The session in the chosen organisation.', schema: sessionSchema } },
    problems: ['not_found'],
    handler: async ({ deps, res, user, body }) => ({
      status: 200,
      body: await switchOrganisation(deps, res, user, body.organisationId),
    }),
  }),
];
