import { Circle, G, Image as SvgImage, Line, Rect, Svg, Text as SvgText } from './overlay-svg';
import type { LandmarkSet } from '@/features/screening/contract';
import type { LandmarkId } from '@/features/screening/engine';
import type { Overlay } from '@/features/screening/overlay/overlay';
import { fonts } from '@/features/ui/theme';
import { LANDMARK_SHORT } from './landmark-short';

export type ViewBox = { x: number; y: number; width: number; height: number };

type Props = {
  href: string;
  photoWidth: number;
  photoHeight: number;
  /** Size on screen, in screen pixels. */
  displayWidth: number;
  displayHeight: number;
  viewBox?: ViewBox;
  marks: LandmarkSet;
  /** Points suggested from the photo, not confirmed yet: drawn hollow, with no lines or angles. */
  suggested?: LandmarkSet;
  overlay: Overlay;
  /** The point the next tap places or the one being dragged. */
  activeId?: LandmarkId | null;
  testID?: string;
};

// Bright lines over a dark outline stay visible on any photo.
const LINE = '#FFD23F';
const OUTLINE = 'rgba(0,0,0,0.75)';
const POINT = '#19A47A';
const ACTIVE = '#FF7A1A';
const SUGGESTED = '#FF7A1A';

/**
 * Where a point's name is written, in screen pixels from the point (times `u`) and its anchor: the
 * athlete's right-side points (the photo's left) to the left, the rest to the right, the front hip bones'
 * raised and the mid-hips' below (at the pelvis the four names ran into each other).
 */
function labelAt(id: LandmarkId, gap: number): { dx: number; dy: number; anchor: 'start' | 'end' | 'middle' } {
  if (id === 'mid-hip') return { dx: 0, dy: gap + 10, anchor: 'middle' };
  // The front hip bones sit just above the hip centres: their names go above them, the hips' level.
  const dy = id.endsWith('-asis') ? -gap : 4.5;
  return id.startsWith('right-') ? { dx: -gap, dy, anchor: 'end' } : { dx: gap, dy, anchor: 'start' };
}

/** A photo with its landmarks, the lines between them and the angles, drawn in the photo's own pixels. */
export function PhotoOverlay({ href, photoWidth, photoHeight, displayWidth, displayHeight, viewBox, marks, suggested, overlay, activeId, testID }: Props) {
  const vb = viewBox ?? { x: 0, y: 0, width: photoWidth, height: photoHeight };
  // Photo pixels per screen pixel: strokes, points and text keep their size on screen at any zoom.
  const u = vb.width / Math.max(displayWidth, 1);
  const fontSize = 14 * u;
  return (
    <Svg
      width={displayWidth}
      height={displayHeight}
      viewBox={`${vb.x} ${vb.y} ${vb.width} ${vb.height}`}
      testID={testID}
      accessibilityLabel="Photo with landmarks"
    >
      <SvgImage href={href} x={0} y={0} width={photoWidth} height={photoHeight} preserveAspectRatio="none" />
      {overlay.lines.map((l) => (
        <G key={l.id}>
          <Line x1={l.from.x} y1={l.from.y} x2={l.to.x} y2={l.to.y} stroke={OUTLINE} strokeWidth={5 * u} strokeLinecap="round" />
          <Line
            x1={l.from.x}
            y1={l.from.y}
            x2={l.to.x}
            y2={l.to.y}
            stroke={l.style === 'limb' ? LINE : '#FFFFFF'}
            strokeWidth={(l.style === 'limb' ? 3 : 2) * u}
            strokeDasharray={l.style === 'reference' ? `${8 * u} ${6 * u}` : undefined}
            strokeLinecap="round"
          />
        </G>
      ))}
      {(Object.entries(marks) as [LandmarkId, { x: number; y: number } | undefined][]).map(([id, p]) =>
        p ? (
          <G key={id}>
            <Circle cx={p.x} cy={p.y} r={(id === activeId ? 11 : 8) * u} fill={id === activeId ? ACTIVE : POINT} stroke="#fff" strokeWidth={2.5 * u} />
            {[true, false].map((outline) => (
              <SvgText
                key={outline ? 'outline' : 'fill'}
                x={p.x + labelAt(id, 13).dx * u}
                y={p.y + labelAt(id, 13).dy * u}
                fontSize={12 * u}
                fontFamily={fonts.bold}
                fontWeight="700"
                fill={outline ? OUTLINE : '#fff'}
                stroke={outline ? OUTLINE : undefined}
                strokeWidth={outline ? 3.5 * u : undefined}
                textAnchor={labelAt(id, 0).anchor}
              >
                {LANDMARK_SHORT[id]}
              </SvgText>
            ))}
          </G>
        ) : null,
      )}
      {(Object.entries(suggested ?? {}) as [LandmarkId, { x: number; y: number } | undefined][]).map(([id, p]) =>
        p && !marks[id] ? (
          <G key={`suggested-${id}`} testID={`suggested-${id}`}>
            <Circle cx={p.x} cy={p.y} r={11 * u} fill="none" stroke={OUTLINE} strokeWidth={5.5 * u} />
            <Circle cx={p.x} cy={p.y} r={11 * u} fill="none" stroke={SUGGESTED} strokeWidth={3 * u} strokeDasharray={`${5 * u} ${3 * u}`} />
            <Circle cx={p.x} cy={p.y} r={1.8 * u} fill="#fff" />
            {[true, false].map((outline) => (
              <SvgText
                key={outline ? 'outline' : 'fill'}
                x={p.x + labelAt(id, 15).dx * u}
                y={p.y + labelAt(id, 15).dy * u}
                fontSize={12 * u}
                fontFamily={fonts.bold}
                fontWeight="700"
                fill={outline ? OUTLINE : SUGGESTED}
                stroke={outline ? OUTLINE : undefined}
                strokeWidth={outline ? 3.5 * u : undefined}
                textAnchor={labelAt(id, 0).anchor}
              >
                {`${LANDMARK_SHORT[id]}?`}
              </SvgText>
            ))}
          </G>
        ) : null,
      )}
      {overlay.angles.map((a) => {
        const width = (a.short.length * 0.58 + 1) * fontSize;
        // Above the point's own name, on the outer side.
        const x = a.placement === 'left' ? a.anchor.x - 10 * u - width : a.anchor.x + 10 * u;
        const y = a.anchor.y - 32 * u;
        return (
          <G key={a.id}>
            <Rect x={x} y={y} width={width} height={fontSize * 1.5} rx={4 * u} fill="rgba(23,33,43,0.88)" />
            <SvgText x={x + fontSize * 0.5} y={y + fontSize * 1.08} fontSize={fontSize} fontFamily={fonts.bold} fontWeight="700" fill="#FFD23F">
              {a.short}
            </SvgText>
          </G>
        );
      })}
    </Svg>
  );
}
