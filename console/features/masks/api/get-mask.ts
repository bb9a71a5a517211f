import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient } from '@console/lib/api-client';
import type { Mask, MaskVersion } from '@shared/schemas/masks';
import { maskKeys } from './keys';

export const getMask = (maskId: string) => apiClient.get<Mask>(`/masks/${encodeURIComponent(maskId)}`);

export const getMaskQueryOptions = (maskId: string) => queryOptions({ queryKey: maskKeys.detail(maskId), queryFn: () => getMask(maskId) });

export const useMask = (maskId: string) => useQuery(getMaskQueryOptions(maskId));

/** Every version, newest first; versions never change, so the list only grows. */
export const getMaskVersions = (maskId: string) => apiClient.get<{ data: MaskVersion[] }>(`/masks/${encodeURIComponent(maskId)}/versions`);

export const getMaskVersionsQueryOptions = (maskId: string) =>
  queryOptions({ queryKey: maskKeys.versions(maskId), queryFn: () => getMaskVersions(maskId) });

export const useMaskVersions = (maskId: string) => useQuery(getMaskVersionsQueryOptions(maskId));
