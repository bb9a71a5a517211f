import type { NextFunction, Request, Response } from 'express';
import type { Logger } from '@server/lib/logger';
import { ApiProblem } from './api-problem';
import { sendProblem } from './problem-response';

interface HttpLikeError {
  type?: string;
  status?: number;
  statusCode?: number;
  expose?: boolean;
}

/** Errors raised by Express and body-parser before our handlers run, as problems. */
function problemFromFrameworkError(error: HttpLikeError, limitBytes: number): ApiProblem | null {
  switch (error.type) {
    case 'entity.parse.failed':
      return new ApiProblem('malformed_json', 'The body could not be parsed as JSON. Check quotes, commas and brackets.');
    case 'entity.too.large':
      return new ApiProblem('payload_too_large', `The body is larger than the limit of ${limitBytes} bytes.`);
    case 'encoding.unsupported':
    case 'charset.unsupported':
      return new ApiProblem('unsupported_media_type', 'Send the JSON body in UTF-8 without a content encoding.');
    case 'request.aborted':
    case 'request.size.invalid':
    case 'stream.encoding.set':
      return new ApiProblem('bad_request', 'The request body was incomplete or inconsistent with its headers.');
    default:
      break;
  }
  const status = error.status ?? error.statusCode;
  if (typeof status === 'number' && status >= 400 && status < 500) {
    return new ApiProblem('bad_request', 'The request could not be understood (for example a malformed URL).');
  }
  return null;
}

/**
 * Last middleware: every error becomes application/problem+json. Unknown errors are logged with the request
 * id and answered 500 without their message, stack or SQL.
 */
export function errorHandler(options: { logger: Logger; jsonBodyLimitBytes: number }) {
  return (error: unknown, req: Request, res: Response, next: NextFunction) => {
    if (res.headersSent) return next(error);
    if (error instanceof ApiProblem) return sendProblem(req, res, error);
    const mapped = error && typeof error === 'object' ? problemFromFrameworkError(error as HttpLikeError, options.jsonBodyLimitBytes) : null;
    if (mapped) return sendProblem(req, res, mapped);
    const log = (req as Request & { log?: Logger }).log ?? options.logger;
    log.error({ err: error }, 'unhandled error');
    sendProblem(req, res, new ApiProblem('internal_error', 'An unexpected error occurred. Quote the request id when reporting it.'));
  };
}
