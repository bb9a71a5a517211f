import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient } from '@console/lib/api-client';
import type { PermissionCatalogue } from '@shared/schemas/permissions';
import { permissionKeys } from './keys';

/** Scopes a key can carry and what each role may do; changes only with a release, so it stays fresh long. */
export const getPermissions = () => apiClient.get<PermissionCatalogue>('/permissions');

export const getPermissionsQueryOptions = () =>
  queryOptions({ queryKey: permissionKeys.catalogue(), queryFn: getPermissions, staleTime: 10 * 60_000 });

export const usePermissions = () => useQuery(getPermissionsQueryOptions());
