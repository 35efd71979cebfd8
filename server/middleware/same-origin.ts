import type { NextFunction, Request, Response } from 'express';
import { AppError } from '#shared/errors.ts';

const SAFE_METHODS = new Set(['GET', 'HEAD', 'OPTIONS']);

/**
 * Cross-site request forgery: a request that changes something and carries cookies must come
 * from one of our own pages. Browsers say where a request comes from in Sec-Fetch-Site (and in
 * Origin); a request from another site is refused. Requests without cookies carry no one's
 * session, and clients that are not browsers send neither header: both pass.
 */
export function sameOriginMutations(appUrl: string) {
  const ownOrigin = new URL(appUrl).origin;
  return (req: Request, _res: Response, next: NextFunction) => {
    if (SAFE_METHODS.has(req.method) || !req.headers.cookie) return next();
    const site = req.headers['sec-fetch-site'];
    const origin = req.headers.origin;
    // Sec-Fetch-Site when the browser sends it; otherwise Origin ("null" is never ours).
    const crossSite = site ? site !== 'same-origin' && site !== 'none' : origin !== undefined && origin !== ownOrigin;
    if (crossSite)
      return next(new AppError('FORBIDDEN', 'This request came from another site and was refused. Open Etchwell itself and try again.'));
    next();
  };
}
