import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient } from '@console/lib/api-client';
import type { MaskVersion } from '@shared/schemas/masks';
import { analysisKeys } from './keys';

/** The limit lines of the mask version a verdict names, to draw the band on the response plot. */
export const getMaskVersion = (maskId: string, version: number) =>
  apiClient.get<MaskVersion>(`/masks/${encodeURIComponent(maskId)}/versions/${version}`);

export const getMaskVersionQueryOptions = (maskId: string, version: number) =>
  queryOptions({
    queryKey: analysisKeys.maskVersion(maskId, version),
    queryFn: () => getMaskVersion(maskId, version),
    staleTime: Infinity,
  });

/** Versions never change once written, so one fetch per version is enough. */
export const useMaskVersion = (mask: { maskId: string; version: number } | null) =>
  useQuery({ ...getMaskVersionQueryOptions(mask?.maskId ?? '', mask?.version ?? 0), enabled: mask !== null });
