/** What the organization switcher shows for a membership: its name, and its kind when names repeat. */
export interface OrganizationChoice {
  organizationId: string;
  organizationName?: string;
  kind: 'lab' | 'manufacturer';
}

const KIND_WORDS = { lab: 'Lab', manufacturer: 'Manufacturer' } as const;

/**
 * The label of one organization in the switcher: the name the server sent, with "(lab)" or
 * "(manufacturer)" added only when another of the person's organizations has the same name, so
 * two alike never look the same. Without a name (an older session), the kind and a short id.
 * Never throws.
 * @example organizationLabel({ organizationId: 'o1', organizationName: 'Kestrel Bay', kind: 'lab' }, []) // 'Kestrel Bay'
 */
export function organizationLabel(choice: OrganizationChoice, all: readonly OrganizationChoice[]): string {
  const name = choice.organizationName?.trim();
  if (!name) return `${KIND_WORDS[choice.kind]} ${choice.organizationId.slice(0, 8)}`;
  const twin = all.some((o) => o.organizationId !== choice.organizationId && o.organizationName?.trim() === name);
  return twin ? `${name} (${KIND_WORDS[choice.kind].toLowerCase()})` : name;
}
