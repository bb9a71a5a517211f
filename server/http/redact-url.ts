/**
 * Request URLs as they go to the log, without invitation link tokens: a token in a log file would let anyone who
 * reads the log join the organisation. Covers the console page (/invitations/<token>) and ?token= queries.
 */
export function redactUrlSecrets(url: string): string {
  return url.replace(/(\/invitations\/)[0-9A-Za-z]{20,}/g, '$1[token]').replace(/([?&]token=)[^&#]*/g, '$1[token]');
}
