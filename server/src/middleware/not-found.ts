import type { RequestHandler } from 'express';
import { AppError } from '../lib/app-error';

export const notFoundHandler: RequestHandler = (req) => {
  throw new AppError(
    404,
    'not_found',
    `No route for ${req.method} ${req.originalUrl.split('?')[0]}`,
  );
};
