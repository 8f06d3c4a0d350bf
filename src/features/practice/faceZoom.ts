/** A rectangle of the face's drawing in mm (the SVG's own units): x grows right, y down. */
export type Rect = { x: number; y: number; width: number; height: number };
export type Point = { xMm: number; yMm: number };
/** How far the face is zoomed (1: the whole face) and the point in mm at the middle of the view. */
export type Zoom = { scale: number; xMm: number; yMm: number };

/** Eight times: a 40 cm face's 2 mm line gap is then ~10 px on a phone, room to place a mark. */
export const MAX_ZOOM = 8;

export const wholeFace = (frame: Rect): Zoom => ({
  scale: 1,
  xMm: frame.x + frame.width / 2,
  yMm: frame.y + frame.height / 2,
});

const clamp = (v: number, lo: number, hi: number) => Math.min(hi, Math.max(lo, v));

/**
 * The part of the face on show. It keeps the whole face's shape (so the drawing never changes
 * size under the fingers) and stays on the face (no panning off into nothing).
 */
export function zoomRect(frame: Rect, zoom: Zoom): Rect {
  const width = frame.width / zoom.scale;
  const height = frame.height / zoom.scale;
  return {
    x: clamp(zoom.xMm - width / 2, frame.x, frame.x + frame.width - width),
    y: clamp(zoom.yMm - height / 2, frame.y, frame.y + frame.height - height),
    width,
    height,
  };
}

/**
 * Zooms by `factor` (a pinch: the fingers' distance now ÷ at the start) from `start`, so that
 * `anchor` (the point under the fingers' midpoint when they landed) lies where `under` lies in
 * `start`'s view (the point under their midpoint now, read in that view): one rule for a pinch,
 * a two-finger pan (factor 1) and a zoom key (anchor = under).
 */
export function zoomAbout(
  frame: Rect,
  start: Zoom,
  factor: number,
  anchor: Point,
  under: Point = anchor,
): Zoom {
  const scale = clamp(start.scale * factor, 1, MAX_ZOOM);
  const k = scale / start.scale;
  const from = zoomRect(frame, start);
  // The view is a similar rectangle, k times smaller, with anchor mapped onto under's screen place.
  const x = anchor.xMm + (from.x - under.xMm) / k;
  const y = anchor.yMm + (from.y - under.yMm) / k;
  const rect = zoomRect(frame, { scale, xMm: x + from.width / k / 2, yMm: y + from.height / k / 2 });
  // Stored as shown, so a pan pushed past the edge does not have to be undone first.
  return { scale, xMm: rect.x + rect.width / 2, yMm: rect.y + rect.height / 2 };
}

/** The view moved just enough to show `p` with a margin (a mark moved by the arrow keys). */
export function followPoint(frame: Rect, zoom: Zoom, p: Point): Zoom {
  const rect = zoomRect(frame, zoom);
  const marginX = rect.width * 0.1;
  const marginY = rect.height * 0.1;
  const dx = Math.min(0, p.xMm - (rect.x + marginX)) + Math.max(0, p.xMm - (rect.x + rect.width - marginX));
  const dy = Math.min(0, p.yMm - (rect.y + marginY)) + Math.max(0, p.yMm - (rect.y + rect.height - marginY));
  if (dx === 0 && dy === 0) return zoom;
  const moved = zoomRect(frame, {
    ...zoom,
    xMm: rect.x + rect.width / 2 + dx,
    yMm: rect.y + rect.height / 2 + dy,
  });
  return { ...zoom, xMm: moved.x + moved.width / 2, yMm: moved.y + moved.height / 2 };
}
