import { StyleSheet, View } from 'react-native';
import type { z } from 'zod';
import { FormActions, FormError, FormTextField, useSchemaForm } from '@/components/ui/form';
import { space } from '@/components/ui/theme';
import { createCraftBodySchema, type CreateCraftBody } from '@/shared/schemas/crafts';

export type CraftFormProps = {
  initialValues?: z.input<typeof createCraftBodySchema>;
  submitLabel: string;
  /** Saves the values; a rejection with field details puts them beside the fields. */
  onSubmit: (body: CreateCraftBody) => Promise<unknown>;
  /** Called after a successful save. */
  onSaved?: () => void;
  onCancel?: () => void;
  /** Prefix for the testIDs of the fields and the submit button. */
  testID: string;
};

/** Name and description of a craft, for creating one or editing one. */
export function CraftForm({
  initialValues = { name: '', description: '' },
  submitLabel,
  onSubmit,
  onSaved,
  onCancel,
  testID,
}: CraftFormProps) {
  const { control, submit, formError, isSubmitting } = useSchemaForm({
    schema: createCraftBodySchema,
    defaultValues: initialValues,
    fields: ['name', 'description'],
    onValid: async (body) => {
      await onSubmit(body);
      onSaved?.();
    },
  });

  return (
    <View style={styles.form}>
      <FormTextField control={control} name="name" label="Name" testID={`${testID}-name`} autoCapitalize="words" onSubmitEditing={submit} />
      <FormTextField control={control} name="description" label="Description" testID={`${testID}-description`} multiline />
      <FormError message={formError} />
      <FormActions submitLabel={submitLabel} busy={isSubmitting} onSubmit={submit} onCancel={onCancel} testID={testID} />
    </View>
  );
}

const styles = StyleSheet.create({
  form: { gap: space.md },
});
