import type { Request, Response } from 'express';
import { PROBLEMS, problemTypeUri } from '@shared/problems';
import type { Problem } from '@shared/schemas/problem';
import { ApiProblem } from './api-problem';
import { requestIdOf } from './request-id';

export function problemBody(req: Request, problem: ApiProblem): Problem {
  const requestId = requestIdOf(req);
  return {
    ...problem.extensions,
    type: problemTypeUri(problem.code),
    title: PROBLEMS[problem.code].title,
    status: problem.status,
    detail: problem.detail,
    instance: `/v1/requests/${requestId}`,
    code: problem.code,
    requestId,
    ...(problem.errors ? { errors: problem.errors } : {}),
  };
}

export function sendProblem(req: Request, res: Response, problem: ApiProblem): void {
  for (const [name, value] of Object.entries(problem.headers)) res.setHeader(name, value);
  res.status(problem.status).type('application/problem+json').send(JSON.stringify(problemBody(req, problem)));
}
