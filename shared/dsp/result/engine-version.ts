/** Recorded in every result so a number can always be traced to the code that computed it. Bump on any change of output. */
export const ENGINE_VERSION = 'sweepline-engine/0.1.0';
