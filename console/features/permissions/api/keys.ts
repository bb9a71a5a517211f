export const permissionKeys = {
  all: ['permissions'] as const,
  catalogue: () => [...permissionKeys.all, 'catalogue'] as const,
};
