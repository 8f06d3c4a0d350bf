import { endView, type EndView } from '../../core';
import type { LocalEnd } from '../../local/endFacts';

const views = new WeakMap<LocalEnd, EndView>();

/**
 * The core's view of an end, worked out once per end object: the pad keeps an unchanged end's
 * object from one read to the next (see EndCache), and tabs, totals and the card all ask for it.
 */
export function padEndView(local: LocalEnd): EndView {
  let view = views.get(local);
  if (!view) {
    view = endView(local.facts);
    views.set(local, view);
  }
  return view;
}
