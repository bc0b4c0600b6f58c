import { useQuery } from '@tanstack/react-query';
import { useSheetEvents } from '@/components/sheet/queries';
import { Link, useRouter } from 'expo-router';
import { useMemo, useRef, useState, type ReactNode, type RefObject } from 'react';
import { Platform, ScrollView, StyleSheet, useWindowDimensions, View } from 'react-native';
import { useSafeAreaInsets } from 'react-native-safe-area-context';
import { ApiError } from '@/components/api/client';
import { craftOptions } from '@/components/crafts/queries';
import { revisionListOptions } from '@/components/revisions/queries';
import { SizingCaution } from '@/components/sizing/sizing-caution';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { ChoiceChips } from '@/components/ui/choice-chips';
import { EmptyState, ErrorState, LoadingState } from '@/components/ui/states';
import { AppText } from '@/components/ui/text';
import { colors, sideNavBreakpoint, space } from '@/components/ui/theme';
import { craftParamsSchema } from '@/shared/schemas/crafts';
import type { CompareResponse, HeaderChange } from '@/shared/schemas/compare';
import type { Revision } from '@/shared/schemas/revisions';
import { CompareOutputs } from './compare-outputs';
import { CompareRows } from './compare-rows';
import { defaultPair, filterComparison, revisionChoiceLabel, subsystemsOf, type CompareFilters } from './compare-view';
import { CompareFiltersBar } from './compare-filters-bar';
import { PrintStyles } from './print-styles';
import { MovedOutputPanel } from './moved-output-panel';
import { comparisonOptions } from './queries';

/** A search parameter as the address gives it: a repeated one arrives as a list, and its first value counts. */
type SearchParam = string | string[] | undefined;

export type CompareScreenProps = {
  craftId: string;
  /** The revisions compared (ids); left out, the working draft against the latest baseline. */
  from?: SearchParam;
  to?: SearchParam;
  /** An output's key: what moved it is shown. */
  output?: SearchParam;
};

function firstOf(param: SearchParam): string | undefined {
  const value = Array.isArray(param) ? param[0] : param;
  return value === '' ? undefined : value;
}

/** Printing is the browser's: offered on the web only. */
const canPrint = Platform.OS === 'web' && typeof window !== 'undefined' && typeof window.print === 'function';

function Frame({
  title,
  craftId,
  scrollRef,
  children,
}: {
  title: string;
  craftId: string | undefined;
  /** Given in every state: react-native-web attaches a scroll view's ref only when the view mounts. */
  scrollRef: RefObject<ScrollView | null>;
  children: ReactNode;
}) {
  const insets = useSafeAreaInsets();
  return (
    <ScrollView
      ref={scrollRef}
      style={styles.root}
      contentContainerStyle={[styles.content, { paddingTop: insets.top + space.md }]}
      testID="compare-screen"
    >
      <PrintStyles />
      <View style={styles.header}>
        <AppText variant="title" style={styles.title}>
          {title}
        </AppText>
        <View style={styles.actions} testID="compare-actions">
          {canPrint ? <Button label="Print" tone="secondary" onPress={() => window.print()} testID="compare-print" /> : null}
          <Link href={craftId === undefined ? '/crafts' : `/crafts/${craftId}`} asChild>
            <Button label={craftId === undefined ? 'All crafts' : 'Craft'} tone="quiet" role="link" />
          </Link>
        </View>
      </View>
      {children}
    </ScrollView>
  );
}

/** Why the craft or its revisions did not load: a craft the caller may not see is 404, like one that does not exist. */
function failure(error: Error, what: string): { title: string; message: string; retry: boolean } {
  if (error instanceof ApiError && error.status === 404) {
    return { title: 'No such craft', message: 'This craft does not exist, or you may not see it.', retry: false };
  }
  return { title: `Could not load the ${what}`, message: error.message, retry: true };
}

function RevisionPicker({
  label,
  revisions,
  value,
  onChange,
  testID,
}: {
  label: string;
  revisions: readonly Revision[];
  value: string | undefined;
  onChange: (id: string) => void;
  testID: string;
}) {
  return (
    <ChoiceChips
      label={label}
      choices={revisions.map((revision) => ({ value: revision.id, label: revisionChoiceLabel(revision) }))}
      value={value ?? null}
      onChange={onChange}
      testID={testID}
    />
  );
}

const sides = [
  { side: 'from', label: 'From (older)' },
  { side: 'to', label: 'To (newer)' },
] as const;

/** Who locked a revision and when, or that it is still open. */
function standing(revision: Revision): string {
  if (revision.lockedAt === null) return 'open';
  return `locked ${revision.lockedAt.slice(0, 10)}${revision.lockedBy === null ? '' : ` by ${revision.lockedBy.name}`}`;
}

const headerFieldLabels: Readonly<Record<HeaderChange['field'], string>> = {
  name: 'Sheet name',
  budgetPreset: 'Growth allowance preset',
  requiredMarginPercent: 'Required system margin (%)',
};

function SettingsChanges({ changes }: { changes: readonly HeaderChange[] }) {
  if (changes.length === 0) return null;
  return (
    <Card testID="compare-settings">
      <AppText variant="heading">Sheet settings changed</AppText>
      {changes.map((change) => (
        <AppText key={change.field}>
          {headerFieldLabels[change.field]}: {change.from ?? 'none'} → {change.to ?? 'none'}
        </AppText>
      ))}
    </Card>
  );
}

type ComparisonProps = {
  craftId: string;
  from: string;
  to: string;
  output: string | undefined;
  onPick: (output: string | undefined) => void;
  scrollRef: RefObject<ScrollView | null>;
};

/** The labels of the rows and outputs a comparison names, by key. */
function labeller(comparison: CompareResponse): (key: string) => string {
  const { added, removed, changed } = comparison.rows;
  const labels = new Map([...removed, ...changed, ...added, ...comparison.outputs].map((item) => [item.key, item.label]));
  return (key) => labels.get(key) ?? key;
}

/** The two revisions compared: their rows, then every output, and what moved the chosen output. */
function Comparison({ craftId, from, to, output, onPick, scrollRef }: ComparisonProps) {
  // Edits to the revision compared to (usually the working draft) refetch the comparison as they are saved.
  useSheetEvents(craftId, to);
  const comparison = useQuery(comparisonOptions(craftId, from, to));
  const [filters, setFilters] = useState<CompareFilters>({ changedOnly: true, subsystem: null, outputSearch: '' });
  const { width } = useWindowDimensions();
  const wide = width >= sideNavBreakpoint;
  // Set when an output is picked: the panel scrolls into view once it is laid out.
  const scrollToPanel = useRef(false);
  const shown = useMemo(() => comparison.data && filterComparison(comparison.data, filters), [comparison.data, filters]);
  const subsystems = useMemo(() => (comparison.data ? subsystemsOf(comparison.data) : []), [comparison.data]);
  const labelOf = useMemo(() => (comparison.data ? labeller(comparison.data) : (key: string) => key), [comparison.data]);

  if (comparison.isPending) return <LoadingState label="Comparing the revisions…" />;
  if (comparison.isError) {
    const { error } = comparison;
    const status = error instanceof ApiError ? error.status : 0;
    return (
      <ErrorState
        title={status === 404 ? 'No such revision' : 'Could not compare these revisions'}
        message={status === 404 ? 'One of the revisions is not in this craft, or you may not see it.' : error.message}
        onRetry={status === 404 || status === 400 ? undefined : () => void comparison.refetch()}
      />
    );
  }
  if (shown === undefined) return null;
  const { data } = comparison;
  const pick = (key: string) => {
    scrollToPanel.current = true;
    onPick(key);
  };
  return (
    <>
      <AppText variant="muted" testID="compare-pair">
        {`${revisionChoiceLabel(data.from)} (${standing(data.from)}) → ${revisionChoiceLabel(data.to)} (${standing(data.to)})`}
      </AppText>
      <CompareFiltersBar filters={filters} subsystems={subsystems} onChange={setFilters} />
      <SettingsChanges changes={data.header} />
      <CompareRows added={shown.added} removed={shown.removed} changed={shown.changed} wide={wide} />
      <AppText variant="heading" testID="compare-outputs-heading">
        Outputs: {shown.outputs.length} of {data.outputs.length}
        {filters.changedOnly ? ' (changed only)' : ''}
      </AppText>
      <SizingCaution testID="compare-caution" />
      {output === undefined ? null : (
        <View
          onLayout={(event) => {
            if (!scrollToPanel.current) return;
            scrollToPanel.current = false;
            scrollRef.current?.scrollTo({ y: event.nativeEvent.layout.y, animated: true });
          }}
        >
          <MovedOutputPanel
            craftId={craftId}
            from={from}
            to={to}
            output={output}
            labelOf={labelOf}
            wide={wide}
            onClose={() => onPick(undefined)}
          />
        </View>
      )}
      <CompareOutputs outputs={shown.outputs} picked={output} onPick={pick} wide={wide} />
    </>
  );
}

/**
 * Two revisions of a craft compared: pickers for both (kept in the address, so a comparison can be linked),
 * the rows added, removed and changed, every output with its change, and what moved a chosen output.
 */
export function CompareScreen({ craftId, ...params }: CompareScreenProps) {
  const wellFormed = craftParamsSchema.safeParse({ craftId }).success;
  const craft = useQuery({ ...craftOptions(craftId), enabled: wellFormed });
  const revisions = useQuery({ ...revisionListOptions(craftId), enabled: wellFormed });
  const router = useRouter();
  const scrollRef = useRef<ScrollView>(null);

  if (!wellFormed) {
    return (
      <Frame title="Compare" craftId={undefined} scrollRef={scrollRef}>
        <ErrorState title="No such craft" message={`“${craftId}” in the address is not a craft identifier.`} />
      </Frame>
    );
  }
  if (craft.isPending || revisions.isPending) {
    return (
      <Frame title="Compare" craftId={craftId} scrollRef={scrollRef}>
        <LoadingState label="Loading the craft’s revisions…" />
      </Frame>
    );
  }
  const loadFailed = (error: Error, what: string, refetch: () => unknown) => {
    const problem = failure(error, what);
    return (
      <Frame title="Compare" craftId={undefined} scrollRef={scrollRef}>
        <ErrorState title={problem.title} message={problem.message} onRetry={problem.retry ? () => void refetch() : undefined} />
      </Frame>
    );
  };
  if (craft.isError) return loadFailed(craft.error, 'craft', craft.refetch);
  if (revisions.isError) return loadFailed(revisions.error, 'craft’s revisions', revisions.refetch);

  const defaults = defaultPair(revisions.data);
  const from = firstOf(params.from) ?? defaults.from;
  const to = firstOf(params.to) ?? defaults.to;
  const output = firstOf(params.output);
  return (
    <Frame title={`${craft.data.name}: compare`} craftId={craftId} scrollRef={scrollRef}>
      <Card testID="compare-controls">
        {sides.map(({ side, label }) => (
          <RevisionPicker
            key={side}
            label={label}
            revisions={revisions.data}
            value={side === 'from' ? from : to}
            onChange={(id) => router.setParams({ [side]: id })}
            testID={`compare-${side}`}
          />
        ))}
      </Card>
      {from === undefined || to === undefined ? (
        <EmptyState
          title="Nothing to compare yet"
          message="Lock a baseline or open a study, then compare it with the working draft; or choose two revisions above."
        />
      ) : (
        <Comparison
          craftId={craftId}
          from={from}
          to={to}
          output={output}
          onPick={(key) => router.setParams({ output: key })}
          scrollRef={scrollRef}
        />
      )}
    </Frame>
  );
}

const styles = StyleSheet.create({
  root: { flex: 1, backgroundColor: colors.ground },
  content: { width: '100%', maxWidth: 1280, alignSelf: 'center', gap: space.lg, paddingHorizontal: space.lg, paddingBottom: space.xxl },
  header: { flexDirection: 'row', flexWrap: 'wrap', alignItems: 'center', justifyContent: 'space-between', gap: space.md },
  title: { flexShrink: 1 },
  actions: { flexDirection: 'row', alignItems: 'center', gap: space.sm },
});
