import { StyleSheet, Text, type TextProps } from 'react-native';
import { colors, fonts, fontSizes } from './theme';

type Variant = 'display' | 'title' | 'heading' | 'body' | 'label' | 'muted' | 'mono' | 'error';

export type AppTextProps = TextProps & {
  /** How the text reads: display and title are headings, mono is for numbers and identifiers. */
  variant?: Variant;
};

/** The one text component: Inter for words, Roboto Mono for numbers. Headings get the header role. */
export function AppText({ variant = 'body', style, ...props }: AppTextProps) {
  const isHeading = variant === 'display' || variant === 'title' || variant === 'heading';
  return <Text role={isHeading ? 'heading' : undefined} style={[styles.base, styles[variant], style]} {...props} />;
}

const styles = StyleSheet.create({
  base: { color: colors.ink, fontFamily: fonts.regular, fontSize: fontSizes.body, lineHeight: 22 },
  display: { fontFamily: fonts.bold, fontSize: fontSizes.display, lineHeight: 40, letterSpacing: -0.5 },
  title: { fontFamily: fonts.bold, fontSize: fontSizes.title, lineHeight: 28 },
  heading: { fontFamily: fonts.semibold, fontSize: fontSizes.large, lineHeight: 24 },
  body: {},
  label: { fontFamily: fonts.medium, fontSize: fontSizes.small, lineHeight: 18, color: colors.inkMuted },
  muted: { color: colors.inkMuted },
  mono: { fontFamily: fonts.mono, fontSize: fontSizes.small, color: colors.inkMuted },
  error: { color: colors.fault, fontFamily: fonts.medium, fontSize: fontSizes.small, lineHeight: 18 },
});
