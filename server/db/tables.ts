/** Every table, for the Drizzle client and for code that needs more than one group. */
export * from './schema/identity';
export * from './schema/api-keys';
export * from './schema/audit-events';
export * from './schema/sign-in-failures';
export * from './schema/stimuli';
export * from './schema/captures';
export * from './schema/analyses';
export * from './schema/idempotency';
export * from './schema/plans';
export * from './schema/usage';
export * from './schema/calibrations';
export * from './schema/masks';
export * from './schema/webhooks';
export * from './schema/invitations';
export * from './schema/revoked-sessions';
