import { ScrollView, StyleSheet } from 'react-native';
import { Controller } from 'react-hook-form';
import { z } from 'zod';
import { ChoiceChips } from '@/components/ui/choice-chips';
import { FormActions, FormError, FormTextField, useSchemaForm } from '@/components/ui/form';
import { AppText } from '@/components/ui/text';
import { space } from '@/components/ui/theme';
import { parseUnit, valueInRowUnit } from '@/shared/engine';
import { textLine } from '@/shared/schemas/common';
import type { CreateParameterBody } from '@/shared/schemas/revisions';
import { parameterKeySchema, type Parameter } from '@/shared/schemas/sheet';
import { SheetPanel } from './sheet-panel';

type AddRowValues = { key: string; label: string; subsystem: string; unit: string; entry: string };

/** The new row from the form, or why the unit or the value cannot be used (the engine's own checks). */
function rowFrom(form: AddRowValues): { ok: true; body: CreateParameterBody } | { ok: false; field: 'unit' | 'entry'; message: string } {
  const unit = parseUnit(form.unit);
  if (!unit.ok) return { ok: false, field: 'unit', message: unit.message };
  const base: Parameter = { key: form.key, label: form.label, subsystem: form.subsystem, unit: form.unit, value: 0 };
  if (form.entry.startsWith('=')) {
    const { value: _value, ...rest } = base;
    return { ok: true, body: { parameter: { ...rest, formula: form.entry } } };
  }
  const value = valueInRowUnit(base, form.entry);
  return value.ok
    ? { ok: true, body: { parameter: { ...base, value: value.value } } }
    : { ok: false, field: 'entry', message: value.error.message };
}

/** The add-row form as typed: the value field takes a number (with or without a unit) or a formula starting with "=". */
const addRowSchema = z
  .object({
    key: parameterKeySchema,
    label: textLine(200),
    subsystem: z.string().trim().min(1, { message: 'choose a subsystem' }),
    unit: z.string().trim().max(60),
    entry: z.string().trim().min(1, { message: 'give a value or a formula' }),
  })
  .superRefine((form, ctx) => {
    const row = rowFrom(form);
    if (!row.ok) ctx.addIssue({ code: 'custom', path: [row.field], message: row.message });
  });

export type AddRowFormProps = {
  subsystems: readonly string[];
  onAdd: (body: CreateParameterBody) => Promise<void>;
  onClose: () => void;
};

/** A panel to add a row: key, label, subsystem, unit, and a value or a formula. */
export function AddRowForm({ subsystems, onAdd, onClose }: AddRowFormProps) {
  const { control, submit, formError, isSubmitting } = useSchemaForm({
    schema: addRowSchema,
    defaultValues: { key: '', label: '', subsystem: subsystems[0] ?? '', unit: '', entry: '' },
    fields: ['key', 'label', 'subsystem', 'unit', 'entry'],
    onValid: async (form) => {
      const row = rowFrom(form);
      if (!row.ok) throw new Error(row.message);
      await onAdd(row.body);
      onClose();
    },
  });
  return (
    <SheetPanel label="Add a row" onClose={onClose} testID="sheet-add-row-form">
      <AppText variant="heading">Add a row</AppText>
      <ScrollView contentContainerStyle={styles.body}>
        <FormTextField control={control} name="key" label="Key (snake_case, used in formulas)" autoCapitalize="none" testID="add-row-key" />
        <FormTextField control={control} name="label" label="Label" testID="add-row-label" />
        <Controller
          control={control}
          name="subsystem"
          render={({ field }) => (
            <ChoiceChips
              label="Subsystem"
              choices={subsystems.map((name) => ({ value: name, label: name }))}
              value={field.value}
              onChange={field.onChange}
              testID="add-row-subsystem"
            />
          )}
        />
        <FormTextField control={control} name="unit" label="Unit (empty for a pure number)" autoCapitalize="none" testID="add-row-unit" />
        <FormTextField
          control={control}
          name="entry"
          label="Value, or a formula starting with ="
          autoCapitalize="none"
          testID="add-row-entry"
        />
        <FormError message={formError} />
        <FormActions submitLabel="Add row" busy={isSubmitting} onSubmit={submit} onCancel={onClose} testID="add-row" />
      </ScrollView>
    </SheetPanel>
  );
}

const styles = StyleSheet.create({
  body: { gap: space.md, paddingBottom: space.lg },
});
