/**
 * Trimsheet design tokens: the one place for colour, type, spacing and breakpoints.
 * The palette is sailcloth off-white with deep ink-blue text and a single warm copper accent.
 */
export const colors = {
  background: '#F5F1E8',
  surface: '#FFFDF8',
  surfaceSunken: '#ECE6D8',
  border: '#D9D1BF',
  ink: '#14244A',
  inkMuted: '#4F5C7A',
  inkFaint: '#58627C',
  accent: '#9E4716',
  accentPressed: '#7A3510',
  accentSoft: '#F6E3D3',
  /** The accent as it reads on ink-blue panels. */
  accentOnInk: '#F4A771',
  onAccent: '#FFFFFF',
  danger: '#A32A1F',
  dangerSoft: '#F8E1DC',
  success: '#2F6B3E',
  focus: '#2F5BD3',
} as const;

export const fonts = {
  regular: 'Inter_400Regular',
  medium: 'Inter_500Medium',
  semibold: 'Inter_600SemiBold',
  bold: 'Inter_700Bold',
  mono: 'RobotoMono_400Regular',
  monoMedium: 'RobotoMono_500Medium',
} as const;

export const fontSizes = {
  small: 13,
  body: 15,
  large: 17,
  title: 22,
  display: 34,
} as const;

export const space = {
  xs: 4,
  sm: 8,
  md: 12,
  lg: 16,
  xl: 24,
  xxl: 40,
} as const;

export const radii = {
  sm: 6,
  md: 10,
  lg: 16,
  pill: 999,
} as const;

/** Smallest comfortable touch target in px (common practice for pointer and touch screens alike). */
export const touchTarget = 44;

/** At this width and above the bottom tabs become a side navigation. */
export const sideNavBreakpoint = 900;

/** Widest a column of content grows before it stops stretching. */
export const contentMaxWidth = 880;
