import { useRouter } from 'expo-router';
import { Linking, StyleSheet, View } from 'react-native';
import { Button } from '@/components/ui/button';
import { FormError } from '@/components/ui/form';
import { AppText } from '@/components/ui/text';
import { colors, radii, space } from '@/components/ui/theme';
import { mayOnCraft, type Who } from '@/shared/access/permissions';
import { exportFormats, type ImportPreview } from '@/shared/schemas/exchange';
import type { Revision } from '@/shared/schemas/revisions';
import { exportUrl } from './api';
import { ImportPreviewView } from './import-preview';
import { pickFile, startDownload } from './browser-files';
import { useAcceptImport, useImportWorkbook, type ImportProgress } from './queries';

const EXPORT_LABELS = { xlsx: 'Workbook (.xlsx)', json: 'Sheet (.json)', csv: 'Values (.csv)' } as const;
const XLSX = '.xlsx,application/vnd.openxmlformats-officedocument.spreadsheetml.sheet';

/** The upload's bar, then the server's reading of the workbook (checks, parsing, the preview). */
function ProgressBar({ progress }: { progress: ImportProgress }) {
  if (progress.phase === 'idle') return null;
  const fraction = progress.phase === 'sending' ? progress.fraction : 1;
  const label = progress.phase === 'sending' ? `Sending the workbook… ${Math.round(fraction * 100)} %` : 'Reading the workbook…';
  return (
    <View style={styles.progress} testID="import-progress">
      <View
        style={styles.track}
        role="progressbar"
        aria-label={label}
        aria-valuemin={0}
        aria-valuemax={100}
        aria-valuenow={progress.phase === 'sending' ? Math.round(fraction * 100) : undefined}
      >
        <View style={[styles.bar, { width: `${Math.round(fraction * 100)}%` }, progress.phase === 'reading' && styles.reading]} />
      </View>
      <AppText variant="muted" aria-live="polite">
        {label}
      </AppText>
    </View>
  );
}

function AcceptImport({ craftId, preview, onDone }: { craftId: string; preview: ImportPreview; onDone: () => void }) {
  const router = useRouter();
  const accept = useAcceptImport(craftId);
  const takes = preview.changed.length + preview.added.length + preview.removed.length;
  return (
    <View style={styles.actions}>
      <FormError message={accept.error?.message} />
      <Button
        label={`Accept as a study (${takes} ${takes === 1 ? 'change' : 'changes'})`}
        busy={accept.isPending}
        disabled={takes === 0}
        onPress={() =>
          accept.mutate(
            { importId: preview.id, body: { note: `Imported from ${preview.fileName}.` } },
            { onSuccess: (study) => router.push(`/crafts/${craftId}/sheet?revision=${study.id}`) },
          )
        }
        testID="import-accept"
      />
      <Button label="Discard" tone="quiet" onPress={onDone} testID="import-discard" />
    </View>
  );
}

/**
 * Spreadsheet exchange for one revision: its export as a workbook, sheet JSON or values CSV, and (for those who
 * may import) a workbook uploaded against it, with a progress bar, the preview, and accepting it as a study,
 * which then opens.
 */
export function WorkbookExchange({
  craftId,
  revision,
  who,
  onDone,
}: {
  craftId: string;
  revision: Revision;
  who: Who;
  onDone: () => void;
}) {
  const importing = useImportWorkbook(craftId, revision.id);
  const choose = async () => {
    const file = await pickFile(XLSX);
    if (file !== undefined) importing.mutate({ file, name: file.name });
  };
  return (
    <View style={styles.panel} testID={`exchange-${revision.id}`}>
      <AppText variant="label">Export</AppText>
      <View style={styles.actions}>
        {exportFormats.map((format) => (
          <Button
            key={format}
            label={EXPORT_LABELS[format]}
            tone="secondary"
            onPress={() => startDownload(exportUrl(craftId, revision.id, format), (url) => void Linking.openURL(url))}
            testID={`export-${format}`}
          />
        ))}
      </View>
      {mayOnCraft('importWorkbook', who) ? (
        <>
          <AppText variant="label">Import a filled-in workbook</AppText>
          <AppText variant="muted">
            Upload an .xlsx exported from Trimsheet and edited. Nothing changes until you accept the preview, which opens a study.
          </AppText>
          <View style={styles.actions}>
            <Button
              label={importing.data === undefined ? 'Choose a workbook' : 'Choose another workbook'}
              tone={importing.data === undefined ? 'primary' : 'secondary'}
              busy={importing.isPending}
              onPress={() => void choose()}
              testID="import-choose"
            />
            <Button label="Close" tone="quiet" onPress={onDone} />
          </View>
          <ProgressBar progress={importing.progress} />
          <FormError message={importing.error?.message} />
          {importing.data !== undefined && !importing.isPending ? (
            <>
              <ImportPreviewView preview={importing.data} />
              <AcceptImport craftId={craftId} preview={importing.data} onDone={() => importing.reset()} />
            </>
          ) : null}
        </>
      ) : (
        <View style={styles.actions}>
          <Button label="Close" tone="quiet" onPress={onDone} />
        </View>
      )}
    </View>
  );
}

const styles = StyleSheet.create({
  panel: { gap: space.md, paddingTop: space.md, borderTopWidth: 1, borderTopColor: colors.rule },
  actions: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm, alignItems: 'center' },
  progress: { gap: space.xs },
  track: { height: 8, borderRadius: radii.sm, backgroundColor: colors.recess, overflow: 'hidden' },
  bar: { height: 8, backgroundColor: colors.film },
  reading: { opacity: 0.6 },
});
