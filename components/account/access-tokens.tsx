import { useQuery } from '@tanstack/react-query';
import { useState } from 'react';
import { Controller } from 'react-hook-form';
import { StyleSheet, View } from 'react-native';
import { Badge } from '@/components/ui/badge';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { ChoiceChips } from '@/components/ui/choice-chips';
import { DividedList } from '@/components/ui/divided-list';
import { FormActions, FormError, FormTextField, useSchemaForm } from '@/components/ui/form';
import { EmptyState, ErrorState, LoadingState } from '@/components/ui/states';
import { AppText } from '@/components/ui/text';
import { colors, radii, space } from '@/components/ui/theme';
import { createTokenBodySchema, type AccessToken, type TokenScope } from '@/shared/schemas/tokens';
import type { CreatedToken } from './api';
import { tokenListOptions, useCreateToken, useRevokeToken } from './queries';

const scopeLabels: Readonly<Record<TokenScope, string>> = {
  read: 'Read',
  read_write: 'Read and write',
};

const scopeChoices = (Object.keys(scopeLabels) as TokenScope[]).map((value) => ({ value, label: scopeLabels[value] }));

/** The date part of an ISO timestamp, or "never". */
function day(timestamp: string | null): string {
  return timestamp === null ? 'never' : timestamp.slice(0, 10);
}

function NewTokenForm({ onCreated }: { onCreated: (created: CreatedToken) => void }) {
  const createToken = useCreateToken();
  const { control, submit, formError, isSubmitting } = useSchemaForm({
    schema: createTokenBodySchema,
    defaultValues: { name: '', scope: 'read' },
    fields: ['name', 'scope'],
    onValid: async (body) => onCreated(await createToken.mutateAsync(body)),
  });
  return (
    <View style={styles.form}>
      <FormTextField
        control={control}
        name="name"
        label="Token name (what the script is for)"
        testID="new-token-name"
        onSubmitEditing={submit}
      />
      <Controller
        control={control}
        name="scope"
        render={({ field }) => (
          <ChoiceChips label="Access" choices={scopeChoices} value={field.value} onChange={field.onChange} testID="new-token-scope" />
        )}
      />
      <FormError message={formError} />
      <FormActions submitLabel="Create token" busy={isSubmitting} onSubmit={submit} testID="new-token" />
    </View>
  );
}

/** The browser's clipboard, where there is one (the web app over https or on localhost). */
function clipboard(): { writeText(text: string): Promise<void> } | undefined {
  return (globalThis as { navigator?: { clipboard?: { writeText(text: string): Promise<void> } } }).navigator?.clipboard;
}

/** The secret of a token just created: shown this once, until the person dismisses it. */
function SecretOnce({ created, onDone }: { created: CreatedToken; onDone: () => void }) {
  const [copied, setCopied] = useState<'no' | 'yes' | 'failed'>('no');
  const board = clipboard();
  const copy = (target: { writeText(text: string): Promise<void> }) =>
    target.writeText(created.secret).then(
      () => setCopied('yes'),
      () => setCopied('failed'),
    );
  return (
    <View style={styles.secret} role="alert" testID="token-secret">
      <AppText variant="heading">Copy your new token now</AppText>
      <AppText>
        Copy the token below into your script&apos;s settings. It is shown only this once: after you close this box nobody can read it
        again, and a lost token is revoked and replaced.
      </AppText>
      <AppText variant="mono" selectable style={styles.secretText} testID="token-secret-value">
        {created.secret}
      </AppText>
      {copied === 'failed' ? <AppText variant="error">Copying was refused: select the token and copy it by hand.</AppText> : null}
      <View style={styles.inline}>
        {board !== undefined ? (
          <Button label={copied === 'yes' ? 'Copied' : 'Copy'} onPress={() => void copy(board)} testID="token-secret-copy" />
        ) : null}
        <Button label="I have copied it" tone="secondary" onPress={onDone} testID="token-secret-done" />
      </View>
    </View>
  );
}

function TokenRow({ token }: { token: AccessToken }) {
  const revoke = useRevokeToken();
  const [confirming, setConfirming] = useState(false);
  const revoked = token.revokedAt !== null;
  return (
    <View style={styles.row} testID={`token-${token.id}`}>
      <View style={styles.who}>
        <View style={styles.inline}>
          <AppText variant="heading">{token.name}</AppText>
          <Badge label={scopeLabels[token.scope]} strong={token.scope === 'read_write'} />
          {revoked ? <Badge label="Revoked" /> : null}
        </View>
        <AppText variant="mono">
          {token.prefix}… · created {day(token.createdAt)} · last used {day(token.lastUsedAt)}
        </AppText>
        {revoke.isError ? <AppText variant="error">{revoke.error.message}</AppText> : null}
      </View>
      {revoked ? null : confirming ? (
        <View style={styles.inline}>
          <Button
            label="Revoke now"
            tone="danger"
            busy={revoke.isPending}
            onPress={() => revoke.mutate(token.id)}
            testID={`token-${token.id}-confirm`}
          />
          <Button label="Keep" tone="quiet" onPress={() => setConfirming(false)} />
        </View>
      ) : (
        <Button
          label="Revoke"
          tone="secondary"
          aria-label={`Revoke ${token.name}`}
          onPress={() => setConfirming(true)}
          testID={`token-${token.id}-revoke`}
        />
      )}
    </View>
  );
}

/** Personal access tokens for scripts: create one (name and scope), see its secret once, list and revoke them. */
export function AccessTokens() {
  const tokens = useQuery(tokenListOptions());
  const [created, setCreated] = useState<CreatedToken | null>(null);
  return (
    <Card testID="access-tokens">
      <AppText variant="heading">Personal access tokens</AppText>
      <AppText variant="muted">
        Scripts and the command line use a token instead of your sign-in. A token acts as you, limited to reading or to reading and writing
        what your roles allow.
      </AppText>
      {created !== null ? <SecretOnce created={created} onDone={() => setCreated(null)} /> : <NewTokenForm onCreated={setCreated} />}
      {tokens.isPending ? (
        <LoadingState label="Loading tokens…" />
      ) : tokens.isError ? (
        <ErrorState title="Could not load your tokens" message={tokens.error.message} onRetry={() => void tokens.refetch()} />
      ) : tokens.data.length === 0 ? (
        <EmptyState title="No tokens" message="Tokens you create appear here." />
      ) : (
        <DividedList testID="token-list">
          {tokens.data.map((token) => (
            <TokenRow key={token.id} token={token} />
          ))}
        </DividedList>
      )}
    </Card>
  );
}

const styles = StyleSheet.create({
  form: { gap: space.md },
  secret: { gap: space.sm, padding: space.md, borderRadius: radii.md, backgroundColor: colors.filmWash },
  secretText: { color: colors.ink, fontSize: 14, padding: space.sm, backgroundColor: colors.panel, borderRadius: radii.sm },
  row: { flexDirection: 'row', flexWrap: 'wrap', alignItems: 'center', justifyContent: 'space-between', gap: space.md, padding: space.lg },
  who: { flexShrink: 1, gap: 2 },
  inline: { flexDirection: 'row', flexWrap: 'wrap', alignItems: 'center', gap: space.sm },
});
