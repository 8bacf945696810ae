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
import { file, none, type RouteDoc } from './route-doc-types';

/** Routes for signed-in callers: curation, release drafts, account, administration, sign-in. */
export const MEMBER_ROUTE_DOCS: Record<string, RouteDoc> = {
  'POST /api/v1/sources': {
    tag: 'Sources',
    summary: 'Add a source from BibTeX, RIS, a DOI or CSL-JSON (an existing DOI answers 200)',
    access: 'curator',
    answers: { 201: SourceAnswer, 200: SourceAnswer },
  },
  'GET /api/v1/sources/:id/documents': {
    tag: 'Sources',
    summary: "A source's attached documents (editors, admins and the uploader)",
    access: 'signed-in',
    answers: { 200: DocumentList },
  },
  'POST /api/v1/sources/:id/documents': {
    tag: 'Sources',
    summary: 'Attach a PDF (at most 20 MB, checked by content)',
    access: 'curator',
    answers: { 201: DocumentView },
    requestMediaType: 'multipart/form-data',
  },
  'GET /api/v1/sources/:id/documents/:docId': {
    tag: 'Sources',
    summary: 'Download an attached document (editors, admins and the uploader)',
    access: 'signed-in',
    answers: { 200: file('application/pdf', 'the PDF') },
  },
  'GET /api/v1/proposals': {
    tag: 'Curation',
    summary: 'Proposals by status: your own, or the review queue for editors',
    access: 'curator',
    answers: { 200: ProposalList },
  },
  'POST /api/v1/proposals': {
    tag: 'Curation',
    summary: 'Create a draft proposal of one or more items',
    access: 'curator',
    answers: { 201: CreateAnswer },
  },
  'POST /api/v1/proposals/check': {
    tag: 'Curation',
    summary: 'Check proposal items without saving them (row problems and duplicate warnings)',
    access: 'curator',
    answers: { 200: CheckAnswer },
  },
  'POST /api/v1/proposals/uploads': {
    tag: 'Curation',
    summary: 'Bulk upload of proposal items as CSV or XML: a dry run, then one proposal',
    access: 'curator',
    answers: { 200: UploadPreview, 201: UploadCreated },
    requestMediaType: 'multipart/form-data',
  },
  'GET /api/v1/proposals/:id': {
    tag: 'Curation',
    summary: 'A proposal for review: each item beside the value it would replace, and the thread',
    access: 'signed-in',
    answers: { 200: ProposalDetail },
  },
  'GET /api/v1/proposals/:id/watchlist-impact': {
    tag: 'Curation',
    summary:
      "What approving the proposal would do to your watchlists: ΔrH from the accepted values and with the proposal's ΔfH° values, the change and whether it exceeds the combined uncertainty",
    access: 'signed-in',
    answers: { 200: WatchlistImpactAnswer },
  },
  'PUT /api/v1/proposals/:id': {
    tag: 'Curation',
    summary: 'Revise a draft (or a proposal sent back for changes)',
    access: 'curator',
    answers: { 200: TransitionAnswer },
  },
  'PATCH /api/v1/proposals/:id': {
    tag: 'Curation',
    summary: 'Revise a draft (the same as PUT)',
    access: 'curator',
    answers: { 200: TransitionAnswer },
  },
  'POST /api/v1/proposals/:id/submit': {
    tag: 'Curation',
    summary: 'Submit a draft for review',
    access: 'curator',
    answers: { 200: TransitionAnswer },
  },
  'POST /api/v1/proposals/:id/withdraw': {
    tag: 'Curation',
    summary: 'Withdraw your proposal',
    access: 'signed-in',
    answers: { 200: TransitionAnswer },
  },
  'POST /api/v1/proposals/:id/comments': {
    tag: 'Curation',
    summary: 'Comment on a proposal',
    access: 'signed-in',
    answers: { 201: CommentAnswer },
  },
  'POST /api/v1/proposals/:id/decision': {
    tag: 'Curation',
    summary: 'Approve, reject or request changes (never your own proposal)',
    access: 'editor',
    answers: { 200: TransitionAnswer },
  },
  'POST /api/v1/revisions/:id/rederive': {
    tag: 'Curation',
    summary: 'Re-derive a stale derived value as a new proposal',
    access: 'curator',
    answers: { 201: RederiveAnswer },
  },
  'GET /api/v1/releases/drafts': {
    tag: 'Release drafts',
    summary: 'Release drafts',
    access: 'editor',
    answers: { 200: DraftList },
  },
  'POST /api/v1/releases': {
    tag: 'Release drafts',
    summary: 'Start a draft release with a new version label',
    access: 'editor',
    answers: { 201: DraftAnswer },
  },
  'PATCH /api/v1/releases/:version': {
    tag: 'Release drafts',
    summary: "Edit a draft's notes, or leave changes out of it / take them back in",
    access: 'editor',
    answers: { 200: DraftAnswer },
  },
  'GET /api/v1/releases/:version/changes': {
    tag: 'Release drafts',
    summary: 'What a draft changes against the previous release: added, changed, retired',
    access: 'editor',
    answers: { 200: DraftAnswer },
  },
  'GET /api/v1/releases/:version/stale': {
    tag: 'Release drafts',
    summary: 'Derived values the draft would leave stale',
    access: 'editor',
    answers: { 200: StaleAnswer },
  },
  'POST /api/v1/releases/:version/acknowledgements': {
    tag: 'Release drafts',
    summary: 'Acknowledge stale derived values so the draft may be published',
    access: 'editor',
    answers: { 200: StaleAnswer },
  },
  'POST /api/v1/releases/:version/publish': {
    tag: 'Release drafts',
    summary: 'Publish a draft: pins one revision per species-phase and quantity, then freezes it',
    access: 'editor',
    answers: { 200: ReleaseManifest },
  },
  'GET /api/v1/releases/:version/publish-status': {
    tag: 'Release drafts',
    summary: 'Progress of a publish under way',
    access: 'editor',
    answers: { 200: PublishStatus },
  },
  'GET /api/v1/me': {
    tag: 'Account',
    summary: 'The signed-in user',
    access: 'signed-in',
    answers: { 200: MeAnswer },
  },
  'GET /api/v1/me/settings': {
    tag: 'Account',
    summary: 'Your notification settings',
    access: 'signed-in',
    answers: { 200: SettingsAnswer },
  },
  'PATCH /api/v1/me/settings': {
    tag: 'Account',
    summary: 'Turn e-mail notifications on or off',
    access: 'signed-in',
    answers: { 200: SettingsAnswer },
  },
  'GET /api/v1/me/tokens': {
    tag: 'Account',
    summary: 'Your API tokens with their last use (never the tokens themselves)',
    access: 'signed-in',
    answers: { 200: TokenListAnswer },
  },
  'POST /api/v1/me/tokens': {
    tag: 'Account',
    summary: 'Create an API token; it is shown once, in this answer',
    access: 'signed-in',
    answers: { 201: CreatedTokenAnswer },
  },
  'DELETE /api/v1/me/tokens/:id': {
    tag: 'Account',
    summary: 'Revoke an API token',
    access: 'signed-in',
    answers: { 204: none },
  },
  'GET /api/v1/me/watchlists': {
    tag: 'Account',
    summary: 'Your watchlists',
    access: 'signed-in',
    answers: { 200: WatchlistListAnswer },
  },
  'POST /api/v1/me/watchlists': {
    tag: 'Account',
    summary: 'Create a watchlist of reactions',
    access: 'signed-in',
    answers: { 201: WatchlistAnswer },
  },
  'GET /api/v1/me/watchlists/:id': {
    tag: 'Account',
    summary: 'One of your watchlists',
    access: 'signed-in',
    answers: { 200: WatchlistAnswer },
  },
  'PUT /api/v1/me/watchlists/:id': {
    tag: 'Account',
    summary: 'Replace a watchlist',
    access: 'signed-in',
    answers: { 200: WatchlistAnswer },
  },
  'DELETE /api/v1/me/watchlists/:id': {
    tag: 'Account',
    summary: 'Delete a watchlist',
    access: 'signed-in',
    answers: { 204: none },
  },
  'GET /api/v1/audit': {
    tag: 'Administration',
    summary: 'The audit log: filter by who, action, record and time (editors: curated data only)',
    access: 'editor',
    answers: { 200: AuditPage },
  },
  'GET /api/v1/users': {
    tag: 'Administration',
    summary: 'Users and their roles',
    access: 'admin',
    answers: { 200: UsersListAnswer },
  },
  'PATCH /api/v1/users/:id': {
    tag: 'Administration',
    summary: "Change a user's role",
    access: 'admin',
    answers: { 200: RoleChangeAnswer },
  },
  'GET /auth/github': {
    tag: 'Sign-in',
    summary: 'Start signing in with GitHub (a browser redirect)',
    access: 'public',
    answers: { 302: none },
  },
  'GET /auth/github/callback': {
    tag: 'Sign-in',
    summary: 'Where GitHub returns after sign-in',
    access: 'public',
    answers: { 302: none },
  },
  'POST /auth/logout': {
    tag: 'Sign-in',
    summary: 'Sign out (ends the session on the server)',
    access: 'signed-in',
    answers: { 204: none },
  },
};
