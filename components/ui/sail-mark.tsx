import Svg, { Line, Path } from 'react-native-svg';
import { colors } from './theme';

/** Trimsheet's mark: a square sail seen at an angle, with its boom. */
export function SailMark({ size = 48 }: { size?: number }) {
  return (
    <Svg width={size} height={size} viewBox="0 0 48 48" aria-hidden>
      <Path d="M8 10 L40 6 L36 38 L4 42 Z" fill={colors.filmWash} stroke={colors.ink} strokeWidth={2} strokeLinejoin="round" />
      <Line x1={8} y1={10} x2={36} y2={38} stroke={colors.film} strokeWidth={2} />
      <Line x1={40} y1={6} x2={4} y2={42} stroke={colors.film} strokeWidth={2} />
    </Svg>
  );
}
