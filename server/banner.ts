import type { DemoSeedResult } from './db/seed/seed';

/** What `npm start` prints once the server listens. */
export function startBanner(options: { baseUrl: string; version: string; consoleBuilt: boolean; seed: DemoSeedResult | null; hostedSummary?: string[] }): string {
  const { baseUrl, seed } = options;
  const lines = [
    '',
    `Sweepline ${options.version} is running on ${baseUrl}`,
    `  Console    ${baseUrl}/${options.consoleBuilt ? '' : '   (not built: the console/ sources are missing)'}`,
    `  API        ${baseUrl}/v1          (health: ${baseUrl}/v1/health)`,
    `  API docs   ${baseUrl}/docs/`,
    ...(options.hostedSummary ?? []).map((line) => `  ${line}`),
  ];
  if (seed) {
    lines.push(
      '',
      `Demo organisation "${seed.organisationName}". Sign in with one of these (fixed demo passwords, for this local demo only):`,
      ...seed.members.map((member) => `  ${member.role.padEnd(8)} ${member.email.padEnd(28)} ${member.password}`),
      '',
    );
    if (seed.apiKeySecret) {
      lines.push(
        'Demo API key for rig scripts (shown only this once; copy it now):',
        `  ${seed.apiKeySecret}`,
        `  try: curl -H "Authorization: Bearer ${seed.apiKeySecret}" ${baseUrl}/v1/api-keys/current`,
      );
    } else {
      lines.push('The demo API key was printed when it was created, at the first start. To get a new one, sign in as', 'owner or admin and create a key under "API keys" in the console.');
    }
  }
  lines.push('', 'Press Ctrl-C to stop.', '');
  return lines.join('\n');
}
