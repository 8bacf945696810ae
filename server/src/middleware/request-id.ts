import { randomUUID } from 'node:crypto';
import type { IncomingMessage, ServerResponse } from 'node:http';

/** A caller's id is kept only when it is a short token of safe characters (logs, headers). */
const SAFE_REQUEST_ID = /^[A-Za-z0-9._:-]{8,64}$/;

/** pino-http's `genReqId`: the caller's X-Request-Id when it is safe, else a fresh UUID. */
export function requestId(req: IncomingMessage, res: ServerResponse): string {
  const offered = req.headers['x-request-id'];
  const id = typeof offered === 'string' && SAFE_REQUEST_ID.test(offered) ? offered : randomUUID();
  res.setHeader('X-Request-Id', id);
  return id;
}
