import { Controller, type Control, type FieldErrors, type FieldPath, type FieldValues, type Resolver, type UseFormSetError } from 'react-hook-form';
import type { z } from 'zod';
import { ApiError } from '@/components/api/client';
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
export function applyServerErrors<T extends FieldValues>(error: unknown, fields: readonly FieldPath<T>[], setError: UseFormSetError<T>): string | null {
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
