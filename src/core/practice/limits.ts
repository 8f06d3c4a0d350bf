/**
 * The sizes a practice session keeps to, on the phone and on the account's server alike (the
 * contract's schemas read them from here).
 */

/** An end holds at most this many arrows (the catalog's largest end has 6). */
export const PRACTICE_MAX_ARROWS_PER_END = 12;
/** A session holds at most this many ends (the catalog's longest round has 36; open-ended sessions stop here). */
export const PRACTICE_MAX_ENDS = 200;
/** A session's note (place, weather, equipment, sight mark) holds at most this many characters. */
export const PRACTICE_NOTE_MAX = 200;
