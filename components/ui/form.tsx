import { useState } from 'react';
import {
  Controller,
  useForm,
  type Control,
  type DefaultValues,
  type FieldErrors,
  type FieldPath,
  type FieldValues,
  type Resolver,
  type UseFormSetError,
} from 'react-hook-form';
import type { z } from 'zod';
import { ApiError } from '@/components/api/client';
import { StyleSheet, View } from 'react-native';
import { Button } from './button';
import { AppText } from './text';
import { space } from './theme';
import { TextField, type TextFieldProps } from './text-field';

/** The form field a schema issue or a server detail belongs to: its first path segment after "body". */
function fieldOf(path: readonly PropertyKey[]): string {
  const segments = path[0] === 'body' ? path.slice(1) : path;
  return String(segments[0] ?? 'root');
}

/**
 * A react-hook-form resolver that validates with a shared zod schema (the same one the server uses)
 * and hands the parsed, trimmed values to the submit handler.
 */
export function zodResolver<S extends z.ZodType<FieldValues, FieldValues>>(schema: S): Resolver<z.input<S>, unknown, z.output<S>> {
  return (values) => {
    const parsed = schema.safeParse(values);
    if (parsed.success) return { values: parsed.data, errors: {} };
    const errors: Record<string, { type: string; message: string }> = {};
    for (const issue of parsed.error.issues) {
      const field = fieldOf(issue.path);
      errors[field] ??= { type: issue.code, message: issue.message };
    }
    return { values: {}, errors: errors as FieldErrors<z.input<S>> };
  };
}

/**
 * Puts the server's field errors (`details: [{ path: "body.email", message }]`) beside the matching
 * fields. Returns the message for whatever could not be placed on a field, or null when all were placed.
 */
export function applyServerErrors<T extends FieldValues>(
  error: unknown,
  fields: readonly FieldPath<T>[],
  setError: UseFormSetError<T>,
): string | null {
  if (!(error instanceof ApiError)) return error instanceof Error ? error.message : String(error);
  let unplaced = error.fieldErrors.length === 0;
  for (const detail of error.fieldErrors) {
    const field = fields.find((name) => name === fieldOf(detail.path.split('.')));
    if (field) setError(field, { type: 'server', message: detail.message });
    else unplaced = true;
  }
  return unplaced ? error.message : null;
}

export type FormTextFieldProps<T extends FieldValues> = Omit<TextFieldProps, 'value' | 'onChangeText' | 'onBlur' | 'error'> & {
  control: Control<T>;
  name: FieldPath<T>;
};

/** A TextField bound to a react-hook-form field, showing that field's error beside it. */
export function FormTextField<T extends FieldValues>({ control, name, ...props }: FormTextFieldProps<T>) {
  return (
    <Controller
      control={control}
      name={name}
      render={({ field, fieldState }) => (
        <TextField
          {...props}
          value={typeof field.value === 'string' ? field.value : ''}
          onChangeText={field.onChange}
          onBlur={field.onBlur}
          error={fieldState.error?.message}
        />
      )}
    />
  );
}

export type SchemaFormOptions<S extends z.ZodType<FieldValues, FieldValues>> = {
  schema: S;
  defaultValues: DefaultValues<z.input<S>>;
  /** The fields a server error may name; other server errors become the form error. */
  fields: readonly FieldPath<z.input<S>>[];
  /** Sends the parsed values; the form resets to its defaults when this resolves. */
  onValid: (values: z.output<S>) => Promise<unknown>;
};

/**
 * A react-hook-form form validated by a shared zod schema whose submit puts server field errors beside
 * their fields and any other failure into `formError`.
 */
export function useSchemaForm<S extends z.ZodType<FieldValues, FieldValues>>({
  schema,
  defaultValues,
  fields,
  onValid,
}: SchemaFormOptions<S>) {
  const [formError, setFormError] = useState<string | null>(null);
  const form = useForm<z.input<S>, unknown, z.output<S>>({ resolver: zodResolver(schema), defaultValues });
  const submit = form.handleSubmit(async (values) => {
    setFormError(null);
    try {
      await onValid(values);
      form.reset(defaultValues);
    } catch (error) {
      setFormError(applyServerErrors(error, fields, form.setError));
    }
  });
  return { control: form.control, submit: () => void submit(), formError, isSubmitting: form.formState.isSubmitting };
}

/** The error of a whole form (what no single field can show), announced when it appears. */
export function FormError({ message }: { message: string | null | undefined }) {
  return message ? (
    <AppText variant="error" role="alert">
      {message}
    </AppText>
  ) : null;
}

export type FormActionsProps = {
  submitLabel: string;
  busy: boolean;
  onSubmit: () => void;
  /** Shows a Cancel button when given. */
  onCancel?: () => void;
  /** The submit button's testID is `<testID>-submit`. */
  testID: string;
};

/** The row under a form: submit, and Cancel where the form can be closed. */
export function FormActions({ submitLabel, busy, onSubmit, onCancel, testID }: FormActionsProps) {
  return (
    <View style={styles.actions}>
      <Button label={submitLabel} busy={busy} onPress={onSubmit} testID={`${testID}-submit`} />
      {onCancel ? <Button label="Cancel" tone="quiet" onPress={onCancel} /> : null}
    </View>
  );
}

const styles = StyleSheet.create({
  actions: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm },
});
