import type { ReactNode } from 'react';
import { Modal, StyleSheet, View } from 'react-native';
import { colors, radii, space } from '@/components/ui/theme';

export type SheetPanelProps = {
  /** Names the dialog for screen readers. */
  label: string;
  onClose: () => void;
  testID: string;
  children: ReactNode;
};

/** A panel over the screen that slides up from the bottom (an edit sheet on a phone, centred width on a wide screen). */
export function SheetPanel({ label, onClose, testID, children }: SheetPanelProps) {
  return (
    <Modal visible transparent animationType="slide" onRequestClose={onClose}>
      <View style={styles.backdrop}>
        <View style={styles.panel} role="dialog" aria-label={label} testID={testID}>
          {children}
        </View>
      </View>
    </Modal>
  );
}

const styles = StyleSheet.create({
  backdrop: { flex: 1, justifyContent: 'flex-end', alignItems: 'center', backgroundColor: 'rgba(20, 36, 74, 0.35)' },
  panel: {
    width: '100%',
    maxWidth: 640,
    maxHeight: '90%',
    backgroundColor: colors.panel,
    borderTopLeftRadius: radii.lg,
    borderTopRightRadius: radii.lg,
    padding: space.lg,
    gap: space.md,
  },
});
