import type { NextFunction, Request, Response } from 'express';
import { newId } from '@server/lib/ids';

const ACCEPTABLE_INCOMING_ID = /^[A-Za-z0-9._:-]{8,128}$/;
const REQUEST_ID = Symbol('requestId');

type WithRequestId = Request & { [REQUEST_ID]?: string };

/**
 * Takes the caller's X-Request-Id when it looks like an id (so a rig can correlate its own logs), otherwise
 * makes one; echoes it in the response and in every problem's `instance`.
 */
export function requestId() {
  return (req: Request, res: Response, next: NextFunction) => {
    const incoming = req.get('x-request-id');
    const id = incoming && ACCEPTABLE_INCOMING_ID.test(incoming) ? incoming : newId('request');
    (req as WithRequestId)[REQUEST_ID] = id;
    res.setHeader('X-Request-Id', id);
    next();
  };
}

export function requestIdOf(req: Request): string {
  return (req as WithRequestId)[REQUEST_ID] ?? 'unknown';
}
