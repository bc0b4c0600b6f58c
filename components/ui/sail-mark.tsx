import Svg, { Circle, Path } from 'react-native-svg';
import {
  booms,
  boomWidth,
  hubDot,
  litQuadrant,
  sailMarkColors,
  sailMarkSize,
  shadedQuadrants,
  type SailMarkBackdrop,
} from './sail-mark-shape';

export type SailMarkProps = {
  size?: number;
  /** What the mark sits on; `ink` for ink-blue bands and panels. */
  backdrop?: SailMarkBackdrop;
};

/** Trimsheet's mark: a square sail face on, booms as a "+" from the hub, one quadrant lit by the sun. */
export function SailMark({ size = 48, backdrop = 'ground' }: SailMarkProps) {
  const color = sailMarkColors(backdrop);
  return (
    <Svg width={size} height={size} viewBox={`0 0 ${sailMarkSize} ${sailMarkSize}`} aria-hidden>
      <Path d={shadedQuadrants} fill={color.membrane} />
      <Path d={litQuadrant} fill={color.lit} />
      <Path d={booms} stroke={color.booms} strokeWidth={boomWidth} strokeLinecap="round" />
      <Circle cx={hubDot.cx} cy={hubDot.cy} r={hubDot.r} fill={color.booms} />
    </Svg>
  );
}
