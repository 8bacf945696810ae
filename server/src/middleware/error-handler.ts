import type { ErrorRequestHandler } from 'express';
import { ZodError } from 'zod';
import { AppError } from '../lib/app-error';
import { ThermoError, type ThermoErrorCode } from '../thermo';

/**
 * HTTP status of every engine error code. Exhaustive by type: a new code does not compile until
 * it is mapped here. 400: the request cannot be read as chemistry (syntax, an element symbol that
 * does not exist, a value the engine refuses); 422: it reads fine but cannot be computed.
 */
export const THERMO_ERROR_STATUS: Record<ThermoErrorCode, number> = {
  parse_error: 400,
  unknown_element: 400,
  invalid_input: 400,
  unbalanced: 422,
  no_combination: 422,
  not_unique: 422,
  out_of_range: 422,
  missing_data: 422,
};

interface BodyParserError {
  type?: string;
  status?: number;
  charset?: string;
  encoding?: string;
}

type IssuePath = readonly PropertyKey[];

/** A field path as programs address it: `steps[2].deltaH`. */
export function fieldPath(path: IssuePath): string {
  let out = '';
  for (const seg of path) {
    if (typeof seg === 'number') out += `[${seg}]`;
    else out += (out === '' ? '' : '.') + String(seg);
  }
  return out === '' ? 'body' : out;
}

/** The same place as a person counts on a form: `step 3 deltaH` (list items from 1). */
function placeForPeople(path: IssuePath): string {
  const parts: string[] = [];
  for (const seg of path) {
    if (typeof seg !== 'number') {
      parts.push(String(seg));
      continue;
    }
    const list = parts.pop() ?? 'item';
    const one = /[^s]s$/.test(list) && !list.endsWith('species') ? list.slice(0, -1) : list;
    parts.push(`${one} ${seg + 1}`);
  }
  return parts.join(' ');
}

function validationBody(err: ZodError): Record<string, unknown> {
  const issues = err.issues.map((i) => ({
    path: i.path,
    field: fieldPath(i.path),
    message: i.message,
  }));
  const message = err.issues
    .map((i) => {
      const field = fieldPath(i.path);
      const place = placeForPeople(i.path);
      return `${place === '' || place === field ? field : `${place} (${field})`}: ${i.message}`;
    })
    .join('; ');
  return {
    code: 'validation_error',
    message,
    ...(issues.length === 1 ? { field: issues[0]!.field } : {}),
    issues,
  };
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
    return { status: 400, body: validationBody(err) };
  }
  if (err instanceof ThermoError) {
    return {
      status: THERMO_ERROR_STATUS[err.code],
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
  if (bp?.type === 'charset.unsupported') {
    return {
      status: 415,
      body: {
        code: 'unsupported_charset',
        message: `The request body must be JSON in UTF-8; charset "${bp.charset ?? ''}" is not supported`,
      },
    };
  }
  if (bp?.type === 'encoding.unsupported') {
    return {
      status: 415,
      body: {
        code: 'unsupported_encoding',
        message: `The request body's content encoding "${bp.encoding ?? ''}" is not supported; send it uncompressed or gzip`,
      },
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
