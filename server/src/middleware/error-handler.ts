import type { ErrorRequestHandler } from 'express';
import { ZodError } from 'zod';
import { AppError } from '../lib/app-error';
import { ThermoError } from '../thermo';

interface BodyParserError {
  type?: string;
  status?: number;
}

/** The one place errors become responses: `{"error":{code,message,…}}`, never a stack trace. */
export const errorHandler: ErrorRequestHandler = (err: unknown, req, res, _next) => {
  const { status, body } = toResponse(err);
  if (status >= 500) req.log?.error({ err }, 'unhandled error');
  if (res.headersSent) return;
  res.status(status).json({ error: body });
};

function toResponse(err: unknown): { status: number; body: Record<string, unknown> } {
  if (err instanceof AppError) {
    return { status: err.status, body: { code: err.code, message: err.message, ...err.details } };
  }
  if (err instanceof ZodError) {
    return {
      status: 400,
      body: {
        code: 'validation_error',
        message: err.issues.map((i) => `${i.path.join('.') || 'body'}: ${i.message}`).join('; '),
        issues: err.issues.map((i) => ({ path: i.path, message: i.message })),
      },
    };
  }
  if (err instanceof ThermoError) {
    return {
      status:
        err.code === 'parse_error' || err.code === 'unknown_element' || err.code === 'invalid_input'
          ? 400
          : 422,
      body: { code: err.code, message: err.message, ...err.details },
    };
  }
  const bp = err as BodyParserError;
  if (bp?.type === 'entity.parse.failed') {
    return {
      status: 400,
      body: { code: 'invalid_json', message: 'The request body is not valid JSON' },
    };
  }
  if (bp?.type === 'entity.too.large') {
    return {
      status: 413,
      body: { code: 'payload_too_large', message: 'The request body is too large' },
    };
  }
  if (typeof bp?.status === 'number' && bp.status >= 400 && bp.status < 500) {
    return {
      status: bp.status,
      body: { code: 'bad_request', message: 'The request could not be read' },
    };
  }
  return {
    status: 500,
    body: { code: 'internal_error', message: 'Something went wrong on our side' },
  };
}
