/**
 * Trimsheet design tokens: the one place for colour, type, spacing and breakpoints.
 * Ink blue leads on a cool paper ground; the one accent is the amber of polyimide film (darker on light
 * grounds, lighter on ink-blue panels). Every text colour here reads at 4.5:1 or better on every ground.
 */
export const colors = {
  /** The page behind everything. */
  ground: '#F2F4F8',
  /** Cards, tables and fields that sit on the ground. */
  panel: '#FFFFFF',
  /** Wells set into a panel: read-only cells, code, tracks of bars. */
  recess: '#E4E8F0',
  /** Hairlines between rows and around panels. */
  rule: '#CDD4E0',
  ink: '#14244A',
  inkMuted: '#4A5775',
  inkFaint: '#56617A',
  film: '#8A5A00',
  filmPressed: '#6E4800',
  filmWash: '#F7EDD8',
  /** The film amber as it reads on ink-blue panels. */
  filmOnInk: '#E0B04A',
  /** Text and marks drawn on the film amber. */
  onFilm: '#FFFFFF',
  fault: '#A32A1F',
  faultWash: '#F8E1DC',
  nominal: '#2F6B3E',
  focusRing: '#2F5BD3',
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
