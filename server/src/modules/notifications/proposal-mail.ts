import type { ProposalEvent } from '../proposals/proposal-events';
import type { Decision } from '../proposals/proposals-schemas';

/** Subject and plain-text body of the e-mail about one proposal event. */
export interface ProposalMail {
  subject: string;
  text: string;
}

/** Why the recipient gets it; the footer says so and where to turn it off. */
export type MailReason = 'editor' | 'author' | 'participant';

const DECIDED: Record<Decision, { verb: string; heading: string }> = {
  approve: { verb: 'approved', heading: 'Approved' },
  reject: { verb: 'rejected', heading: 'Rejected' },
  request_changes: { verb: 'asked for changes to', heading: 'Changes requested' },
};

const REASON: Record<MailReason, string> = {
  editor: 'you review proposals as an editor',
  author: 'you wrote this proposal',
  participant: 'you took part in the discussion of this proposal',
};

/** Long comments are cut in the e-mail; the full text is on the proposal's page. */
function quote(text: string, max = 1500): string {
  const cut = text.length > max ? `${text.slice(0, max).trimEnd()} …` : text;
  return cut
    .split('\n')
    .map((line) => `> ${line}`)
    .join('\n');
}

/**
 * The e-mail for one proposal event, in plain words with a link to the proposal. Pure: the same
 * event gives the same message; `publicUrl` is the site's address without a trailing slash.
 */
export function proposalMail(
  event: ProposalEvent,
  reason: MailReason,
  publicUrl: string,
): ProposalMail {
  const ref = `proposal #${event.proposalId}`;
  const who = event.actor.name || event.actor.login;
  const link = `${publicUrl}/proposals/${event.proposalId}`;
  const title = event.title.trim() || '(no rationale given)';
  let subject: string;
  let lead: string;
  let detail = '';
  switch (event.type) {
    case 'submitted':
      subject = `Review requested: ${ref} — ${title}`;
      lead = `${who} submitted ${ref} for review (${event.itemCount} ${
        event.itemCount === 1 ? 'item' : 'items'
      }).`;
      break;
    case 'withdrawn':
      subject = `Withdrawn: ${ref} — ${title}`;
      lead = `${who} withdrew ${ref}; it needs no further review.`;
      break;
    case 'decided': {
      const { verb, heading } = DECIDED[event.decision];
      subject = `${heading}: ${ref} — ${title}`;
      lead = `${who} ${verb} ${ref}.`;
      if (event.decision === 'approve') {
        detail = 'The approved values are accepted and will appear in the next release.\n\n';
      } else if (event.decision === 'request_changes') {
        detail = 'Revise the proposal and submit it again when it is ready.\n\n';
      }
      if (event.comment.trim()) detail = `${quote(event.comment)}\n\n${detail}`;
      break;
    }
    case 'commented':
      subject = `New comment: ${ref} — ${title}`;
      lead = `${who} commented on ${ref}:`;
      detail = `${quote(event.body)}\n\n`;
      break;
  }
  const text =
    `${lead}\n\n` +
    `Proposal: ${title}\n\n` +
    detail +
    `Open the proposal: ${link}\n\n` +
    `--\nThalpos. You receive this because ${REASON[reason]}.\n` +
    `Turn these e-mails off in your settings: ${publicUrl}/settings\n`;
  return { subject: oneLine(subject), text };
}

/** Subjects are one line of at most 200 characters, whatever the rationale holds. */
const oneLine = (s: string) => {
  const flat = s.replace(/\s+/g, ' ').trim();
  return flat.length > 200 ? `${flat.slice(0, 199)}…` : flat;
};
