import { AuditPage } from '../audit/audit-schemas';
import {
  CheckAnswer,
  CommentAnswer,
  CreateAnswer,
  ProposalDetail,
  ProposalList,
  RederiveAnswer,
  TransitionAnswer,
  WatchlistImpactAnswer,
} from '../proposals/proposals-schemas';
import {
  DraftAnswer,
  DraftList,
  PublishStatus,
  StaleAnswer,
} from '../releases/release-drafts-schemas';
import { ReleaseManifest } from '../releases/releases-schemas';
import { DocumentList, DocumentView, SourceAnswer } from '../sources/sources-schemas';
import { CreatedTokenAnswer, TokenListAnswer } from '../tokens/tokens-schemas';
import { UploadCreated, UploadPreview } from '../uploads/uploads-schemas';
import {
  MeAnswer,
  RoleChangeAnswer,
  SettingsAnswer,
  UsersListAnswer,
} from '../users/users-schemas';
import { WatchlistAnswer, WatchlistListAnswer } from '../watchlists/watchlists-schemas';
import { file, none, routeGroup, type RouteDoc } from './route-doc-types';

/** Routes for signed-in callers: curation, release drafts, account, administration, sign-in. */
export const MEMBER_ROUTE_DOCS: Record<string, RouteDoc> = {
  ...routeGroup('Sources', 'curator', {
    'POST /api/v1/sources': {
      summary: 'Add a source from BibTeX, RIS, a DOI or CSL-JSON (an existing DOI answers 200)',
      answers: { 201: SourceAnswer, 200: SourceAnswer },
    },
    'GET /api/v1/sources/:id/documents': {
      summary: "A source's attached documents (editors, admins and the uploader)",
      access: 'signed-in',
      answers: { 200: DocumentList },
    },
    'POST /api/v1/sources/:id/documents': {
      summary: 'Attach a PDF (at most 20 MB, checked by content)',
      answers: { 201: DocumentView },
      requestMediaType: 'multipart/form-data',
    },
    'GET /api/v1/sources/:id/documents/:docId': {
      summary: 'Download an attached document (editors, admins and the uploader)',
      access: 'signed-in',
      answers: { 200: file('application/pdf', 'the PDF') },
    },
  }),
  ...routeGroup('Curation', 'curator', {
    'GET /api/v1/proposals': {
      summary: 'Proposals by status: your own, or the review queue for editors',
      answers: { 200: ProposalList },
    },
    'POST /api/v1/proposals': {
      summary: 'Create a draft proposal of one or more items',
      answers: { 201: CreateAnswer },
    },
    'POST /api/v1/proposals/check': {
      summary: 'Check proposal items without saving them (row problems and duplicate warnings)',
      answers: { 200: CheckAnswer },
    },
    'POST /api/v1/proposals/uploads': {
      summary: 'Bulk upload of proposal items as CSV or XML: a dry run, then one proposal',
      answers: { 200: UploadPreview, 201: UploadCreated },
      requestMediaType: 'multipart/form-data',
    },
    'GET /api/v1/proposals/:id': {
      summary: 'A proposal for review: each item beside the value it would replace, and the thread',
      access: 'signed-in',
      answers: { 200: ProposalDetail },
    },
    'GET /api/v1/proposals/:id/watchlist-impact': {
      summary:
        "What approving the proposal would do to your watchlists: ΔrH from the accepted values and with the proposal's ΔfH° values, the change and whether it exceeds the combined uncertainty",
      access: 'signed-in',
      answers: { 200: WatchlistImpactAnswer },
    },
    'PUT /api/v1/proposals/:id': {
      summary: 'Revise a draft (or a proposal sent back for changes)',
      answers: { 200: TransitionAnswer },
    },
    'PATCH /api/v1/proposals/:id': {
      summary: 'Revise a draft (the same as PUT)',
      answers: { 200: TransitionAnswer },
    },
    'POST /api/v1/proposals/:id/submit': {
      summary: 'Submit a draft for review',
      answers: { 200: TransitionAnswer },
    },
    'POST /api/v1/proposals/:id/withdraw': {
      summary: 'Withdraw your proposal',
      access: 'signed-in',
      answers: { 200: TransitionAnswer },
    },
    'POST /api/v1/proposals/:id/comments': {
      summary: 'Comment on a proposal',
      access: 'signed-in',
      answers: { 201: CommentAnswer },
    },
    'POST /api/v1/proposals/:id/decision': {
      summary: 'Approve, reject or request changes (never your own proposal)',
      access: 'editor',
      answers: { 200: TransitionAnswer },
    },
    'POST /api/v1/revisions/:id/rederive': {
      summary: 'Re-derive a stale derived value as a new proposal',
      answers: { 201: RederiveAnswer },
    },
  }),
  ...routeGroup('Release drafts', 'editor', {
    'GET /api/v1/releases/drafts': { summary: 'Release drafts', answers: { 200: DraftList } },
    'POST /api/v1/releases': {
      summary: 'Start a draft release with a new version label',
      answers: { 201: DraftAnswer },
    },
    'PATCH /api/v1/releases/:version': {
      summary: "Edit a draft's notes, or leave changes out of it / take them back in",
      answers: { 200: DraftAnswer },
    },
    'GET /api/v1/releases/:version/changes': {
      summary: 'What a draft changes against the previous release: added, changed, retired',
      answers: { 200: DraftAnswer },
    },
    'GET /api/v1/releases/:version/stale': {
      summary: 'Derived values the draft would leave stale',
      answers: { 200: StaleAnswer },
    },
    'POST /api/v1/releases/:version/acknowledgements': {
      summary: 'Acknowledge stale derived values so the draft may be published',
      answers: { 200: StaleAnswer },
    },
    'POST /api/v1/releases/:version/publish': {
      summary: 'Publish a draft: pins one revision per species-phase and quantity, then freezes it',
      answers: { 200: ReleaseManifest },
    },
    'GET /api/v1/releases/:version/publish-status': {
      summary: 'Progress of a publish under way',
      answers: { 200: PublishStatus },
    },
  }),
  ...routeGroup('Account', 'signed-in', {
    'GET /api/v1/me': { summary: 'The signed-in user', answers: { 200: MeAnswer } },
    'GET /api/v1/me/settings': {
      summary: 'Your notification settings',
      answers: { 200: SettingsAnswer },
    },
    'PATCH /api/v1/me/settings': {
      summary: 'Turn e-mail notifications on or off',
      answers: { 200: SettingsAnswer },
    },
    'GET /api/v1/me/tokens': {
      summary: 'Your API tokens with their last use (never the tokens themselves)',
      answers: { 200: TokenListAnswer },
    },
    'POST /api/v1/me/tokens': {
      summary: 'Create an API token; it is shown once, in this answer',
      answers: { 201: CreatedTokenAnswer },
    },
    'DELETE /api/v1/me/tokens/:id': { summary: 'Revoke an API token', answers: { 204: none } },
    'GET /api/v1/me/watchlists': {
      summary: 'Your watchlists',
      answers: { 200: WatchlistListAnswer },
    },
    'POST /api/v1/me/watchlists': {
      summary: 'Create a watchlist of reactions',
      answers: { 201: WatchlistAnswer },
    },
    'GET /api/v1/me/watchlists/:id': {
      summary: 'One of your watchlists',
      answers: { 200: WatchlistAnswer },
    },
    'PUT /api/v1/me/watchlists/:id': {
      summary: 'Replace a watchlist',
      answers: { 200: WatchlistAnswer },
    },
    'DELETE /api/v1/me/watchlists/:id': { summary: 'Delete a watchlist', answers: { 204: none } },
  }),
  ...routeGroup('Administration', 'admin', {
    'GET /api/v1/audit': {
      summary: 'The audit log: filter by who, action, record and time (editors: curated data only)',
      access: 'editor',
      answers: { 200: AuditPage },
    },
    'GET /api/v1/users': { summary: 'Users and their roles', answers: { 200: UsersListAnswer } },
    'PATCH /api/v1/users/:id': {
      summary: "Change a user's role",
      answers: { 200: RoleChangeAnswer },
    },
  }),
  ...routeGroup('Sign-in', 'public', {
    'GET /auth/github': {
      summary: 'Start signing in with GitHub (a browser redirect)',
      answers: { 302: none },
    },
    'GET /auth/github/callback': {
      summary: 'Where GitHub returns after sign-in',
      answers: { 302: none },
    },
    'POST /auth/logout': {
      summary: 'Sign out (ends the session on the server)',
      access: 'signed-in',
      answers: { 204: none },
    },
  }),
};
