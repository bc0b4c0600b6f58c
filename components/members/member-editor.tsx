import { useState, type ReactNode } from 'react';
import { StyleSheet, View } from 'react-native';
import { ApiError } from '@/components/api/client';
import { ChoiceChips } from '@/components/ui/choice-chips';
import { FormActions, FormError } from '@/components/ui/form';
import { AppText } from '@/components/ui/text';
import { TextField } from '@/components/ui/text-field';
import { space } from '@/components/ui/theme';
import { setMemberBodySchema, type SetMemberBody } from '@/shared/schemas/members';
import { craftRoleLabels, craftRoles, type CraftRole } from '@/shared/schemas/roles';

const roleChoices = craftRoles.map((role) => ({ value: role, label: craftRoleLabels[role] }));

type Errors = { role?: string; subsystems?: string; form?: string };

/** Splits "Sail membrane, Booms" into trimmed subsystem names. */
function parseSubsystems(text: string): string[] {
  return text
    .split(',')
    .map((name) => name.trim())
    .filter((name) => name !== '');
}

/**
 * Files one problem under its field. `path` is relative to the body (["subsystems", 2]); a problem with
 * one subsystem names it, so the person knows which of the comma-separated entries to fix.
 */
function addError(errors: Errors, path: readonly PropertyKey[], message: string, names: readonly string[]): void {
  const [field, index] = path;
  if (field === 'role') errors.role ??= message;
  else if (field === 'subsystems') {
    const name = typeof index === 'number' ? names[index] : undefined;
    errors.subsystems ??= name === undefined ? message : `“${name}”: ${message}`;
  } else errors.form ??= message;
}

function errorsFrom(error: unknown, names: readonly string[]): Errors {
  if (!(error instanceof ApiError)) return { form: error instanceof Error ? error.message : String(error) };
  const errors: Errors = {};
  for (const detail of error.fieldErrors) {
    const [, ...path] = detail.path.split('.').map((segment) => (/^\d+$/.test(segment) ? Number(segment) : segment));
    addError(errors, path, detail.message, names);
  }
  if (error.fieldErrors.length === 0) errors.form = error.message;
  return errors;
}

export type MemberEditorProps = {
  initialRole?: CraftRole;
  initialSubsystems?: readonly string[];
  submitLabel: string;
  /** Saves the membership; field errors from the server appear beside role or subsystems. */
  onSubmit: (body: SetMemberBody) => Promise<unknown>;
  onCancel?: () => void;
  /** Fields shown above the role, e.g. the person picker when adding. */
  children?: ReactNode;
  testID: string;
};

/** Role and (for subsystem owners) subsystems of one craft member. */
export function MemberEditor({
  initialRole,
  initialSubsystems = [],
  submitLabel,
  onSubmit,
  onCancel,
  children,
  testID,
}: MemberEditorProps) {
  const [role, setRole] = useState<CraftRole | null>(initialRole ?? null);
  const [subsystems, setSubsystems] = useState(initialSubsystems.join(', '));
  const [errors, setErrors] = useState<Errors>({});
  const [busy, setBusy] = useState(false);

  const submit = async () => {
    const names = role === 'subsystem_owner' ? parseSubsystems(subsystems) : [];
    const parsed = setMemberBodySchema.safeParse({ role: role ?? undefined, subsystems: names });
    if (!parsed.success) {
      const next: Errors = {};
      for (const issue of parsed.error.issues)
        addError(next, issue.path, issue.path[0] === 'role' ? 'choose a role' : issue.message, names);
      return setErrors(next);
    }
    setErrors({});
    setBusy(true);
    try {
      await onSubmit(parsed.data);
    } catch (error) {
      setErrors(errorsFrom(error, names));
    } finally {
      setBusy(false);
    }
  };

  return (
    <View style={styles.editor}>
      {children}
      <ChoiceChips label="Role" choices={roleChoices} value={role} onChange={setRole} testID={`${testID}-role`} />
      {errors.role ? <AppText variant="error">{errors.role}</AppText> : null}
      {role === 'subsystem_owner' ? (
        <TextField
          label="Subsystems (comma-separated)"
          value={subsystems}
          onChangeText={setSubsystems}
          placeholder="Sail membrane, Booms"
          error={errors.subsystems}
          testID={`${testID}-subsystems`}
        />
      ) : null}
      <FormError message={errors.form} />
      <FormActions submitLabel={submitLabel} busy={busy} onSubmit={() => void submit()} onCancel={onCancel} testID={testID} />
    </View>
  );
}

const styles = StyleSheet.create({
  editor: { gap: space.md },
});
