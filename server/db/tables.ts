/** Every table, for the Drizzle client and for code that needs more than one group. */
export * from './schema/identity';
export * from './schema/api-keys';
export * from './schema/audit-events';
export * from './schema/sign-in-failures';
export * from './schema/stimuli';
export * from './schema/captures';
export * from './schema/analyses';
