import type { EngineWarning } from '@shared/dsp';
import type { Calibration, CalibrationListQuery, CalibrationSettings, CreateCalibrationRequest } from '@shared/schemas/calibrations';
import type { Page } from '@shared/schemas/pagination';
import type { AppDeps } from '@server/deps';
import { ApiProblem, invalidField, notFound } from '@server/http/api-problem';
import { decodeCursor, toPage } from '@server/http/pagination';
import type { Actor, Principal } from '@server/http/principal';
import { recordAuditEvent, recordAuditEventBy } from '@server/modules/audit/audit.service';
import { newId } from '@server/lib/ids';
import { getOrganisationPlan, setExpiredCalibrationPolicy } from '@server/modules/usage/organisation-plan.service';
import { calibrationFigures } from './calibration-figures';
import { findCalibration, insertCalibration, listCalibrations, listStartedCalibrationsOfInput, type CalibrationRow } from './calibrations.repo';

function statusAt(row: CalibrationRow, at: Date): Calibration['status'] {
  if (row.validFrom.getTime() > at.getTime()) return 'not_yet_valid';
  if (row.validUntil && row.validUntil.getTime() <= at.getTime()) return 'expired';
  return 'valid';
}

function presentCalibration(row: CalibrationRow, now: Date): Calibration {
  const { warnings, ...details } = row.details as { warnings?: EngineWarning[] } & Record<string, unknown>;
  return {
    id: row.id,
    rigId: row.rigId,
    inputChannel: row.inputChannel,
    source: row.source,
    dbfsAtOnePascal: row.dbfsAtOnePascal,
    details,
    warnings: (warnings ?? []) as Calibration['warnings'],
    notes: row.notes,
    validFrom: row.validFrom.toISOString(),
    validUntil: row.validUntil?.toISOString() ?? null,
    status: statusAt(row, now),
    createdBy: row.createdByLabel,
    createdAt: row.createdAt.toISOString(),
  };
}

export async function createCalibration(deps: AppDeps, principal: Principal, input: CreateCalibrationRequest): Promise<Calibration> {
  const orgId = principal.organisationId;
  const now = deps.clock.now();
  const validFrom = input.validFrom ? new Date(input.validFrom) : now;
  const validUntil = input.validUntil ? new Date(input.validUntil) : null;
  if (validUntil && validUntil.getTime() <= validFrom.getTime()) throw invalidField('#/validUntil', 'validUntil must lie after validFrom.');
  const figures = await calibrationFigures(deps, orgId, input);
  const id = newId('calibration');
  await deps.db.transaction(async (tx) => {
    await insertCalibration(tx, orgId, {
      id,
      rigId: input.rigId,
      inputChannel: input.inputChannel,
      source: input.source,
      dbfsAtOnePascal: figures.dbfsAtOnePascal,
      details: { ...figures.details, warnings: figures.warnings },
      notes: input.notes ?? null,
      validFrom,
      validUntil,
      createdByLabel: principal.actor.label.slice(0, 200),
      createdAt: now,
    });
    await recordAuditEvent(tx, orgId, principal.actor, {
      action: 'calibration.created',
      objectType: 'calibration',
      objectId: id,
      details: { rigId: input.rigId, inputChannel: input.inputChannel, source: input.source, dbfsAtOnePascal: figures.dbfsAtOnePascal, validUntil: validUntil?.toISOString() ?? null },
    }, now);
  });
  return getCalibration(deps, orgId, id);
}

export async function getCalibration(deps: AppDeps, orgId: string, calibrationId: string): Promise<Calibration> {
  const row = await findCalibration(deps.db, orgId, calibrationId);
  if (!row) throw notFound('calibration');
  return presentCalibration(row, deps.clock.now());
}

export async function listCalibrationsPage(deps: AppDeps, orgId: string, query: CalibrationListQuery): Promise<Page<Calibration>> {
  const binding = { list: 'calibrations', organisationId: orgId, rigId: query.rigId, inputChannel: query.inputChannel };
  const rows = await listCalibrations(
    deps.db,
    orgId,
    { rigId: query.rigId, inputChannel: query.inputChannel },
    { limit: query.limit, after: decodeCursor(deps, binding, query.cursor) },
  );
  const now = deps.clock.now();
  return toPage(deps, binding, rows, query.limit, (row) => row, (row) => presentCalibration(row, now));
}

export async function getCalibrationSettings(deps: AppDeps, orgId: string): Promise<CalibrationSettings> {
  return { expiredCalibration: (await getOrganisationPlan(deps, orgId)).expiredCalibrationPolicy };
}

export async function updateCalibrationSettings(deps: AppDeps, orgId: string, settings: CalibrationSettings, actor?: Actor): Promise<CalibrationSettings> {
  const before = await getCalibrationSettings(deps, orgId);
  await setExpiredCalibrationPolicy(deps, orgId, settings.expiredCalibration);
  if (before.expiredCalibration !== settings.expiredCalibration) {
    await recordAuditEventBy(deps.db, orgId, actor, {
      action: 'calibration_settings.updated',
      objectType: 'organisation',
      objectId: orgId,
      details: { expiredCalibration: { from: before.expiredCalibration, to: settings.expiredCalibration } },
    }, deps.clock.now());
  }
  return getCalibrationSettings(deps, orgId);
}

/** What an analysis records as the calibration it applied (the measure worker stores it with the result). */
export interface AppliedCalibration {
  id: string;
  rigId: string;
  inputChannel: number;
  dbfsAtOnePascal: number;
  validFrom: string;
  validUntil: string | null;
  /** True when `at` is past validUntil; the analysis then carries a calibration_expired warning. */
  expired: boolean;
  source: Calibration['source'];
}

export interface CalibrationReference {
  calibrationId?: string;
  rigId?: string;
  inputChannel?: number;
}

function expiredProblem(row: CalibrationRow): ApiProblem {
  return new ApiProblem(
    'calibration_expired',
    `Calibration ${row.id} (${row.rigId} input ${row.inputChannel}) expired at ${row.validUntil!.toISOString()}; the organisation refuses analyses with expired calibrations. Calibrate the rig again.`,
    {
      extensions: { calibrationId: row.id, validUntil: row.validUntil!.toISOString() },
      errors: [{ in: 'body', pointer: '#/calibration', detail: 'The calibration has expired.' }],
    },
  );
}

/**
 * The calibration an analysis applies: the named one, or the current one of a rig input (the latest that had
 * started at `at` and has not expired; else the latest started, which is expired). Null when the analysis names
 * none (results stay relative, dBFS). Unknown id or a rig input without calibrations → 422 calibration_not_found.
 * Expired → `expired: true` (warning), or 422 calibration_expired when the organisation refuses them.
 */
export async function resolveCalibrationForAnalysis(
  deps: AppDeps,
  orgId: string,
  reference: CalibrationReference | null | undefined,
  at: Date = deps.clock.now(),
): Promise<AppliedCalibration | null> {
  if (!reference || (reference.calibrationId === undefined && reference.rigId === undefined)) return null;
  let row: CalibrationRow | undefined;
  if (reference.calibrationId !== undefined) {
    row = await findCalibration(deps.db, orgId, reference.calibrationId);
  } else {
    const candidates = await listStartedCalibrationsOfInput(deps.db, orgId, { rigId: reference.rigId!, inputChannel: reference.inputChannel ?? 0 }, at, 20);
    row = candidates.find((candidate) => statusAt(candidate, at) === 'valid') ?? candidates[0];
  }
  if (!row) {
    const what = reference.calibrationId ?? `rig ${reference.rigId} input ${reference.inputChannel ?? 0}`;
    throw new ApiProblem('calibration_not_found', `No calibration for ${what} exists in the active organisation (valid at ${at.toISOString()}).`, {
      errors: [{ in: 'body', pointer: '#/calibration', detail: 'Create the calibration first (POST /v1/calibrations).' }],
    });
  }
  const expired = row.validUntil !== null && row.validUntil.getTime() <= at.getTime();
  if (expired && (await getOrganisationPlan(deps, orgId)).expiredCalibrationPolicy === 'refuse') throw expiredProblem(row);
  return {
    id: row.id,
    rigId: row.rigId,
    inputChannel: row.inputChannel,
    dbfsAtOnePascal: row.dbfsAtOnePascal,
    validFrom: row.validFrom.toISOString(),
    validUntil: row.validUntil?.toISOString() ?? null,
    expired,
    source: row.source,
  };
}
