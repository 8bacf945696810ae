import { MEMBER_ROUTE_DOCS } from './route-docs-members';
import { PUBLIC_ROUTE_DOCS } from './route-docs-public';
import type { RouteDoc } from './route-doc-types';

export type { Access, AnswerBody, Example, RouteDoc } from './route-doc-types';

/**
 * Every route the app serves, keyed `METHOD /path` exactly as Express registers it. A route
 * missing here fails the API reference test, so a new route cannot ship undocumented.
 */
export const ROUTE_DOCS: Record<string, RouteDoc> = { ...PUBLIC_ROUTE_DOCS, ...MEMBER_ROUTE_DOCS };
