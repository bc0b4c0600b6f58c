import Svg, { Circle, Path } from 'react-native-svg';

/** Which tab an icon stands for. */
export type NavIconName = 'crafts' | 'what-if' | 'people' | 'account';

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
      {name === 'crafts' ? <Path d="M5 5 L20 3 L18 19 L3 21 Z M5 5 L18 19 M20 3 L3 21" /> : null}
      {name === 'what-if' ? <Path d="M4 20 L4 4 M4 20 L20 20 M7 16 C10 15 12 9 19 7 M15 6.5 L19 7 L18 10.8" /> : null}
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
