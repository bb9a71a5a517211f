export const billingKeys = {
  all: ['billing'] as const,
  plans: () => [...billingKeys.all, 'plans'] as const,
  account: () => [...billingKeys.all, 'account'] as const,
  invoices: () => [...billingKeys.all, 'invoices'] as const,
};
