import type { z } from 'zod';

/** Who may call a route: anyone, any signed-in caller (session or token), or a role and above. */
export type Access = 'public' | 'signed-in' | 'curator' | 'editor' | 'admin';

/** An answer body: a zod contract for JSON, or the media type of a file answer. */
export type AnswerBody = z.ZodType | { mediaType: string; description: string };

/** A request the reference shows and the test suite sends against the starter release. */
export interface Example {
  path?: Record<string, string>;
  query?: Record<string, string>;
  body?: unknown;
}

export interface RouteDoc {
  tag: string;
  summary: string;
  access: Access;
  /** Status → answer body; error answers are added to every operation. */
  answers: Record<number, AnswerBody>;
  example?: Example;
  /** A request body other than JSON (uploads). */
  requestMediaType?: string;
}

export const file = (mediaType: string, description: string) => ({ mediaType, description });
export const none = file('text/plain', 'no content');
