import type { RequestHandler } from 'express';
import { mayInOrganisation, type OrganisationAction } from '@/shared/access/permissions';
import { HttpError } from '../http-error';
import type { User } from '../models';

const readMethods = new Set(['GET', 'HEAD', 'OPTIONS']);

/** Whether a request of this method only reads (and so needs no CSRF token, body or write limit). */
export const isReadMethod = (method: string): boolean => readMethods.has(method);

/** 401 unless someone is signed in (by session or access token). */
export const requireUser: RequestHandler = (req, _res, next) => {
  if (!req.user) throw new HttpError(401, 'unauthenticated', 'Sign in first');
  next();
};

/** The signed-in person; use after requireUser. */
export function currentUser(req: { user?: Express.User }): User {
  if (!req.user) throw new HttpError(401, 'unauthenticated', 'Sign in first');
  return req.user;
}

/** 403 unless the organisation permission table lets the signed-in person take the action. */
export function requireInOrganisation(action: OrganisationAction): RequestHandler {
  return (req, _res, next) => {
    if (!mayInOrganisation(action, currentUser(req))) throw new HttpError(403, 'forbidden', 'Only an organisation admin may do this');
    next();
  };
}
