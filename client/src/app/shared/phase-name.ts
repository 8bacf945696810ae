const PHASE_WORDS: Readonly<Record<string, string>> = {
  g: 'gas',
  l: 'liquid',
  cr: 'crystal',
  s: 'solid',
  am: 'amorphous',
  aq: 'aqueous',
};

/** A phase spelled out for tables: `gas`, `crystal, diamond`, `aqueous`. */
export function phaseName(phase: string | null | undefined, modification?: string | null): string {
  if (!phase) return modification ? `crystal, ${modification}` : 'not stated';
  const word = PHASE_WORDS[phase] ?? phase;
  return modification ? `${word}, ${modification}` : word;
}

/** A phase as the app writes it after a formula: `(g)`, `(cr)`, a polymorph by its own name. */
export function phaseLabel(phase: string, modification?: string | null): string {
  return `(${modification || phase})`;
}
