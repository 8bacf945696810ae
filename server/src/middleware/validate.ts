import type { z } from 'zod';

/** Parses untrusted input with a zod schema; a ZodError becomes a 400 in the error handler. */
export function parseWith<S extends z.ZodType>(schema: S, input: unknown): z.infer<S> {
  return schema.parse(input);
}
