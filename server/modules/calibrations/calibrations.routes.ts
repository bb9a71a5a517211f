import { z } from 'zod';
import {
  calibrationListQuerySchema,
  calibrationPageSchema,
  calibrationParamsSchema,
  calibrationSchema,
  calibrationSettingsSchema,
  createCalibrationRequestSchema,
} from '@shared/schemas/calibrations';
import { defineRoute } from '@server/http/define-route';
import {
  createCalibration,
  getCalibration,
  getCalibrationSettings,
  listCalibrationsPage,
  updateCalibrationSettings,
} from './calibrations.service';

const CAUTION =
  'Absolute levels are only as good as the calibration: it holds for the microphone, preamp and interface gain it was ' +
  'made with. Follow your lab\'s calibration procedure and the applicable standards; a calibrator at 94 or 114 dB SPL ' +
  'is loud at the ear, so keep it on the microphone.';

export const calibrationRoutes = [
  defineRoute({
    method: 'get',
    path: '/calibration-settings',
    operationId: 'getCalibrationSettings',
    summary: 'Get the organisation\'s calibration settings',
    tags: ['Calibrations'],
    permission: 'calibrations:read',
    responses: { 200: { description: 'The settings.', schema: calibrationSettingsSchema } },
    handler: async ({ deps, principal }) => ({ status: 200, body: await getCalibrationSettings(deps, principal.organisationId) }),
  }),
  defineRoute({
    method: 'put',
    path: '/calibration-settings',
    operationId: 'updateCalibrationSettings',
    summary: 'Change the organisation\'s calibration settings',
    description: 'expiredCalibration: `warn` runs analyses that name an expired calibration with a warning; `refuse` answers them 422 calibration_expired.',
    tags: ['Calibrations'],
    permission: 'calibrations:write',
    request: { body: calibrationSettingsSchema },
    responses: { 200: { description: 'The settings now in force.', schema: calibrationSettingsSchema } },
    handler: async ({ deps, principal, body }) => ({ status: 200, body: await updateCalibrationSettings(deps, principal.organisationId, body, principal.actor) }),
  }),
  defineRoute({
    method: 'post',
    path: '/calibrations',
    operationId: 'createCalibration',
    summary: 'Create a calibration for a rig input',
    description:
      'From a calibrator capture (`source: calibrator_capture`: the capture id, its channel, the calibrator\'s stated level ' +
      'and frequency; the tone is measured with a flat-top window and checked for frequency, stability and SNR), from the ' +
      'chain sensitivity in dBFS at 1 Pa (`entered_dbfs`), or from a microphone sensitivity in mV/Pa and the ADC\'s ' +
      'full-scale voltage (`entered_microphone`: dBFS at 1 Pa = 20·log10(M / V_FS,rms)). Analyses naming the rig and input ' +
      `use the latest calibration valid at the time. ${CAUTION}`,
    tags: ['Calibrations'],
    permission: 'calibrations:write',
    idempotency: 'required',
    request: { body: createCalibrationRequestSchema },
    responses: {
      201: { description: 'The calibration.', schema: calibrationSchema, headers: { location: { description: 'URL of the calibration.', schema: z.string() } } },
    },
    problems: ['not_found', 'calibration_invalid'],
    handler: async ({ deps, principal, body }) => {
      const calibration = await createCalibration(deps, principal, body);
      return { status: 201, body: calibration, headers: { Location: `/v1/calibrations/${calibration.id}` } };
    },
  }),
  defineRoute({
    method: 'get',
    path: '/calibrations',
    operationId: 'listCalibrations',
    summary: 'List calibrations',
    description: 'Newest first; filter by rig and input channel.',
    tags: ['Calibrations'],
    permission: 'calibrations:read',
    request: { query: calibrationListQuerySchema },
    responses: { 200: { description: 'A page of calibrations.', schema: calibrationPageSchema } },
    problems: ['invalid_cursor'],
    handler: async ({ deps, principal, query }) => ({ status: 200, body: await listCalibrationsPage(deps, principal.organisationId, query) }),
  }),
  defineRoute({
    method: 'get',
    path: '/calibrations/{calibrationId}',
    operationId: 'getCalibration',
    summary: 'Get a calibration',
    tags: ['Calibrations'],
    permission: 'calibrations:read',
    request: { params: calibrationParamsSchema },
    responses: { 200: { description: 'The calibration.', schema: calibrationSchema } },
    problems: ['not_found'],
    handler: async ({ deps, principal, params }) => ({ status: 200, body: await getCalibration(deps, principal.organisationId, params.calibrationId) }),
  }),
];
