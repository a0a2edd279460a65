import type { ErrorRequestHandler, RequestHandler } from 'express';
import { ZodError } from 'zod';
import multer from 'multer';
import {
  BaseError,
  ConnectionError,
  ConnectionAcquireTimeoutError,
  ForeignKeyConstraintError,
  UniqueConstraintError,
} from 'sequelize';
import type { ApiErrorBody, ErrorCode } from '@stringfield/shared';
import { env } from '../config/env.ts';
import { AppError } from '../lib/app-error.ts';
import { logger } from '../lib/logger.ts';

function body(code: ErrorCode, message: string, requestId: string, fields?: Record<string, string>): ApiErrorBody {
  return { error: { code, message, ...(fields ? { fields } : {}), requestId } };
}

/** Zod issues as `{ "field.path": "message" }`, the first message per field. */
export function zodFields(err: ZodError): Record<string, string> {
  const fields: Record<string, string> = {};
  for (const issue of err.issues) {
    const key = issue.path.length ? issue.path.join('.') : '_';
    fields[key] ??= issue.message;
  }
  return fields;
}

function isDatabaseUnavailable(err: unknown): boolean {
  if (err instanceof ConnectionError || err instanceof ConnectionAcquireTimeoutError) return true;
  if (err instanceof BaseError) {
    const parent = (err as BaseError & { parent?: { code?: string; fatal?: boolean } }).parent;
    if (parent?.fatal || /ECONNREFUSED|ER_GET_CONNECTION_TIMEOUT|ER_SOCKET_UNEXPECTED_CLOSE|ER_CONNECTION_ALREADY_CLOSED/.test(parent?.code ?? '')) return true;
  }
  const code = (err as { code?: string } | null)?.code ?? '';
  return /^(ECONNREFUSED|ER_GET_CONNECTION_TIMEOUT|ER_SOCKET_UNEXPECTED_CLOSE|ER_CONNECTION_ALREADY_CLOSED)$/.test(code);
}

/** Two writes met on the same records (a deadlock, or a lock held too long): nothing was saved, and a retry works. */
function isLockConflict(err: unknown): boolean {
  const parent = err instanceof BaseError ? (err as BaseError & { parent?: { code?: string; errno?: number } }).parent : undefined;
  const code = parent?.code ?? (err as { code?: string } | null)?.code ?? '';
  return code === 'ER_LOCK_DEADLOCK' || code === 'ER_LOCK_WAIT_TIMEOUT' || parent?.errno === 1213 || parent?.errno === 1205;
}

export const notFoundApi: RequestHandler = (req, _res, next) => {
  next(new AppError('NOT_FOUND', `There is no API route ${req.method} ${req.path}.`));
};

/** The one error handler: every failure leaves as `{ error: { code, message, fields?, requestId } }`. */
export const errorHandler: ErrorRequestHandler = (err: unknown, req, res, _next) => {
  const rid = typeof req.id === 'string' || typeof req.id === 'number' ? String(req.id) : 'unknown';
  if (res.headersSent) {
    logger.error({ err, requestId: rid }, 'error after headers were sent');
    return;
  }
  if (err instanceof AppError) {
    res.status(err.status).json({ ...body(err.code, err.message, rid, err.fields), ...(err.extra ?? {}) });
    return;
  }
  if (err instanceof ZodError) {
    const fields = zodFields(err);
    const first = Object.values(fields)[0] ?? 'Some fields need attention.';
    const message = Object.keys(fields).length > 1 ? `${first} (and ${Object.keys(fields).length - 1} more)` : first;
    res.status(400).json(body('VALIDATION_FAILED', message, rid, fields));
    return;
  }
  const e = err as { type?: string; status?: number; code?: string };
  if (e?.type === 'entity.parse.failed') {
    res.status(400).json(body('VALIDATION_FAILED', 'The request body is not valid JSON.', rid));
    return;
  }
  if (e?.type === 'entity.too.large') {
    res.status(413).json(body('PAYLOAD_TOO_LARGE', 'The request body is too large (at most 100 kB of JSON).', rid));
    return;
  }
  if (e?.type === 'encoding.unsupported' || e?.type === 'charset.unsupported') {
    res.status(415).json(body('VALIDATION_FAILED', 'Send the request body as UTF-8 JSON.', rid));
    return;
  }
  if (err instanceof multer.MulterError) {
    const tooBig = err.code === 'LIMIT_FILE_SIZE';
    const message = tooBig
      ? `A file is too large (${err.field === 'files' ? `photos at most ${env.UPLOAD_MAX_MB} MB each` : 'at most 10 MB'}).`
      : err.code === 'LIMIT_FILE_COUNT'
        ? `Too many files at once (at most ${env.UPLOAD_MAX_FILES}).`
        : err.code === 'LIMIT_UNEXPECTED_FILE'
          ? `Unexpected file field "${err.field ?? ''}": send photos as "files" and CSV files as "file".`
          : `The upload was refused: ${err.message}.`;
    res.status(tooBig ? 413 : 400).json(body(tooBig ? 'PAYLOAD_TOO_LARGE' : 'VALIDATION_FAILED', message, rid));
    return;
  }
  if (e?.code === 'EBADCSRFTOKEN') {
    res
      .status(403)
      .json(body('CSRF_FAILED', 'The security token is missing or out of date. Reload the page and try again.', rid));
    return;
  }
  if (err instanceof UniqueConstraintError) {
    res.status(409).json(body('CONFLICT', 'That record already exists.', rid));
    return;
  }
  if (err instanceof ForeignKeyConstraintError) {
    res.status(409).json(body('CONFLICT', 'That record is still referenced elsewhere, or refers to something missing.', rid));
    return;
  }
  if (isLockConflict(err)) {
    logger.warn({ requestId: rid, err: (err as Error).message }, 'lock conflict');
    res.status(409).json(body('CONFLICT', 'Someone else was changing the same ticket at that moment; nothing was saved. Send it again.', rid));
    return;
  }
  if (isDatabaseUnavailable(err)) {
    logger.warn({ requestId: rid, err: (err as Error).message }, 'database unavailable');
    res.setHeader('Retry-After', '5');
    res.status(503).json(body('UNAVAILABLE', 'The database is not answering right now. Try again in a minute.', rid));
    return;
  }
  logger.error({ err, requestId: rid }, 'unhandled error');
  res.status(500).json(body('INTERNAL', `Something went wrong on our side. Quote request id ${rid} if it happens again.`, rid));
};
