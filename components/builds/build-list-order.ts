/**
 * Filtering and sorting the builds list, and the words for each build stage. Pure, so the table and the cards
 * show the same order and the tests can check it without a screen.
 */
import type { BuildListItem, BuildStage } from '../../hooks/use-builds';

export type BuildSortKey = 'name' | 'updated' | 'progress';
export type SortDirection = 'asc' | 'desc';

/** What each stage reads as in the list: a short label and a sentence for screen readers and the card. */
export const stageWords: Record<BuildStage, { label: string; tone: 'idle' | 'busy' | 'ready' | 'done' | 'failed' }> = {
  'no-sculpt': { label: 'No sculpt yet', tone: 'idle' },
  processing: { label: 'Processing sculpt', tone: 'busy' },
  'marking-seams': { label: 'Marking seams', tone: 'idle' },
  flattening: { label: 'Flattening', tone: 'busy' },
  'pieces-ready': { label: 'Pieces ready', tone: 'ready' },
  'at-the-bench': { label: 'At the bench', tone: 'ready' },
  finished: { label: 'Finished', tone: 'done' },
  failed: { label: 'Needs attention', tone: 'failed' },
};

/** `text` folded for matching: lower case, accents removed (Unicode NFD, combining marks U+0300–U+036F dropped). */
function fold(text: string): string {
  return text.normalize('NFD').replace(/[\u0300-\u036f]/g, '').toLowerCase();
}

/**
 * Returns the builds whose name contains every word of `query` (any case, accents ignored, words in any
 * order); an empty or blank query keeps them all. Order is kept.
 */
export function filterBuilds<B extends Pick<BuildListItem, 'name'>>(builds: readonly B[], query: string): B[] {
  const words = fold(query).split(/\s+/).filter(Boolean);
  if (words.length === 0) return [...builds];
  return builds.filter((b) => {
    const name = fold(b.name);
    return words.every((w) => name.includes(w));
  });
}

const collator = new Intl.Collator(undefined, { sensitivity: 'base', numeric: true });

/**
 * Returns a new array of `builds` sorted by `key` in `direction`: name in the reader's collation with numbers
 * read as numbers ("Helm 2" before "Helm 10"), last change time, or bench progress percent. Ties fall back to
 * the newest change, then the id, so the order never flickers between polls.
 */
export function sortBuilds<B extends Pick<BuildListItem, 'id' | 'name' | 'updatedAt' | 'summary'>>(builds: readonly B[], key: BuildSortKey, direction: SortDirection): B[] {
  const sign = direction === 'asc' ? 1 : -1;
  const primary = (a: B, b: B): number => {
    switch (key) {
      case 'name':
        return collator.compare(a.name, b.name);
      case 'updated':
        return Date.parse(a.updatedAt) - Date.parse(b.updatedAt);
      case 'progress':
        return a.summary.progressPct - b.summary.progressPct;
    }
  };
  return [...builds].sort((a, b) => sign * primary(a, b) || Date.parse(b.updatedAt) - Date.parse(a.updatedAt) || (a.id < b.id ? -1 : a.id > b.id ? 1 : 0));
}

/** The direction a column starts in when first chosen: names A→Z, times and progress highest first. */
export function defaultDirection(key: BuildSortKey): SortDirection {
  return key === 'name' ? 'asc' : 'desc';
}
