import Head from 'expo-router/head';
import { Platform } from 'react-native';

/** The test ids of the compare screen's controls: on paper only the comparison itself is wanted. */
export const printHiddenIds = ['compare-actions', 'compare-controls', 'compare-filters', 'compare-moved-close'] as const;

// The app is laid out for a window (a full-height shell with the page scrolling inside it): on paper the page
// flows instead, without the navigation, the controls or the "What moved it" buttons.
const printCss = `@media print {
  html, body, #root, #root div { height: auto !important; min-height: 0 !important; overflow: visible !important; }
  #root div { position: static !important; }
  [data-testid="nav-side"], [data-testid="nav-bottom"], [data-testid^="compare-pick-"],
  ${printHiddenIds.map((id) => `[data-testid="${id}"]`).join(', ')} { display: none !important; }
}`;

/** A print style sheet for the compare screen, in the page's head while the screen is in view (web only). */
export function PrintStyles() {
  if (Platform.OS !== 'web') return null;
  return (
    <Head>
      <style>{printCss}</style>
    </Head>
  );
}
