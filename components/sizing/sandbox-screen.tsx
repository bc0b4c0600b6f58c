import { useState } from 'react';
import { StyleSheet, View } from 'react-native';
import { Screen } from '@/components/ui/screen';
import { ErrorState } from '@/components/ui/states';
import type { Sheet } from '@/shared/schemas/sheet';
import { squareSailTemplate } from '@/shared/templates';
import { SizingWorkspace } from './sizing-workspace';

const title = 'Sizing sandbox';
const subtitle = 'Standard square-sail template, evaluated in your browser. Nothing here is saved.';

function loadTemplate(): { ok: true; sheet: Sheet } | { ok: false; message: string } {
  try {
    return { ok: true, sheet: squareSailTemplate() };
  } catch (error) {
    return { ok: false, message: error instanceof Error ? error.message : String(error) };
  }
}

/** The sizing sandbox: sizing on the standard square-sail template, live in the browser and never saved. */
export function SandboxScreen() {
  // Read once: the workspace starts a new engine session whenever it is given a new sheet object.
  const [template] = useState(loadTemplate);
  return (
    <View style={styles.root} testID="sandbox-screen">
      <Screen title={title} subtitle={subtitle}>
        {template.ok ? (
          <SizingWorkspace sheet={template.sheet} resetLabel="Reset to template" />
        ) : (
          <ErrorState title="The square-sail template could not be read" message={template.message} />
        )}
      </Screen>
    </View>
  );
}

const styles = StyleSheet.create({
  root: { flex: 1 },
});
