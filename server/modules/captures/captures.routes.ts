import { z } from 'zod';
import { captureListQuerySchema, capturePageSchema, captureParamsSchema, captureSchema, captureUploadSchema } from '@shared/schemas/captures';
import { idempotencyHeadersSchema } from '@shared/schemas/common';
import { defineRoute } from '@server/http/define-route';
import { deleteCapture, getCapture, listCapturesPage, openCaptureDownload, uploadCapture } from './captures.service';

const LIMITS_NOTE =
  'The organisation\'s plan sets the limits: file size (413 `payload_too_large`), duration, channel count and sample ' +
  'rate (422 `capture_over_limit`); the problem names the limit (`limit`, `allowed`, `actual`). A file that is not a ' +
  'readable WAV (empty, truncated, header only, another format, NaN or infinite float samples) is 422 `invalid_wav` ' +
  'with the reader\'s `engineCode`. A refused or interrupted upload leaves no file and no record.';

export const captureRoutes = [
  defineRoute({
    method: 'post',
    path: '/captures',
    operationId: 'uploadCapture',
    summary: 'Upload a capture (WAV)',
    description:
      'multipart/form-data with the WAV in the part `file`. The file is streamed to storage while its SHA-256 is ' +
      'computed, decoded and checked (format, rate, channels, duration), and its per-channel peak, RMS (dBFS, ' +
      `AES17), DC offset and clipping are recorded. ${LIMITS_NOTE}`,
    tags: ['Captures'],
    permission: 'captures:write',
    idempotency: { mode: 'required', fingerprint: 'handler' },
    request: { headers: idempotencyHeadersSchema, bodyContent: { 'multipart/form-data': captureUploadSchema } },
    responses: {
      201: { description: 'The stored capture.', schema: captureSchema, headers: { location: { description: 'URL of the capture.', schema: z.string() } } },
    },
    problems: ['multipart_invalid', 'payload_too_large', 'invalid_wav', 'capture_over_limit', 'unsupported_media_type'],
    handler: async ({ deps, principal, req, res, idempotency }) => {
      const capture = await uploadCapture(deps, principal, req, res, idempotency);
      return { status: 201, body: capture, headers: { Location: `/v1/captures/${capture.id}` } };
    },
  }),
  defineRoute({
    method: 'get',
    path: '/captures',
    operationId: 'listCaptures',
    summary: 'List captures',
    tags: ['Captures'],
    permission: 'captures:read',
    request: { query: captureListQuerySchema },
    responses: { 200: { description: 'A page of captures, newest first.', schema: capturePageSchema } },
    problems: ['invalid_cursor'],
    handler: async ({ deps, principal, query }) => ({ status: 200, body: await listCapturesPage(deps, principal.organisationId, query) }),
  }),
  defineRoute({
    method: 'get',
    path: '/captures/{captureId}',
    operationId: 'getCapture',
    summary: 'Get a capture\'s metadata',
    tags: ['Captures'],
    permission: 'captures:read',
    request: { params: captureParamsSchema },
    responses: { 200: { description: 'The capture.', schema: captureSchema } },
    problems: ['not_found'],
    handler: async ({ deps, principal, params }) => ({ status: 200, body: await getCapture(deps, principal.organisationId, params.captureId) }),
  }),
  defineRoute({
    method: 'get',
    path: '/captures/{captureId}/download',
    operationId: 'downloadCapture',
    summary: 'Download a capture\'s WAV',
    description: 'The bytes exactly as uploaded (ETag = their SHA-256).',
    tags: ['Captures'],
    permission: 'captures:read',
    request: { params: captureParamsSchema },
    responses: { 200: { description: 'The WAV file.', contentType: 'audio/wav' } },
    problems: ['not_found'],
    handler: async ({ deps, principal, params, res }) => {
      const { capture, stream } = await openCaptureDownload(deps, principal.organisationId, params.captureId);
      res.status(200);
      res.setHeader('Content-Type', 'audio/wav');
      res.setHeader('Content-Length', String(capture.sizeBytes));
      res.setHeader('Content-Disposition', `attachment; filename="${capture.filename.replace(/"/g, '')}"`);
      res.setHeader('ETag', `"${capture.sha256}"`);
      res.setHeader('Cache-Control', 'private, max-age=86400, immutable');
      await new Promise<void>((resolve, reject) => {
        stream.on('error', reject);
        res.on('finish', resolve);
        res.on('close', resolve);
        stream.pipe(res);
      });
      return { status: 200 };
    },
  }),
  defineRoute({
    method: 'delete',
    path: '/captures/{captureId}',
    operationId: 'deleteCapture',
    summary: 'Delete a capture',
    description: 'Refused with 409 `capture_in_use` (listing `analysisIds`) while analyses use the capture.',
    tags: ['Captures'],
    permission: 'captures:delete',
    request: { params: captureParamsSchema },
    responses: { 204: { description: 'Deleted.' } },
    problems: ['not_found', 'capture_in_use'],
    handler: async ({ deps, principal, params }) => {
      await deleteCapture(deps, principal.organisationId, params.captureId);
      return { status: 204 };
    },
  }),
];
