import { useRef, useState, type KeyboardEvent, type PointerEvent } from 'react';
import { getFace } from '../../core';
import { plotPracticeArrow } from '../../core/practice';
import type { OffsetMm, PlotSetup, PracticeArrow } from '../../core/practice';
import { Button } from '../../ui/Button';
import { MAX_ZOOM, followPoint, wholeFace, zoomAbout, zoomRect, type Point, type Zoom } from './faceZoom';
import { Loupe, loupePlace, type LoupeAt } from './Loupe';
import { ArrowMark, TargetFace, faceFrame } from './TargetFace';

type Props = {
  setup: PlotSetup;
  /** This end's plotted arrows so far, drawn on the face. */
  placed: readonly OffsetMm[];
  onKeep: (arrow: PracticeArrow) => void;
};

type Screen = { x: number; y: number };
/** What the fingers on the face are doing: placing a mark, or zooming with two. */
type Gesture =
  | { kind: 'drag'; before: OffsetMm | undefined }
  | { kind: 'pinch'; start: Zoom; anchor: Point; distance: number; toMm: DOMMatrix }
  // A pinch ended with a finger still down: nothing until every finger is lifted.
  | { kind: 'done' };

const ZOOM_STEP = 2;
const toMm = (m: DOMMatrix, p: Screen): Point => {
  const q = new DOMPoint(p.x, p.y).matrixTransform(m);
  return { xMm: q.x, yMm: q.y };
};

/**
 * Plotting: tap where the arrow hit, drag to adjust, then keep it; two fingers zoom and pan, and a
 * magnifier above the thumb shows the shaft at its true size while a finger drags. The value comes
 * from the core's plotting rule. On a keyboard, the arrow keys move the mark (Shift for larger
 * steps), Enter keeps it, + and − zoom, 0 shows the whole face.
 */
export function PlotFace({ setup, placed, onKeep }: Props) {
  const svg = useRef<SVGSVGElement>(null);
  const box = useRef<HTMLDivElement>(null);
  const pointers = useRef(new Map<number, Screen>());
  const gesture = useRef<Gesture | undefined>(undefined);
  const [mark, setMark] = useState<OffsetMm | undefined>(undefined);
  const [loupe, setLoupe] = useState<LoupeAt | undefined>(undefined);
  const face = getFace(setup.faceId);
  const frame = faceFrame(setup.faceId);
  // Kept with its face: a round's next distance may use another face, shown whole again.
  const [zoomed, setZoomed] = useState<{ faceId: string; zoom: Zoom } | undefined>(undefined);
  const zoom = zoomed?.faceId === setup.faceId ? zoomed.zoom : wholeFace(frame);
  const setZoom = (next: Zoom) => setZoomed({ faceId: setup.faceId, zoom: next });
  const view = zoomRect(frame, zoom);
  // Large enough to see on the whole face; zoomed in, the shaft's own size.
  const markRadius = Math.max(setup.shaftDiameterMm / 2, view.width / 80);
  const pending = mark ? plotPracticeArrow(setup, mark.xMm, mark.yMm) : undefined;

  const screenToMm = () => svg.current?.getScreenCTM()?.inverse();
  const pointAt = (p: Screen): OffsetMm | undefined => {
    const matrix = screenToMm();
    if (!matrix) return undefined;
    const { xMm, yMm } = toMm(matrix, p);
    // Kept on the sheet: a point outside the drawing is a miss anyway.
    const clamp = (v: number, lo: number, hi: number) => Math.min(hi, Math.max(lo, v));
    return {
      xMm: clamp(xMm, frame.x, frame.x + frame.width),
      yMm: clamp(yMm, frame.y, frame.y + frame.height),
    };
  };
  const showLoupe = (e: PointerEvent, at: OffsetMm | undefined) => {
    const outer = box.current?.getBoundingClientRect();
    const scale = svg.current?.getScreenCTM()?.a;
    // A mouse pointer hides nothing: the magnifier is for a finger or a pen.
    if (!outer || !scale || !at || e.pointerType === 'mouse') return setLoupe(undefined);
    setLoupe({ ...loupePlace(outer, { x: e.clientX, y: e.clientY }), pxPerMm: scale });
  };
  const twoFingers = () => {
    const [a, b] = [...pointers.current.values()];
    if (!a || !b) return undefined;
    return { mid: { x: (a.x + b.x) / 2, y: (a.y + b.y) / 2 }, distance: Math.hypot(a.x - b.x, a.y - b.y) };
  };

  const onPointerDown = (e: PointerEvent<SVGSVGElement>) => {
    // A first finger starts afresh, should a lifted finger's event have been lost.
    if (e.isPrimary) pointers.current.clear();
    pointers.current.set(e.pointerId, { x: e.clientX, y: e.clientY });
    e.currentTarget.setPointerCapture(e.pointerId);
    if (pointers.current.size === 1) {
      gesture.current = { kind: 'drag', before: mark };
      const at = pointAt({ x: e.clientX, y: e.clientY });
      setMark(at);
      showLoupe(e, at);
    } else if (pointers.current.size === 2) {
      // The first finger's mark was the start of a pinch, not an arrow: put the mark back.
      if (gesture.current?.kind === 'drag') setMark(gesture.current.before);
      setLoupe(undefined);
      const fingers = twoFingers();
      const matrix = screenToMm();
      if (!fingers || !matrix || fingers.distance === 0) return;
      gesture.current = {
        kind: 'pinch',
        start: zoom,
        anchor: toMm(matrix, fingers.mid),
        distance: fingers.distance,
        toMm: matrix,
      };
    }
  };
  const onPointerMove = (e: PointerEvent<SVGSVGElement>) => {
    if (!pointers.current.has(e.pointerId)) return;
    pointers.current.set(e.pointerId, { x: e.clientX, y: e.clientY });
    const now = gesture.current;
    if (now?.kind === 'drag') {
      const at = pointAt({ x: e.clientX, y: e.clientY });
      setMark(at);
      showLoupe(e, at);
    } else if (now?.kind === 'pinch') {
      const fingers = twoFingers();
      if (!fingers) return;
      setZoom(
        zoomAbout(frame, now.start, fingers.distance / now.distance, now.anchor, toMm(now.toMm, fingers.mid)),
      );
    }
  };
  const onPointerEnd = (e: PointerEvent<SVGSVGElement>) => {
    pointers.current.delete(e.pointerId);
    setLoupe(undefined);
    if (pointers.current.size === 0) gesture.current = undefined;
    else if (gesture.current?.kind === 'pinch') gesture.current = { kind: 'done' };
  };

  const keep = () => {
    if (!pending) return;
    onKeep(pending);
    setMark(undefined);
  };
  /** Zooms about the mark (or the last arrow, or the middle of the view), which stays where it is. */
  const zoomBy = (factor: number) => {
    const last = placed[placed.length - 1];
    const about = mark ?? last ?? { xMm: view.x + view.width / 2, yMm: view.y + view.height / 2 };
    setZoom(zoomAbout(frame, zoom, factor, about));
  };

  const onKeyDown = (e: KeyboardEvent<SVGSVGElement>) => {
    const step = (face.zoneWidthMm / 4) * (e.shiftKey ? 4 : 1);
    const moves: Record<string, [number, number]> = {
      ArrowUp: [0, -step],
      ArrowDown: [0, step],
      ArrowLeft: [-step, 0],
      ArrowRight: [step, 0],
    };
    const zooms: Record<string, () => void> = {
      '+': () => zoomBy(ZOOM_STEP),
      '=': () => zoomBy(ZOOM_STEP),
      '-': () => zoomBy(1 / ZOOM_STEP),
      '0': () => setZoom(wholeFace(frame)),
    };
    const move = moves[e.key];
    if (move) {
      e.preventDefault();
      const from = mark ?? {
        xMm: 0,
        yMm: face.spotCentresMm[Math.floor(face.spotCentresMm.length / 2)] ?? 0,
      };
      const to = { xMm: from.xMm + move[0], yMm: from.yMm + move[1] };
      setMark(to);
      setZoom(followPoint(frame, zoom, to));
    } else if (zooms[e.key]) {
      e.preventDefault();
      zooms[e.key]?.();
    } else if (e.key === 'Enter' && pending) {
      e.preventDefault();
      keep();
    } else if (e.key === 'Escape') setMark(undefined);
  };

  return (
    <div className="space-y-3">
      <div ref={box} className="relative">
        <TargetFace
          ref={svg}
          faceId={setup.faceId}
          view={zoom.scale === 1 ? undefined : view}
          role="application"
          label="Target face: tap where the arrow hit, drag to adjust, two fingers zoom. Arrow keys move the mark, Enter keeps it, plus and minus zoom, 0 shows the whole face."
          tabIndex={0}
          data-testid="plot-face"
          className="touch-none rounded-xl focus:outline-4 focus:outline-ink"
          onPointerDown={onPointerDown}
          onPointerMove={onPointerMove}
          onPointerUp={onPointerEnd}
          onPointerCancel={onPointerEnd}
          onKeyDown={onKeyDown}
        >
          {placed.map((p, i) => (
            <ArrowMark key={i} x={p.xMm} y={p.yMm} r={markRadius} />
          ))}
          {mark && (
            <g>
              <ArrowMark x={mark.xMm} y={mark.yMm} r={markRadius} faint />
              <circle
                cx={mark.xMm}
                cy={mark.yMm}
                r={markRadius * 3}
                fill="none"
                stroke="#1b1b1b"
                strokeWidth={markRadius / 2}
                strokeDasharray={`${markRadius} ${markRadius / 2}`}
              />
            </g>
          )}
        </TargetFace>
        {loupe && mark && (
          <Loupe
            faceId={setup.faceId}
            at={loupe}
            mark={mark}
            placed={placed}
            shaftDiameterMm={setup.shaftDiameterMm}
          />
        )}
      </div>
      <p className="text-base">
        Shaft {setup.shaftDiameterMm} mm: a shaft touching a line scores the higher zone.
        {zoom.scale > 1 && ` Zoomed ${Math.round(zoom.scale * 10) / 10}×.`}
      </p>
      <div className="grid grid-cols-[2fr_1fr] gap-2">
        <Button onClick={keep} disabled={!pending} data-testid="keep-arrow">
          {pending ? `Keep arrow: ${pending.value}` : 'Tap the face first'}
        </Button>
        <Button variant="secondary" onClick={() => setMark(undefined)} disabled={!mark}>
          Clear
        </Button>
      </div>
      <div role="group" aria-label="Zoom" className="grid grid-cols-3 gap-2">
        {[
          { text: 'Zoom out', act: () => zoomBy(1 / ZOOM_STEP), off: zoom.scale <= 1 },
          { text: 'Zoom in', act: () => zoomBy(ZOOM_STEP), off: zoom.scale >= MAX_ZOOM },
          { text: 'Whole face', act: () => setZoom(wholeFace(frame)), off: zoom.scale <= 1 },
        ].map(({ text, act, off }) => (
          <Button key={text} variant="secondary" className="px-1" onClick={act} disabled={off}>
            {text}
          </Button>
        ))}
      </div>
    </div>
  );
}
