import { HttpErrorResponse, HttpInterceptorFn } from '@angular/common/http';
import { catchError, throwError } from 'rxjs';

import { ApiError } from './api-error';

/**
 * Turns HTTP failures into an {@link ApiError} carrying a readable message (the server's
 * `error.message` when it sent one). The error is re-thrown, never swallowed: the caller
 * decides what it means (a 401 from `/api/v1/me`, for instance, just means "anonymous").
 */
export const errorInterceptor: HttpInterceptorFn = (req, next) =>
  next(req).pipe(
    catchError((error: unknown) =>
      throwError(() => (error instanceof HttpErrorResponse ? ApiError.from(error) : error)),
    ),
  );
