/**
 * For words of the page frame's header that give way on a phone (below 480 px) while the sync
 * badge says what is waiting: they stay read out (sr-only), and the header stays one row.
 * `group/frame` is the header; the badge's count carries `data-waiting`.
 */
export const NARROW_WHILE_WAITING = 'max-[479px]:group-has-[[data-waiting]]/frame:sr-only';

/** The same condition: a part left out altogether, and one shown only then. */
export const NARROW_WHILE_WAITING_HIDDEN = 'max-[479px]:group-has-[[data-waiting]]/frame:hidden';
export const NARROW_WHILE_WAITING_SHOWN = 'max-[479px]:group-has-[[data-waiting]]/frame:inline';
