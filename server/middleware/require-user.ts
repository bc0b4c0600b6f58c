import type { RequestHandler } from 'express';
import { HttpError } from '../http-error';
import type { User } from '../models';

/** 401 unless someone is signed in. */
export const requireUser: RequestHandler = (req, _res, next) => {
  if (!req.user) throw new HttpError(401, 'unauthenticated', 'Sign in first');
  next();
};

/** The signed-in person; use after requireUser. */
export function currentUser(req: { user?: Express.User }): User {
  if (!req.user) throw new HttpError(401, 'unauthenticated', 'Sign in first');
  return req.user;
}

/** 403 unless the signed-in person is an admin of their organisation. */
export const requireOrgAdmin: RequestHandler = (req, _res, next) => {
  if (!currentUser(req).isOrgAdmin) throw new HttpError(403, 'forbidden', 'Only an organisation admin may do this');
  next();
};
