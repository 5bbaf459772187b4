import type { RequestHandler } from 'express';
import { CLIENT_IP_HEADER } from '../auth';

/**
 * Hands better-auth's rate limit the client address Express derived (the socket, or the nearest proxy that
 * 'trust proxy' names), replacing anything the client sent in that header: a client cannot choose its own key.
 */
export const clientIpForAuth: RequestHandler = (req, _res, next) => {
  delete req.headers[CLIENT_IP_HEADER];
  if (req.ip) req.headers[CLIENT_IP_HEADER] = req.ip;
  next();
};
