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

/** An entry of a group: the tag is the group's, and so is the access unless it names its own. */
export type GroupedDoc = Omit<RouteDoc, 'tag' | 'access'> & { access?: Access };

/** Routes under one tag, mostly at one access level, so each entry says only what is its own. */
export function routeGroup(
  tag: string,
  access: Access,
  entries: Record<string, GroupedDoc>,
): Record<string, RouteDoc> {
  return Object.fromEntries(
    Object.entries(entries).map(([key, doc]) => [
      key,
      { ...doc, tag, access: doc.access ?? access },
    ]),
  );
}
