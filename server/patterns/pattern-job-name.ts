/** Queue names and options of the pattern jobs (kept apart from the job code so the API need not load the engine). */

/** Queue name of the job that flattens a sculpt's pieces into a pattern. */
export const PATTERN_JOB = 'pattern-build';

/**
 * Queue options of pattern-build: bad seams fail the same way every time and are recorded on the pattern, so
 * only a crashed worker's job is retried, once. Fifteen minutes bounds a runaway flattening.
 */
export const PATTERN_QUEUE = { retryLimit: 1, retryDelay: 5, expireInSeconds: 900 } as const;

/** Queue name of the job that nests a pattern's pieces on the shop's stock sheets. */
export const SHEET_PLAN_JOB = 'sheet-plan';

/** Queue options of sheet-plan (as pattern-build; nesting is bounded by its own search caps). */
export const SHEET_PLAN_QUEUE = { retryLimit: 1, retryDelay: 5, expireInSeconds: 600 } as const;
