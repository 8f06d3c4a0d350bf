/**
 * Time per arrow in an individual match shot alternately (finals): 20 seconds an arrow (WA Book 3,
 * art. 14.4 "time limits" in the editions in force since 2018, from memory: check the number and
 * the article in the edition you use). Simultaneous match ends have 2 minutes for 3 arrows.
 * Ringcall only shows a countdown; it never decides anything by it.
 */
export const MATCH_SECONDS_PER_ARROW = 20;
