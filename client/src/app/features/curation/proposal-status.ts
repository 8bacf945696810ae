import type { ItemKind, ProposalStatus } from '@contracts/proposals/proposals-schemas';

/** Each status in plain words, with what it means for the person reading the list. */
export const STATUS_WORDS: Readonly<Record<ProposalStatus, { label: string; means: string }>> = {
  draft: { label: 'Draft', means: 'Not sent yet; only you can see it.' },
  submitted: { label: 'Waiting for review', means: 'An editor will look at it.' },
  changes_requested: {
    label: 'Changes asked for',
    means: 'An editor asked for changes; see the comments.',
  },
  approved: { label: 'Accepted', means: 'Accepted; it goes into the next release.' },
  rejected: { label: 'Not accepted', means: 'An editor declined it; see the comments.' },
  withdrawn: { label: 'Withdrawn', means: 'Taken back by its author.' },
};

export const STATUSES = Object.keys(STATUS_WORDS) as ProposalStatus[];

export function statusLabel(status: ProposalStatus): string {
  return STATUS_WORDS[status]?.label ?? status;
}

export const KIND_WORDS: Readonly<Record<ItemKind, string>> = {
  add_value: 'new value',
  supersede_value: 'replacement value',
  retire_value: 'retired value',
  add_species: 'new species',
  add_phase: 'new phase',
  derive_value: 'derived value',
};

/** `2 Dec 2026, 14:05` in the reader's time zone; '—' for none. */
export function when(iso: string | null): string {
  if (!iso) return '—';
  const date = new Date(iso);
  if (Number.isNaN(date.getTime())) return iso;
  return new Intl.DateTimeFormat('en-GB', {
    day: 'numeric',
    month: 'short',
    year: 'numeric',
    hour: '2-digit',
    minute: '2-digit',
  }).format(date);
}
