import type { RequestHandler, Response } from 'express';
import { z } from 'zod';

/** The parts of a request a route validates; each by its own zod schema. */
export interface RequestSchemas {
  body?: z.ZodType;
  query?: z.ZodType;
  params?: z.ZodType;
}

type Out<S> = S extends z.ZodType ? z.output<S> : undefined;
export interface ValidInput<S extends RequestSchemas> {
  body: Out<S['body']>;
  query: Out<S['query']>;
  params: Out<S['params']>;
}

export type Validator<S extends RequestSchemas> = RequestHandler & {
  /** The schemas themselves: the API reference reads a route's request from them. */
  schemas: S;
  /** The typed input this validator stored for the current request. */
  input(res: Response): ValidInput<S>;
};

const PARTS = ['params', 'query', 'body'] as const;

/**
 * Validation at the edge: parses params, query and body by their schemas and stores the typed
 * result in `res.locals.input` (Express 5 cannot reassign `req.query`). A ZodError becomes a
 * 400 `validation_error` in the error handler, before the route's handler runs.
 *
 *   const changeRole = validate({ params: IdParams, body: RoleChangeBody });
 *   router.patch('/users/:id', changeRole, (req, res) => { const { params, body } = changeRole.input(res); … });
 */
export function validate<S extends RequestSchemas>(schemas: S): Validator<S> {
  const handler: RequestHandler = (req, res, next) => {
    const input: Record<string, unknown> = {};
    for (const part of PARTS) {
      const schema = schemas[part];
      input[part] = schema
        ? schema.parse(part === 'body' ? (req.body ?? {}) : req[part])
        : undefined;
    }
    res.locals['input'] = input;
    next();
  };
  return Object.assign(handler, {
    schemas,
    input: (res: Response) => res.locals['input'] as ValidInput<S>,
  });
}

/** Upper bounds of PostgreSQL's integer columns: values past them must never reach a query. */
export const INT4_MAX = 2_147_483_647;
/** bigint columns are read as JS numbers: anything past 2^53 − 1 would lose precision. */
export const BIGINT_SAFE_MAX = Number.MAX_SAFE_INTEGER;

/**
 * A positive integer given as text (a path or query parameter) within a column's range: plain
 * decimal digits only (no sign, exponent, hex or spaces), at most `max`.
 */
export function positiveIntText(max: number = INT4_MAX) {
  return z
    .string()
    .regex(/^[1-9][0-9]{0,15}$/, 'must be a positive whole number')
    .transform(Number)
    .refine((n) => n <= max, `must be at most ${max}`);
}

/** A non-negative integer as text within [min, max], e.g. a page offset or a limit. */
export function intText(min: number, max: number) {
  return z
    .string()
    .regex(/^(0|[1-9][0-9]{0,15})$/, 'must be a whole number')
    .transform(Number)
    .refine((n) => n >= min && n <= max, `must be between ${min} and ${max}`);
}

/** `:id` of a row whose key is an `integer` identity column (users, and most tables). */
export const IdParams = z.object({ id: positiveIntText(INT4_MAX) });
/** `:id` of a row whose key is a `bigint` identity column (audit_log and other large tables). */
export const BigIdParams = z.object({ id: positiveIntText(BIGINT_SAFE_MAX) });
