import { FormActions, FormError, FormTextField, useSchemaForm } from '@/components/ui/form';
import { Card } from '@/components/ui/card';
import { AppText } from '@/components/ui/text';
import { lockBaselineBodySchema, openStudyBodySchema, type Revision } from '@/shared/schemas/revisions';
import { useLockBaseline, useOpenStudy } from './queries';

type FormProps = { craftId: string; from: Revision; onDone: () => void };

/** Locks the working draft as a baseline under a label (the design review it goes to) and a note. */
export function LockBaselineForm({ craftId, from, onDone }: FormProps) {
  const lock = useLockBaseline(craftId);
  const { control, submit, formError, isSubmitting } = useSchemaForm({
    schema: lockBaselineBodySchema,
    defaultValues: { label: '', note: '' },
    fields: ['label', 'note'],
    onValid: async (body) => {
      await lock.mutateAsync({ revisionId: from.id, body });
      onDone();
    },
  });
  return (
    <Card testID="lock-baseline-form">
      <AppText variant="heading">Lock the draft as a baseline</AppText>
      <AppText variant="muted">The baseline keeps the sheet as it is now and never changes again; the draft goes on from it.</AppText>
      <FormTextField control={control} name="label" label="Label (the review it goes to, e.g. PDR)" testID="lock-label" />
      <FormTextField control={control} name="note" label="Note" multiline testID="lock-note" />
      <FormError message={formError} />
      <FormActions submitLabel="Lock baseline" busy={isSubmitting} onSubmit={submit} onCancel={onDone} testID="lock" />
    </Card>
  );
}

/** Opens a study (a named branch to try changes in) from a revision. */
export function OpenStudyForm({ craftId, from, onDone, onOpened }: FormProps & { onOpened: (study: Revision) => void }) {
  const open = useOpenStudy(craftId);
  const { control, submit, formError, isSubmitting } = useSchemaForm({
    schema: openStudyBodySchema,
    defaultValues: { name: '', note: '' },
    fields: ['name', 'note'],
    onValid: async (body) => {
      onOpened(await open.mutateAsync({ revisionId: from.id, body }));
    },
  });
  return (
    <Card testID="open-study-form">
      <AppText variant="heading">Open a study from “{from.label}”</AppText>
      <AppText variant="muted">
        A copy of its sheet to try changes on; you and the engineers edit it freely, the draft is untouched.
      </AppText>
      <FormTextField control={control} name="name" label="Study name" testID="study-name" />
      <FormTextField control={control} name="note" label="What it tries" multiline testID="study-note" />
      <FormError message={formError} />
      <FormActions submitLabel="Open study" busy={isSubmitting} onSubmit={submit} onCancel={onDone} testID="study" />
    </Card>
  );
}
