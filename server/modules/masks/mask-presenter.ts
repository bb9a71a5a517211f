import type { Mask, MaskVersion } from '@shared/schemas/masks';
import type { MaskRow, MaskVersionRow } from './masks.repo';

export function presentMaskVersion(row: MaskVersionRow): MaskVersion {
  return {
    version: row.version,
    levelReference: row.levelReference,
    referenceLevel: (row.reference as MaskVersion['referenceLevel']) ?? null,
    upper: row.upper ?? null,
    lower: row.lower ?? null,
    note: row.note,
    derivation: (row.derivation as MaskVersion['derivation']) ?? null,
    createdAt: row.createdAt.toISOString(),
  };
}

export function presentMaskSummary(row: MaskRow): Omit<Mask, 'current'> {
  return {
    id: row.id,
    name: row.name,
    latestVersion: row.latestVersion,
    createdAt: row.createdAt.toISOString(),
    updatedAt: row.updatedAt.toISOString(),
  };
}

export function presentMask(row: MaskRow, current: MaskVersionRow): Mask {
  return { ...presentMaskSummary(row), current: presentMaskVersion(current) };
}
