import type { ReactNode, Ref, SVGProps } from 'react';
import { getFace } from '../../core';
import type { FaceId, ZoneColour } from '../../core';
import type { Rect } from './faceZoom';

// The sport's own face colours, used only where a face is drawn (shared/look.md).
const FILL: Record<ZoneColour, string> = {
  gold: '#f7d117',
  red: '#e2261d',
  blue: '#35a6dd',
  black: '#1b1b1b',
  white: '#ffffff',
};
const LINE: Record<ZoneColour, string> = {
  gold: '#1b1b1b',
  red: '#1b1b1b',
  blue: '#1b1b1b',
  black: '#ffffff',
  white: '#1b1b1b',
};

/** The drawing's frame in mm around the sheet's centre: the whole face with a small margin. */
export function faceFrame(faceId: FaceId, singleSpot = false) {
  const face = getFace(faceId);
  const radius = face.zones[face.zones.length - 1]?.outerRadiusMm ?? face.diameterMm / 2;
  const margin = radius * 0.08;
  const centres = singleSpot ? [0] : face.spotCentresMm;
  const top = Math.min(...centres) - radius - margin;
  const bottom = Math.max(...centres) + radius + margin;
  return { x: -radius - margin, y: top, width: 2 * (radius + margin), height: bottom - top, radius };
}

/** One spot's zones, outermost first, with the X ring. */
function Spot({ faceId, cy }: { faceId: FaceId; cy: number }) {
  const face = getFace(faceId);
  const stroke = face.zoneWidthMm / 40;
  return (
    <g>
      {[...face.zones].reverse().map((zone) => (
        <circle
          key={zone.value}
          cx={0}
          cy={cy}
          r={zone.outerRadiusMm}
          fill={FILL[zone.colour]}
          stroke={LINE[zone.colour]}
          strokeWidth={stroke}
        />
      ))}
      <circle cx={0} cy={cy} r={face.xRadiusMm} fill="none" stroke={LINE.gold} strokeWidth={stroke} />
    </g>
  );
}

type Props = Omit<SVGProps<SVGSVGElement>, 'ref'> & {
  faceId: FaceId;
  ref?: Ref<SVGSVGElement>;
  /** Draw one spot only (a group measured from its spot's centre). */
  singleSpot?: boolean;
  label: string;
  /** Show only this part of the face, in mm, instead of all of it (zoomed in). */
  view?: Rect | undefined;
  children?: ReactNode;
  className?: string;
};

/** A target face drawn to scale in mm (1 unit = 1 mm), with marks laid over it as children. */
export function TargetFace({
  faceId,
  singleSpot = false,
  label,
  view,
  children,
  className = '',
  ...svg
}: Props) {
  const frame = view ?? faceFrame(faceId, singleSpot);
  const centres = singleSpot ? [0] : getFace(faceId).spotCentresMm;
  return (
    <svg
      viewBox={`${frame.x} ${frame.y} ${frame.width} ${frame.height}`}
      role="img"
      aria-label={label}
      className={`mx-auto block max-h-[60vh] w-full overflow-hidden ${className}`}
      {...svg}
    >
      {centres.map((cy) => (
        <Spot key={cy} faceId={faceId} cy={cy} />
      ))}
      {children}
    </svg>
  );
}

/** An arrow's mark: dark with a light rim, visible on every zone colour. */
export function ArrowMark({ x, y, r, faint = false }: { x: number; y: number; r: number; faint?: boolean }) {
  return (
    <circle
      cx={x}
      cy={y}
      r={r}
      fill={faint ? 'none' : '#1b1b1b'}
      stroke={faint ? '#1b1b1b' : '#ffffff'}
      strokeWidth={r / 3}
      opacity={faint ? 0.7 : 1}
    />
  );
}
