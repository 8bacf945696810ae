import type { PreviewRow } from '@contracts/uploads/uploads-schemas';

/** Row types as a curator reads them. */
export const LAYOUT_WORDS: Record<PreviewRow['layout'], string> = {
  species: 'Species',
  formation: 'ΔfH°',
  heat_capacity: 'Heat capacity',
  transition: 'Transition',
};

const ACTION_WORDS: Record<string, string> = {
  add_species: 'New species',
  add_value: 'New value',
  supersede_value: 'Replaces current value',
};

const phaseText = (phase: string | null, modification: string | null) =>
  modification ? `${phase},${modification}` : (phase ?? '?');

/** A short line naming what a row is about, from its cells (errors or not). */
export function rowSummary(row: PreviewRow): string {
  const c = row.cells;
  switch (row.layout) {
    case 'species':
      return `${c['key'] ?? '?'}: ${c['name'] ?? ''} ${c['formula'] ?? ''}`.trim();
    case 'formation':
      return `${c['species'] ?? '?'} (${phaseText(c['phase'], c['modification'])}) ${c['value'] ?? '?'} ${c['unit'] ?? ''}`.trim();
    case 'heat_capacity':
      return `${c['species'] ?? '?'} (${phaseText(c['phase'], c['modification'])}) ${c['model'] ?? '?'} ${c['t_min_k'] ?? '?'}–${c['t_max_k'] ?? '?'} K`;
    case 'transition':
      return `${c['species'] ?? '?'} ${phaseText(c['from_phase'], c['from_modification'])} → ${phaseText(c['to_phase'], c['to_modification'])} at ${c['temperature_k'] ?? '?'} K: ${c['value'] ?? '?'} ${c['unit'] ?? ''}`.trim();
  }
}

/** What saving the row would do, or why it cannot be saved. */
export function rowAction(row: PreviewRow): string {
  if (row.errors.length > 0) return 'Not importable';
  if (row.item === null) return 'Part of the set above';
  return ACTION_WORDS[String(row.item['kind'])] ?? String(row.item['kind']);
}
