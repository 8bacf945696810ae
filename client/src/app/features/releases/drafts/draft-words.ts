import type { ChangeSide, DraftChange } from '@contracts/releases/release-drafts-schemas';

import { ApiError, readableMessage } from '../../../core/api-error';
import { phaseName } from '../../../shared/phase-name';

/** What an editor reads when publishing (or creating) is refused, by the server's error code. */
export function publishProblem(error: unknown): string {
  if (!(error instanceof ApiError)) return readableMessage(error);
  const d = error.details;
  switch (error.code) {
    case 'already_published':
      return 'This release is already published — perhaps another editor published it a moment ago. It is in the releases list.';
    case 'publish_in_progress':
      return 'Another editor is publishing this release right now. Wait a moment, then reload.';
    case 'empty_release':
      return 'This draft changes nothing yet: include at least one change before publishing.';
    case 'stale_draft':
      return `Release ${String(d['latest'])} was published after this draft was started from ${String(d['base'] ?? 'nothing')}. Move the draft onto ${String(d['latest'])} and check its changes again.`;
    case 'stale_derived': {
      const n = Array.isArray(d['revisionIds']) ? d['revisionIds'].length : 0;
      return `${n === 1 ? 'One derived value' : `${n} derived values`} would be published stale: include the re-derivation, or acknowledge them in the panel below.`;
    }
    case 'version_taken':
      return `Release ${String(d['version'])} already exists: choose another version.`;
    case 'forbidden':
    case 'role_revoked':
      return 'Only editors and admins may compose and publish releases.';
    default:
      return error.message;
  }
}

const fmt = new Intl.NumberFormat('en-GB', { maximumFractionDigits: 3 });
/** A signed number with a real minus sign. */
export const signed = (x: number, digits = 3): string => {
  const text = new Intl.NumberFormat('en-GB', {
    maximumFractionDigits: digits,
    minimumFractionDigits: Math.min(digits, 2),
  }).format(Math.abs(x));
  return `${x < 0 ? '−' : x > 0 ? '+' : '±'}${text}`;
};

/** One side of a change as a short line: "−285.83 ± 0.04 kJ/mol" (heat capacities by form). */
export function sideText(side: ChangeSide | null): string {
  if (!side) return '—';
  if (side.value === null)
    return side.heatCapacityForm ? `${side.heatCapacityForm} set` : 'no value';
  const value = fmt.format(side.value / 1000).replace('-', '−');
  const u = side.uncertainty === null ? '' : ` ± ${fmt.format(side.uncertainty / 1000)}`;
  const at = side.temperature === null ? '' : ` at ${fmt.format(side.temperature)} K`;
  return `${value}${u} kJ/mol${at}`;
}

/** The difference column: "+0.07 kJ/mol (1.2 σ)". */
export function differenceText(change: DraftChange): string {
  const d = change.difference;
  if (!d) return '—';
  const sigma =
    d.combinedUncertainties === null ? '' : ` (${signed(d.combinedUncertainties, 1)} u)`;
  return `${signed(d.kJPerMol)} kJ/mol${sigma}`;
}

/** "ΔfH°", "Heat capacity", "Transition to liquid". */
export function quantityLabel(quantity: string): string {
  if (quantity === 'formation_enthalpy') return 'ΔfH°';
  if (quantity === 'heat_capacity') return 'Heat capacity';
  const [phase, modification] = quantity.replace(/^transition:/, '').split(',');
  return `Transition to ${phaseName(phase, modification ?? null)}`;
}
