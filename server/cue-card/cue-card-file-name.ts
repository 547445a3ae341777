/** The download name of a cue card: `<sequence-name>-v<N>-cue-card.pdf`, safe in a Content-Disposition header. */

/**
 * Lower-case ASCII letters, digits and single hyphens from the sequence name (accents dropped,
 * everything else a hyphen), at most 60 characters; "sequence" when nothing is left.
 */
export function cueCardFileName(sequenceName: string, version: number): string {
  const slug = sequenceName
    .normalize('NFKD')
    .replace(/[\u0300-\u036f]/g, '')
    .toLowerCase()
    .replace(/[^a-z0-9]+/g, '-')
    .replace(/^-+|-+$/g, '')
    .slice(0, 60)
    .replace(/-+$/, '');
  return `${slug || 'sequence'}-v${version}-cue-card.pdf`;
}
