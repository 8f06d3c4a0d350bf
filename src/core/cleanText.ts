/**
 * Characters that are never part of a name: the bidirectional controls (U+202A–202E embeddings
 * and overrides, U+2066–2069 isolates, U+200E/200F marks, U+061C the Arabic letter mark), which
 * can make "evil" display as "live", and NUL, CR and LF, which break a printed or mailed line.
 */
// eslint-disable-next-line no-control-regex -- matching control characters is the point
const UNSAFE_IN_NAMES = /[\u202A-\u202E\u2066-\u2069\u200E\u200F\u061C\u0000\r\n]/g;

/** A name as typed, without the characters that can disguise or break it. */
export const cleanText = (value: string): string => value.replace(UNSAFE_IN_NAMES, '');
