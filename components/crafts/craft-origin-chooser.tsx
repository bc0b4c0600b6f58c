import { useQuery } from '@tanstack/react-query';
import { Pressable, StyleSheet, View } from 'react-native';
import { useSessionUser } from '@/components/auth/queries';
import { ErrorState, LoadingState } from '@/components/ui/states';
import { AppText } from '@/components/ui/text';
import { colors, fonts, radii, space, touchTarget } from '@/components/ui/theme';
import { mayOnCraft } from '@/shared/access/permissions';
import { craftListOptions, templateListOptions } from './queries';

/** Where a new craft's sheet comes from: a template, or a copy of another craft's current sheet. */
export type CraftOrigin = { readonly templateId: string } | { readonly copyOf: string };

/** Whether two origins name the same source. */
function sameOrigin(a: CraftOrigin | null, b: CraftOrigin): boolean {
  if (a === null) return false;
  return 'templateId' in a ? 'templateId' in b && a.templateId === b.templateId : 'copyOf' in b && a.copyOf === b.copyOf;
}

type OptionProps = {
  title: string;
  detail: string;
  selected: boolean;
  onPress: () => void;
  testID: string;
};

function Option({ title, detail, selected, onPress, testID }: OptionProps) {
  return (
    <Pressable
      role="radio"
      aria-checked={selected}
      aria-label={title}
      onPress={onPress}
      style={({ pressed }) => [styles.option, selected && styles.selected, pressed && styles.pressed]}
      testID={testID}
    >
      <AppText style={styles.title}>{title}</AppText>
      <AppText variant="muted">{detail}</AppText>
    </Pressable>
  );
}

export type CraftOriginChooserProps = {
  value: CraftOrigin | null;
  onChange: (origin: CraftOrigin) => void;
};

/**
 * The templates a new craft can start from (name and description of each), then the crafts whose
 * current sheet the person may copy.
 */
export function CraftOriginChooser({ value, onChange }: CraftOriginChooserProps) {
  const templates = useQuery(templateListOptions());
  const crafts = useQuery(craftListOptions());
  const isOrgAdmin = useSessionUser()?.isOrgAdmin ?? false;
  const copyable = (crafts.data ?? []).filter((craft) => mayOnCraft('copyCraft', { role: craft.myRole, isOrgAdmin }));

  return (
    <View style={styles.chooser}>
      <AppText variant="label">Start from a template</AppText>
      {templates.isPending ? (
        <LoadingState label="Loading templates…" />
      ) : templates.isError ? (
        <ErrorState title="Could not load the templates" message={templates.error.message} onRetry={() => void templates.refetch()} />
      ) : (
        <View role="radiogroup" aria-label="Template" style={styles.options} testID="craft-origin-templates">
          {templates.data.map((template) => {
            const origin = { templateId: template.id };
            return (
              <Option
                key={template.id}
                title={template.name}
                detail={`${template.description} (${template.parameterCount} rows)`}
                selected={sameOrigin(value, origin)}
                onPress={() => onChange(origin)}
                testID={`craft-origin-template-${template.id}`}
              />
            );
          })}
        </View>
      )}
      {copyable.length > 0 ? (
        <>
          <AppText variant="label">Or copy the current sheet of a craft</AppText>
          <View role="radiogroup" aria-label="Craft to copy" style={styles.options} testID="craft-origin-copies">
            {copyable.map((craft) => {
              const origin = { copyOf: craft.id };
              return (
                <Option
                  key={craft.id}
                  title={`Copy of ${craft.name}`}
                  detail={craft.description || 'No description.'}
                  selected={sameOrigin(value, origin)}
                  onPress={() => onChange(origin)}
                  testID={`craft-origin-copy-${craft.id}`}
                />
              );
            })}
          </View>
        </>
      ) : null}
    </View>
  );
}

const styles = StyleSheet.create({
  chooser: { gap: space.sm },
  options: { gap: space.sm },
  option: {
    minHeight: touchTarget,
    borderWidth: 1,
    borderColor: colors.rule,
    borderRadius: radii.md,
    backgroundColor: colors.panel,
    paddingVertical: space.sm,
    paddingHorizontal: space.md,
    gap: 2,
  },
  selected: { borderColor: colors.film, borderWidth: 2, backgroundColor: colors.filmWash },
  pressed: { opacity: 0.8 },
  title: { fontFamily: fonts.semibold },
});
