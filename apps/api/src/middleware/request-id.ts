import { randomUUID } from 'node:crypto';
import type { RequestHandler } from 'express';

/** A request id for logs and error bodies; a well-formed incoming `x-request-id` is kept. */
export const requestId: RequestHandler = (req, res, next) => {
  const incoming = req.get('x-request-id');
  req.id = incoming && /^[A-Za-z0-9-]{8,64}$/.test(incoming) ? incoming : randomUUID();
  res.setHeader('x-request-id', req.id);
  next();
};
