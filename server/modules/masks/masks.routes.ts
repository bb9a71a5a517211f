import { z } from 'zod';
import {
  createMaskRequestSchema,
  deriveMaskRequestSchema,
  maskListQuerySchema,
  maskPageSchema,
  maskParamsSchema,
  maskSchema,
  maskVersionContentSchema,
  maskVersionListSchema,
  maskVersionParamsSchema,
  maskVersionSchema,
} from '@shared/schemas/masks';
import { defineRoute } from '@server/http/define-route';
import { deriveMask } from './mask-derivation';
import { addMaskVersion, createMask, getMask, getVersion, listMasksPage, listVersions } from './masks.service';

const location = { location: { description: 'URL of the mask.', schema: z.string() } };
const LIMITS_NOTE =
  'Limits are polylines read linearly in dB against log frequency; a curve is checked only over each limit\'s span. ' +
  'An absolute mask is in the curve\'s own dB (dB SPL when calibrated); a relative mask is relative to `referenceLevel` ' +
  'read from each curve.';

export const maskRoutes = [
  defineRoute({
    method: 'post',
    path: '/masks/derive',
    operationId: 'deriveMask',
    summary: 'Derive a mask from golden units',
    description:
      'Takes the frequency-response curves of succeeded analyses of golden units and sets the limits at mean ± max(k·σ, ' +
      'minHalfWidthDb) per frequency (σ = sample standard deviation, n − 1). With `referenceLevel` each curve is first ' +
      'normalised to its own reference and the mask is relative. Creates a mask, or a new version of `maskId`. The version ' +
      'records the golden analyses and the per-frequency mean, σ and half-width.',
    tags: ['Tolerance masks'],
    permission: 'masks:write',
    idempotency: 'optional',
    request: { body: deriveMaskRequestSchema },
    responses: { 201: { description: 'The mask with the derived version as current.', schema: maskSchema, headers: location } },
    problems: ['not_found', 'golden_analyses_unusable', 'mask_invalid'],
    handler: async ({ deps, principal, body }) => {
      const mask = await deriveMask(deps, principal.organisationId, body, principal.actor);
      return { status: 201, body: mask, headers: { Location: `/v1/masks/${mask.id}` } };
    },
  }),
  defineRoute({
    method: 'post',
    path: '/masks',
    operationId: 'createMask',
    summary: 'Create a tolerance mask',
    description: `Creates the mask with version 1. ${LIMITS_NOTE}`,
    tags: ['Tolerance masks'],
    permission: 'masks:write',
    idempotency: 'optional',
    request: { body: createMaskRequestSchema },
    responses: { 201: { description: 'The mask.', schema: maskSchema, headers: location } },
    problems: ['mask_invalid'],
    handler: async ({ deps, principal, body }) => {
      const mask = await createMask(deps, principal.organisationId, body, principal.actor);
      return { status: 201, body: mask, headers: { Location: `/v1/masks/${mask.id}` } };
    },
  }),
  defineRoute({
    method: 'get',
    path: '/masks',
    operationId: 'listMasks',
    summary: 'List tolerance masks',
    tags: ['Tolerance masks'],
    permission: 'masks:read',
    request: { query: maskListQuerySchema },
    responses: { 200: { description: 'A page of masks, newest first.', schema: maskPageSchema } },
    problems: ['invalid_cursor'],
    handler: async ({ deps, principal, query }) => ({ status: 200, body: await listMasksPage(deps, principal.organisationId, query) }),
  }),
  defineRoute({
    method: 'get',
    path: '/masks/{maskId}',
    operationId: 'getMask',
    summary: 'Get a tolerance mask',
    description: 'The mask with its latest version.',
    tags: ['Tolerance masks'],
    permission: 'masks:read',
    request: { params: maskParamsSchema },
    responses: { 200: { description: 'The mask.', schema: maskSchema } },
    problems: ['not_found'],
    handler: async ({ deps, principal, params }) => ({ status: 200, body: await getMask(deps, principal.organisationId, params.maskId) }),
  }),
  defineRoute({
    method: 'get',
    path: '/masks/{maskId}/versions',
    operationId: 'listMaskVersions',
    summary: 'List the versions of a mask',
    tags: ['Tolerance masks'],
    permission: 'masks:read',
    request: { params: maskParamsSchema },
    responses: { 200: { description: 'Every version, newest first.', schema: maskVersionListSchema } },
    problems: ['not_found'],
    handler: async ({ deps, principal, params }) => ({
      status: 200,
      body: { data: await listVersions(deps, principal.organisationId, params.maskId) },
    }),
  }),
  defineRoute({
    method: 'post',
    path: '/masks/{maskId}/versions',
    operationId: 'createMaskVersion',
    summary: 'Change a mask (adds a version)',
    description:
      `A change is always a new version; earlier versions stay as they were, because verdicts name the version they used. ${LIMITS_NOTE}`,
    tags: ['Tolerance masks'],
    permission: 'masks:write',
    idempotency: 'optional',
    request: { params: maskParamsSchema, body: maskVersionContentSchema },
    responses: {
      201: {
        description: 'The new version.',
        schema: maskVersionSchema,
        headers: { location: { description: 'URL of the version.', schema: z.string() } },
      },
    },
    problems: ['not_found', 'mask_invalid'],
    handler: async ({ deps, principal, params, body }) => {
      const version = await addMaskVersion(deps, principal.organisationId, params.maskId, body, principal.actor);
      return { status: 201, body: version, headers: { Location: `/v1/masks/${params.maskId}/versions/${version.version}` } };
    },
  }),
  defineRoute({
    method: 'get',
    path: '/masks/{maskId}/versions/{version}',
    operationId: 'getMaskVersion',
    summary: 'Get one version of a mask',
    tags: ['Tolerance masks'],
    permission: 'masks:read',
    request: { params: maskVersionParamsSchema },
    responses: { 200: { description: 'The version.', schema: maskVersionSchema } },
    problems: ['not_found'],
    handler: async ({ deps, principal, params }) => ({
      status: 200,
      body: await getVersion(deps, principal.organisationId, params.maskId, params.version),
    }),
  }),
];
