import type { NextFunction, Request, Response } from 'express';

/**
 * For the progress stream only (FitsModule applies it to that one route): a browser's EventSource
 * cannot set Authorization, so a token given as ?access_token= is moved into the header the JWT
 * guard reads. A header, when present, wins.
 */
export function accessTokenFromQuery(req: Request, _res: Response, next: NextFunction): void {
  const token = req.query.access_token;
  if (typeof token === 'string' && token !== '' && !req.headers.authorization)
    req.headers.authorization = `Bearer ${token}`;
  next();
}
