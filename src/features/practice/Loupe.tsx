import type { FaceId } from '../../core';
import type { OffsetMm } from '../../core/practice';
import { ArrowMark, TargetFace } from './TargetFace';

/** The magnifier's size on screen, how much larger it draws than the face, and its lift off the finger. */
const SIZE_PX = 136;
const MAGNIFY = 3;
const LIFT_PX = 120;

/** Where the magnifier's centre goes, in px from the face's box, and the face's px per mm. */
export type LoupeAt = { x: number; y: number; pxPerMm: number };

/**
 * Above the finger, where the thumb does not hide it; beside the finger (towards the middle of
 * the face) when the finger is too near the top of the screen for that.
 */
export function loupePlace(
  box: { left: number; top: number; width: number },
  finger: { x: number; y: number },
): { x: number; y: number } {
  const x = finger.x - box.left;
  const y = finger.y - box.top;
  if (finger.y - LIFT_PX - SIZE_PX / 2 >= 0) return { x, y: y - LIFT_PX };
  return { x: x > box.width / 2 ? x - LIFT_PX : x + LIFT_PX, y: Math.max(y, SIZE_PX / 2 - box.top) };
}

type Props = {
  faceId: FaceId;
  at: LoupeAt;
  mark: OffsetMm;
  placed: readonly OffsetMm[];
  shaftDiameterMm: number;
};

/**
 * The face around the mark, three times larger than on screen, with the shaft at its true size and
 * a cross at its centre: whether the shaft touches a line shows here. A visual aid only (the
 * value is in the "Keep arrow" button), so hidden from screen readers.
 */
export function Loupe({ faceId, at, mark, placed, shaftDiameterMm }: Props) {
  const radius = SIZE_PX / 2 / (at.pxPerMm * MAGNIFY);
  const hair = radius / 60;
  return (
    <div
      aria-hidden="true"
      data-testid="plot-loupe"
      className="pointer-events-none absolute overflow-hidden rounded-full border-4 border-ink bg-card shadow-lg"
      style={{ width: SIZE_PX, height: SIZE_PX, left: at.x - SIZE_PX / 2, top: at.y - SIZE_PX / 2 }}
    >
      <TargetFace
        faceId={faceId}
        label=""
        view={{ x: mark.xMm - radius, y: mark.yMm - radius, width: 2 * radius, height: 2 * radius }}
      >
        {placed.map((p, i) => (
          <ArrowMark key={i} x={p.xMm} y={p.yMm} r={shaftDiameterMm / 2} />
        ))}
        {/* Drawn inside its outline, so its outer edge is the shaft's. */}
        <circle
          cx={mark.xMm}
          cy={mark.yMm}
          r={shaftDiameterMm / 2 - hair / 2}
          fill="#1b1b1b"
          fillOpacity={0.35}
          stroke="#1b1b1b"
          strokeWidth={hair}
        />
        <path
          d={`M${mark.xMm - radius} ${mark.yMm}H${mark.xMm + radius}M${mark.xMm} ${mark.yMm - radius}V${mark.yMm + radius}`}
          stroke="#1b1b1b"
          strokeWidth={hair}
          strokeDasharray={`${hair * 4} ${hair * 3}`}
        />
      </TargetFace>
    </div>
  );
}
