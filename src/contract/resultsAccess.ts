/**
 * The error code of an event's results asked for without signing in before they are published:
 * signing in shows them to the event's own people, so the page offers to sign in. Its own module,
 * with no imports, so the public results page takes only this string from the contract.
 */
export const RESULTS_NOT_PUBLISHED = 'results_not_published';
