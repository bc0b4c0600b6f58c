import Svg, { Circle, Path } from 'react-native-svg';

/** Which tab an icon stands for. */
export type NavIconName = 'crafts' | 'sandbox' | 'people' | 'account';

/** Line icons for the navigation, drawn in the given colour. */
export function NavIcon({ name, color, size = 22 }: { name: NavIconName; color: string; size?: number }) {
  return (
    <Svg
      width={size}
      height={size}
      viewBox="0 0 24 24"
      fill="none"
      stroke={color}
      strokeWidth={1.8}
      strokeLinecap="round"
      strokeLinejoin="round"
      aria-hidden
    >
      {name === 'crafts' ? (
        // The mark in line: the billowed diamond, the booms as a "+" from the hub, the sunlit quadrant filled.
        <>
          <Path d="M12 2.5 Q17.8 6.2 21.5 12 Q17.8 17.8 12 21.5 Q6.2 17.8 2.5 12 Q6.2 6.2 12 2.5 Z M12 2.5 L12 21.5 M2.5 12 L21.5 12" />
          <Path d="M12 12 L12 2.5 Q17.8 6.2 21.5 12 Z" fill={color} />
          <Circle cx={12} cy={12} r={1.6} fill={color} />
        </>
      ) : null}
      {name === 'sandbox' ? <Path d="M4 20 L4 4 M4 20 L20 20 M7 16 C10 15 12 9 19 7 M15 6.5 L19 7 L18 10.8" /> : null}
      {name === 'people' ? (
        <>
          <Circle cx={9} cy={8} r={3.2} />
          <Path d="M3 20c0-3.3 2.7-6 6-6s6 2.7 6 6" />
          <Circle cx={17} cy={9} r={2.5} />
          <Path d="M16 14.2c2.8.2 5 2.6 5 5.8" />
        </>
      ) : null}
      {name === 'account' ? (
        <>
          <Circle cx={12} cy={8} r={3.6} />
          <Path d="M4.5 20.5c0-4.1 3.4-7 7.5-7s7.5 2.9 7.5 7" />
        </>
      ) : null}
    </Svg>
  );
}
