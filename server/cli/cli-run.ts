import { isEngineError } from '@shared/dsp';
import { UsageError } from './cli-args';

/**
 * Exit codes: 0 done, 2 the engine refused the input (EngineError, printed as JSON on stderr with its code and
 * field), 64 a usage error, 1 anything unexpected.
 */
export async function runCli(main: () => Promise<void> | void): Promise<void> {
  try {
    await main();
  } catch (error) {
    if (error instanceof UsageError) {
      process.stderr.write(`${error.message}\n`);
      process.exitCode = 64;
    } else if (isEngineError(error)) {
      const body = { error: { code: error.code, message: error.message, field: error.field ?? null, details: error.details ?? null } };
      process.stderr.write(`${JSON.stringify(body, null, 2)}\n`);
      process.exitCode = 2;
    } else {
      process.stderr.write(`${error instanceof Error ? (error.stack ?? error.message) : String(error)}\n`);
      process.exitCode = 1;
    }
  }
}
