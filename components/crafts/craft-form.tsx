import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { StyleSheet, View } from 'react-native';
import type { z } from 'zod';
import { Button } from '@/components/ui/button';
import { applyServerErrors, FormTextField, zodResolver } from '@/components/ui/form';
import { AppText } from '@/components/ui/text';
import { space } from '@/components/ui/theme';
import { createCraftBodySchema, type CreateCraftBody } from '@/shared/schemas/crafts';

type CraftFormValues = z.input<typeof createCraftBodySchema>;

export type CraftFormProps = {
  initialValues?: CraftFormValues;
  submitLabel: string;
  /** Saves the values; a rejection with field details puts them beside the fields. */
  onSubmit: (body: CreateCraftBody) => Promise<unknown>;
  /** Called after a successful save. */
  onSaved?: () => void;
  onCancel?: () => void;
  /** Prefix for the testIDs of the fields and the submit button. */
  testID: string;
};

const fields = ['name', 'description'] as const;

/** Name and description of a craft, for creating one or editing one. */
export function CraftForm({ initialValues = { name: '', description: '' }, submitLabel, onSubmit, onSaved, onCancel, testID }: CraftFormProps) {
  const [formError, setFormError] = useState<string | null>(null);
  const { control, handleSubmit, setError, reset, formState } = useForm<CraftFormValues, unknown, CreateCraftBody>({
    resolver: zodResolver(createCraftBodySchema),
    defaultValues: initialValues,
  });

  const submit = handleSubmit(async (body) => {
    setFormError(null);
    try {
      await onSubmit(body);
      reset(initialValues);
      onSaved?.();
    } catch (error) {
      setFormError(applyServerErrors(error, fields, setError));
    }
  });

  return (
    <View style={styles.form}>
      <FormTextField control={control} name="name" label="Name" testID={`${testID}-name`} autoCapitalize="words" />
      <FormTextField control={control} name="description" label="Description" testID={`${testID}-description`} multiline />
      {formError ? (
        <AppText variant="error" role="alert">
          {formError}
        </AppText>
      ) : null}
      <View style={styles.actions}>
        <Button label={submitLabel} busy={formState.isSubmitting} onPress={() => void submit()} testID={`${testID}-submit`} />
        {onCancel ? <Button label="Cancel" tone="quiet" onPress={onCancel} /> : null}
      </View>
    </View>
  );
}

const styles = StyleSheet.create({
  form: { gap: space.md },
  actions: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm },
});
