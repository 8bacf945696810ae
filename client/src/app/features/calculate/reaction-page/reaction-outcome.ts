import { ApiError, rateLimitMessage, readableMessage } from '../../../core/api-error';
import type { ReactionEnthalpyAnswer } from '@contracts/reactions/reactions-schemas';
import type { ReactionQuery } from './reaction-query';

/** A refusal in plain words, with what the server offers to fix it. */
export interface ReactionProblem {
  readonly title: string;
  readonly message: string;
  /** A balanced form of the equation, when the server found one. */
  readonly suggestion: string | null;
  /** Registry entries the user may have meant (unknown or ambiguous species). */
  readonly alternatives: readonly string[];
}

/** Where one calculation stands; every state remembers the exact inputs it belongs to. */
export type ReactionOutcome =
  | { readonly kind: 'idle' }
  | { readonly kind: 'computing'; readonly query: ReactionQuery }
  | {
      readonly kind: 'computed';
      readonly query: ReactionQuery;
      readonly answer: ReactionEnthalpyAnswer;
    }
  | { readonly kind: 'failed'; readonly query: ReactionQuery; readonly problem: ReactionProblem };

export const IDLE: ReactionOutcome = { kind: 'idle' };

/** The server's refusal as a title (what kind of problem) and its own message (which term). */
export function describeFailure(error: unknown): ReactionProblem {
  if (error instanceof ApiError && error.rateLimited) {
    return {
      title: 'Please wait a moment.',
      message: rateLimitMessage(error.retryAfter),
      suggestion: null,
      alternatives: [],
    };
  }
  const message = readableMessage(error);
  const details = error instanceof ApiError ? error.details : {};
  const code = error instanceof ApiError ? error.code : null;
  const base = { message, suggestion: null, alternatives: [] };
  switch (code) {
    case 'parse_error':
      return { ...base, title: 'The equation cannot be read.' };
    case 'unbalanced':
      return {
        ...base,
        title: 'The equation is not balanced.',
        suggestion: typeof details['suggestion'] === 'string' ? details['suggestion'] : null,
      };
    case 'unknown_species':
      return {
        ...base,
        title: 'A species is not in this release.',
        alternatives: strings(details['suggestions']),
      };
    case 'ambiguous_species':
      return {
        ...base,
        title: 'A formula stands for more than one species; name it by its registry key.',
        alternatives: strings(details['candidates']),
      };
    case 'missing_data':
      return { ...base, title: 'This release lacks data for this calculation.' };
    case 'out_of_range':
      return { ...base, title: 'The temperature is outside the range of the data.' };
    case 'unknown_release':
      return { ...base, title: 'There is no such release.' };
    case 'validation_error':
      return { ...base, title: 'Some of the inputs are not valid.' };
    default:
      return { ...base, title: 'The calculation did not complete.' };
  }
}

/** Suggestions and candidates may come as keys or as objects carrying one. */
function strings(value: unknown): string[] {
  if (!Array.isArray(value)) return [];
  return value
    .map((item: unknown) => {
      if (typeof item === 'string') return item;
      if (typeof item === 'object' && item !== null && 'key' in item) {
        const key = (item as { key: unknown }).key;
        return typeof key === 'string' ? key : null;
      }
      return null;
    })
    .filter((item): item is string => item !== null);
}
