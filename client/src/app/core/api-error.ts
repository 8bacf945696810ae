import { HttpErrorResponse } from '@angular/common/http';

import type { ApiErrorBody } from './models/api-error';

/**
 * An HTTP failure in words a person can read. The error interceptor turns every
 * HttpErrorResponse into one of these; callers that care inspect `status` and `code`.
 */
export class ApiError extends Error {
  override readonly name = 'ApiError';

  constructor(
    /** HTTP status, 0 when the server could not be reached. */
    readonly status: number,
    /** The server's `error.code`, or `network_error` / `http_<status>` when it sent none. */
    readonly code: string,
    message: string,
    /** Any further fields of the server's `error` object (e.g. `position`). */
    readonly details: Readonly<Record<string, unknown>> = {},
    readonly url: string | null = null,
    /** Seconds to wait before trying again (the `Retry-After` of a 429 or 503), when sent. */
    readonly retryAfter: number | null = null,
  ) {
    super(message);
  }

  /** Too many requests: a pause, never a sign that the session ended. */
  get rateLimited(): boolean {
    return this.status === 429;
  }

  static from(response: HttpErrorResponse): ApiError {
    const retryAfter = retryAfterSeconds(response.headers?.get('Retry-After') ?? null);
    const body = serverError(response.error);
    if (body) {
      const { code, message, ...details } = body.error;
      return new ApiError(response.status, code, message, details, response.url, retryAfter);
    }
    return new ApiError(
      response.status,
      response.status === 0 ? 'network_error' : `http_${response.status}`,
      fallbackMessage(response.status),
      {},
      response.url,
      retryAfter,
    );
  }
}

/** The readable message of anything thrown, for snackbars and inline errors. */
export function readableMessage(error: unknown): string {
  if (error instanceof ApiError) return error.message;
  if (error instanceof HttpErrorResponse) return ApiError.from(error).message;
  if (error instanceof Error && error.message) return error.message;
  return 'Something went wrong.';
}

/** HTTP status of a failure, whether or not it went through the interceptor. */
export function httpStatus(error: unknown): number | null {
  if (error instanceof ApiError || error instanceof HttpErrorResponse) return error.status;
  return null;
}

/** `Retry-After` as whole seconds from now: either delta-seconds or an HTTP date. */
export function retryAfterSeconds(header: string | null, now = Date.now()): number | null {
  if (header === null || header.trim() === '') return null;
  if (/^\d+$/.test(header.trim())) return Number(header.trim());
  const at = Date.parse(header);
  return Number.isNaN(at) ? null : Math.max(0, Math.ceil((at - now) / 1000));
}

/** The one calm sentence shown for a 429, with the wait when the server said it. */
export function rateLimitMessage(retryAfter: number | null): string {
  const wait =
    retryAfter === null
      ? 'Wait a moment'
      : `Try again in ${retryAfter} ${retryAfter === 1 ? 'second' : 'seconds'}`;
  return `Thalpos is receiving many requests from this address right now. ${wait}; nothing you entered is lost.`;
}

function serverError(body: unknown): ApiErrorBody | null {
  if (typeof body === 'string') {
    try {
      return serverError(JSON.parse(body));
    } catch {
      return null;
    }
  }
  if (typeof body !== 'object' || body === null || !('error' in body)) return null;
  const error = (body as { error: unknown }).error;
  if (typeof error !== 'object' || error === null) return null;
  const { code, message } = error as { code?: unknown; message?: unknown };
  if (typeof message !== 'string' || message.trim() === '') return null;
  return {
    error: { ...(error as object), code: typeof code === 'string' ? code : 'error', message },
  };
}

function fallbackMessage(status: number): string {
  if (status === 0)
    return 'The Thalpos server cannot be reached. Check the connection and try again.';
  if (status === 401) return 'Sign in to continue.';
  if (status === 403) return 'You are not allowed to do this.';
  if (status === 404) return 'Not found.';
  if (status === 409) return 'This change conflicts with the current data.';
  if (status === 413) return 'The request is too large.';
  if (status === 429) return 'Too many requests. Wait a moment and try again.';
  if (status >= 500)
    return `The server could not complete the request (HTTP ${status}). Try again later.`;
  return `The request failed (HTTP ${status}).`;
}
