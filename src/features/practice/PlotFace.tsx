import { useRef, useState, type KeyboardEvent, type PointerEvent } from 'react';
import { getFace } from '../../core';
import { offsetOnSpot, plotPracticeArrow } from '../../core/practice';
import type { OffsetMm, PlotSetup, PracticeArrow } from '../../core/practice';
import { Button } from '../../ui/Button';
import { ArrowMark, TargetFace, faceFrame } from './TargetFace';

type Props = {
  setup: PlotSetup;
  /** This end's plotted arrows so far, drawn on the face. */
  placed: readonly OffsetMm[];
  onKeep: (arrow: PracticeArrow) => void;
};

/**
 * Plotting: tap where the arrow hit, drag to adjust, then keep it. The value comes from the core's
 * plotting rule. On a keyboard, the arrow keys move the mark (Shift for larger steps) and Enter keeps it.
 */
export function PlotFace({ setup, placed, onKeep }: Props) {
  const svg = useRef<SVGSVGElement>(null);
  const dragging = useRef(false);
  const [mark, setMark] = useState<OffsetMm | undefined>(undefined);
  const face = getFace(setup.faceId);
  const frame = faceFrame(setup.faceId);
  // A closer look: the inner zones of one spot, twice as large. The spot is the one the mark (or
  // the last arrow) was on when asked for, and stays put while a mark is dragged.
  const [closerOn, setCloserOn] = useState<number | undefined>(undefined);
  const lookCloser = () => {
    const focus = mark ?? placed[placed.length - 1];
    setCloserOn(focus ? focus.yMm - offsetOnSpot(setup.faceId, focus.xMm, focus.yMm).yMm : 0);
  };
  const closer = closerOn !== undefined;
  const view = closer ? { xMm: 0, yMm: closerOn, radiusMm: frame.radius / 2 } : undefined;
  const markRadius = Math.max(setup.shaftDiameterMm / 2, (view ? frame.radius : face.diameterMm) / 80);
  const pending = mark ? plotPracticeArrow(setup, mark.xMm, mark.yMm) : undefined;

  const pointAt = (e: PointerEvent<SVGSVGElement>): OffsetMm | undefined => {
    const matrix = svg.current?.getScreenCTM()?.inverse();
    if (!matrix) return undefined;
    const p = new DOMPoint(e.clientX, e.clientY).matrixTransform(matrix);
    // Kept on the sheet: a point outside the drawing is a miss anyway.
    const clamp = (v: number, lo: number, hi: number) => Math.min(hi, Math.max(lo, v));
    return {
      xMm: clamp(p.x, frame.x, frame.x + frame.width),
      yMm: clamp(p.y, frame.y, frame.y + frame.height),
    };
  };

  const keep = () => {
    if (!pending) return;
    onKeep(pending);
    setMark(undefined);
  };

  const onKeyDown = (e: KeyboardEvent<SVGSVGElement>) => {
    const step = (face.zoneWidthMm / 4) * (e.shiftKey ? 4 : 1);
    const moves: Record<string, [number, number]> = {
      ArrowUp: [0, -step],
      ArrowDown: [0, step],
      ArrowLeft: [-step, 0],
      ArrowRight: [step, 0],
    };
    const move = moves[e.key];
    if (move) {
      e.preventDefault();
      const from = mark ?? {
        xMm: 0,
        yMm: face.spotCentresMm[Math.floor(face.spotCentresMm.length / 2)] ?? 0,
      };
      setMark({ xMm: from.xMm + move[0], yMm: from.yMm + move[1] });
    } else if (e.key === 'Enter' && pending) {
      e.preventDefault();
      keep();
    } else if (e.key === 'Escape') setMark(undefined);
  };

  return (
    <div className="space-y-3">
      <TargetFace
        ref={svg}
        faceId={setup.faceId}
        view={view}
        role="application"
        label="Target face: tap where the arrow hit, drag to adjust. Arrow keys move the mark, Enter keeps it."
        tabIndex={0}
        data-testid="plot-face"
        className="touch-none rounded-xl focus:outline-4 focus:outline-ink"
        onPointerDown={(e) => {
          dragging.current = true;
          e.currentTarget.setPointerCapture(e.pointerId);
          setMark(pointAt(e));
        }}
        onPointerMove={(e) => {
          if (dragging.current) setMark(pointAt(e));
        }}
        onPointerUp={() => {
          dragging.current = false;
        }}
        onPointerCancel={() => {
          dragging.current = false;
        }}
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
      <div className="grid grid-cols-[2fr_1fr] gap-2">
        <Button onClick={keep} disabled={!pending} data-testid="keep-arrow">
          {pending ? `Keep arrow: ${pending.value}` : 'Tap the face first'}
        </Button>
        <Button variant="secondary" onClick={() => setMark(undefined)} disabled={!mark}>
          Clear
        </Button>
        <Button
          variant="secondary"
          className="col-span-2"
          aria-pressed={closer}
          onClick={() => (closer ? setCloserOn(undefined) : lookCloser())}
        >
          {closer ? 'Whole face' : 'Closer look (inner zones)'}
        </Button>
      </div>
    </div>
  );
}
