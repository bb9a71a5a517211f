import { z } from 'zod';
import {
  createStimulusRequestSchema,
  STIMULUS_SAFETY_NOTE,
  stimulusAudioQuerySchema,
  stimulusListQuerySchema,
  stimulusPageSchema,
  stimulusParamsSchema,
  stimulusSchema,
} from '@shared/schemas/stimuli';
import { defineRoute } from '@server/http/define-route';
import { createStimulus, getStimulus, listStimuliPage, renderStimulusAudio, requireStimulusRow, stimulusAudioTag } from './stimuli.service';

export const stimulusRoutes = [
  defineRoute({
    method: 'post',
    path: '/stimuli',
    operationId: 'createStimulus',
    summary: 'Define a stimulus',
    description:
      'A synchronized exponential sweep, a stepped-sine plan or a calibrator-check tone, from parameters. The engine ' +
      'checks them (422 `invalid_parameters` with `engineCode` and a pointer such as `#/parameters/stopHz`) and ' +
      `applies defaults; the stored parameters regenerate the file bit for bit.\n\n${STIMULUS_SAFETY_NOTE}`,
    tags: ['Stimuli'],
    permission: 'analyses:write',
    idempotency: 'required',
    request: { body: createStimulusRequestSchema },
    responses: {
      201: { description: 'The stimulus with its design figures and cautions.', schema: stimulusSchema, headers: { location: { description: 'URL of the stimulus.', schema: z.string() } } },
    },
    problems: ['invalid_parameters'],
    handler: async ({ deps, principal, body }) => {
      const stimulus = await createStimulus(deps, principal.organisationId, body);
      return { status: 201, body: stimulus, headers: { Location: `/v1/stimuli/${stimulus.id}` } };
    },
  }),
  defineRoute({
    method: 'get',
    path: '/stimuli',
    operationId: 'listStimuli',
    summary: 'List stimuli',
    tags: ['Stimuli'],
    permission: 'analyses:read',
    request: { query: stimulusListQuerySchema },
    responses: { 200: { description: 'A page of stimuli, newest first.', schema: stimulusPageSchema } },
    problems: ['invalid_cursor'],
    handler: async ({ deps, principal, query }) => ({ status: 200, body: await listStimuliPage(deps, principal.organisationId, query) }),
  }),
  defineRoute({
    method: 'get',
    path: '/stimuli/{stimulusId}',
    operationId: 'getStimulus',
    summary: 'Get a stimulus',
    description: STIMULUS_SAFETY_NOTE,
    tags: ['Stimuli'],
    permission: 'analyses:read',
    request: { params: stimulusParamsSchema },
    responses: { 200: { description: 'The stimulus.', schema: stimulusSchema } },
    problems: ['not_found'],
    handler: async ({ deps, principal, params }) => ({ status: 200, body: await getStimulus(deps, principal.organisationId, params.stimulusId) }),
  }),
  defineRoute({
    method: 'get',
    path: '/stimuli/{stimulusId}/audio',
    operationId: 'downloadStimulusAudio',
    summary: 'Download the stimulus WAV',
    description:
      'Mono WAV regenerated from the parameters: IEEE float 32-bit or 24-bit PCM (codes = round(x·2^23), AES17 ' +
      'scaling). Identical on every call; `ETag` and `If-None-Match` (304) let rigs cache it.\n\n' +
      STIMULUS_SAFETY_NOTE,
    tags: ['Stimuli'],
    permission: 'analyses:read',
    request: { params: stimulusParamsSchema, query: stimulusAudioQuerySchema },
    responses: { 200: { description: 'The WAV file.', contentType: 'audio/wav' }, 304: { description: 'Not modified (If-None-Match matched the ETag).' } },
    problems: ['not_found'],
    handler: async ({ deps, principal, params, query, req, res }) => {
      const row = await requireStimulusRow(deps, principal.organisationId, params.stimulusId);
      const etag = stimulusAudioTag(row, query.encoding);
      res.setHeader('ETag', etag);
      res.setHeader('Cache-Control', 'private, max-age=86400');
      if (req.headers['if-none-match'] === etag) return { status: 304 };
      const bytes = renderStimulusAudio(row, query.encoding);
      const base = (row.name ?? row.id).replace(/[^\w.-]+/g, '-').slice(0, 80);
      res.setHeader('Content-Type', 'audio/wav');
      res.setHeader('Content-Disposition', `attachment; filename="${base}-${query.encoding}.wav"`);
      res.status(200).end(Buffer.from(bytes.buffer, bytes.byteOffset, bytes.byteLength));
      return { status: 200 };
    },
  }),
];
