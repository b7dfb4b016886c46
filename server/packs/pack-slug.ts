/** Turns a pack's title into the short name in its public address, /packs/<slug>. */

/**
 * Returns a slug of `title`: lower-case ASCII letters and digits joined by single dashes, at most 60
 * characters, accents folded (NFKD); "pack" when nothing is left. `suffix` (e.g. 2) is appended as "-2".
 */
export function slugFromTitle(title: string, suffix?: number): string {
  const folded = title.normalize('NFKD').replace(/[\u0300-\u036f]/g, '').toLowerCase();
  const base = folded.replace(/[^a-z0-9]+/g, '-').replace(/^-+|-+$/g, '').slice(0, 60).replace(/-+$/, '') || 'pack';
  return suffix === undefined ? base : `${base}-${suffix}`;
}
