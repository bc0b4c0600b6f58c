import { useState } from 'react';
import { StyleSheet, View, type TextProps } from 'react-native';
import { Button } from '@/components/ui/button';
import { ChoiceChips } from '@/components/ui/choice-chips';
import { AppText } from '@/components/ui/text';
import { colors, fonts, space } from '@/components/ui/theme';
import { formatMoment } from '@/shared/format/moment';
import {
  attachmentKindLabels,
  attachmentKinds,
  evidenceFileExtensions,
  type Attachment,
  type AttachmentKind,
} from '@/shared/schemas/attachments';
import { evidenceDownloadUrl } from './api';
import { FilePicker } from './file-picker';
import { UploadProgress } from './upload-progress';
import { useRowEvidence } from './use-row-evidence';

/** A file's size as people read it: "812 B", "14.2 kB", "3.4 MB". */
export function fileSize(bytes: number): string {
  if (bytes < 1000) return `${bytes} B`;
  if (bytes < 1_000_000) return `${(bytes / 1000).toFixed(1)} kB`;
  return `${(bytes / 1_000_000).toFixed(1)} MB`;
}

/** What is said of a file under its name: kind, size, who attached it and when. */
export function fileByline(file: Attachment): string {
  return [
    attachmentKindLabels[file.kind],
    fileSize(file.size),
    file.uploadedBy?.name ?? 'A former member',
    formatMoment(file.uploadedAt),
  ].join(' · ');
}

/** A text that is a link on the web: react-native-web draws a Text with `href` as an anchor. */
function downloadLink(url: string, name: string): Partial<TextProps> {
  return { role: 'link', href: url, hrefAttrs: { download: name } } as Partial<TextProps>;
}

type EvidenceItemProps = { craftId: string; file: Attachment; removing: boolean; onRemove: () => void };

function EvidenceItem({ craftId, file, removing, onRemove }: EvidenceItemProps) {
  const [confirming, setConfirming] = useState(false);
  return (
    <View style={styles.item} testID="row-evidence-item">
      <View style={styles.grow}>
        <AppText {...downloadLink(evidenceDownloadUrl(craftId, file.id), file.name)} style={styles.link} testID="row-evidence-download">
          {file.name}
        </AppText>
        <AppText variant="muted">{fileByline(file)}</AppText>
      </View>
      {!file.removable ? null : confirming ? (
        <View style={styles.inline}>
          <Button label="Remove" tone="danger" busy={removing} onPress={onRemove} testID="row-evidence-remove-confirm" />
          <Button label="Keep it" tone="quiet" onPress={() => setConfirming(false)} />
        </View>
      ) : (
        <Button label="Remove…" tone="quiet" onPress={() => setConfirming(true)} testID="row-evidence-remove" />
      )}
    </View>
  );
}

/**
 * A row's evidence in its edit sheet: the files attached (each a download link, with kind, size, who and
 * when), attaching a file of a chosen kind with its upload's progress, and removing one. Readers see the list.
 */
export function EvidenceSection({ craftId, revisionId, rowKey }: { craftId: string; revisionId: string; rowKey: string }) {
  const { evidence, attach, remove, progress } = useRowEvidence(craftId, revisionId, rowKey);
  const [kind, setKind] = useState<AttachmentKind>('datasheet');
  const data = evidence.data;
  return (
    <View style={styles.section} testID="row-evidence">
      <AppText variant="label">Evidence</AppText>
      {evidence.error !== null ? (
        <AppText variant="error">Could not load the evidence: {evidence.error.message}</AppText>
      ) : data === undefined ? (
        <AppText variant="muted">Loading the evidence…</AppText>
      ) : data.attachments.length === 0 ? (
        <AppText variant="muted">No datasheet, weighing report or test report attached yet.</AppText>
      ) : (
        data.attachments.map((file) => (
          <EvidenceItem
            key={file.id}
            craftId={craftId}
            file={file}
            removing={remove.isPending && remove.variables === file.id}
            onRemove={() => remove.mutate(file.id)}
          />
        ))
      )}
      {remove.error !== null ? <AppText variant="error">{remove.error.message}</AppText> : null}
      {data === undefined ? null : data.attachRefusal !== undefined ? (
        <AppText variant="muted">{data.attachRefusal}</AppText>
      ) : (
        <View style={styles.attach}>
          <ChoiceChips
            label="Kind of file to attach"
            choices={attachmentKinds.map((value) => ({ value, label: attachmentKindLabels[value] }))}
            value={kind}
            onChange={setKind}
            testID="row-evidence-kind"
          />
          <FilePicker
            label="Attach a file…"
            accept={evidenceFileExtensions}
            disabled={attach.isPending}
            onPick={(file) => attach.mutate({ file, name: file.name, kind })}
            testID="row-evidence-attach"
          />
          <AppText variant="muted">PDF, PNG or JPEG images, spreadsheets (.xlsx, .ods, .csv) or plain text, up to 10 MB.</AppText>
          {progress !== null && attach.variables !== undefined ? <UploadProgress name={attach.variables.name} fraction={progress} /> : null}
          {attach.error !== null ? <AppText variant="error">{attach.error.message}</AppText> : null}
        </View>
      )}
    </View>
  );
}

const styles = StyleSheet.create({
  section: { gap: space.sm },
  attach: { gap: space.sm, alignItems: 'stretch' },
  item: { flexDirection: 'row', flexWrap: 'wrap', alignItems: 'center', gap: space.sm },
  grow: { flex: 1, minWidth: 200 },
  inline: { flexDirection: 'row', gap: space.sm },
  link: { color: colors.film, fontFamily: fonts.medium, textDecorationLine: 'underline' },
});
