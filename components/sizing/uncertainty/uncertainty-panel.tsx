import { useMemo, useState } from 'react';
import { StyleSheet, View } from 'react-native';
import { AnalysisProblems } from '@/components/sizing/analyses/analysis-card';
import { axisTitle, chartNumber } from '@/components/sizing/analyses/chart-text';
import { SizingCaution } from '@/components/sizing/sizing-caution';
import type { SheetSnapshot } from '@/components/sizing/use-sheet-session';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { ChoiceChips } from '@/components/ui/choice-chips';
import { HistogramChart } from '@/components/ui/histogram-chart';
import { ProgressBar } from '@/components/ui/progress-bar';
import { AppText } from '@/components/ui/text';
import { TextField } from '@/components/ui/text-field';
import { colors, radii, space } from '@/components/ui/theme';
import { editText, formatNumber, formatQuantity, formatUnit } from '@/shared/format/quantity';
import type { Parameter, Sheet } from '@/shared/schemas/sheet';
import {
  DEFAULT_SAMPLES,
  MAX_SAMPLES,
  uncertaintyRequestSchema,
  type DistributionKind,
  type UncertaintyRequest,
  type UncertaintyResult,
} from '@/shared/schemas/uncertainty';
import { rowRoleDefinitions, sheetRoles } from '@/shared/templates';
import { useUncertaintyStudy, type UncertaintyState } from './use-uncertainty-study';

/** The numbers of a distribution as typed, in the row's unit: min, mode and max, or mean and sd. */
interface InputDraft {
  readonly key: string;
  readonly kind: DistributionKind;
  readonly fields: Readonly<Record<string, string>>;
}

const kinds: readonly { value: DistributionKind; label: string }[] = [
  { value: 'uniform', label: 'Uniform' },
  { value: 'triangular', label: 'Triangular' },
  { value: 'normal', label: 'Normal' },
];

const fieldsOf: Record<DistributionKind, readonly { name: string; label: string }[]> = {
  uniform: [
    { name: 'min', label: 'Min' },
    { name: 'max', label: 'Max' },
  ],
  triangular: [
    { name: 'min', label: 'Min' },
    { name: 'mode', label: 'Most likely' },
    { name: 'max', label: 'Max' },
  ],
  normal: [
    { name: 'mean', label: 'Mean' },
    { name: 'sd', label: 'Std deviation' },
  ],
};

/** At most this many inputs are offered as chips: those with a role first. */
const offered = 40;

/** The rows a study may vary: inputs (values or materials) that are not protected, those with a role first. */
function inputRows(sheet: Sheet): Parameter[] {
  const inputs = sheet.parameters.filter((parameter) => parameter.formula === undefined && parameter.protected !== true);
  return [
    ...inputs.filter((parameter) => parameter.role !== undefined),
    ...inputs.filter((parameter) => parameter.role === undefined),
  ].slice(0, offered);
}

/** A first guess at a row's spread around its value: ±10 % as a range, 5 % as a standard deviation. */
function draftFor(key: string, kind: DistributionKind, nominal: number): InputDraft {
  const spread = nominal === 0 ? 1 : Math.abs(nominal) * 0.1;
  const text = (value: number) => editText(value);
  const fields: Record<DistributionKind, Record<string, string>> = {
    uniform: { min: text(nominal - spread), max: text(nominal + spread) },
    triangular: { min: text(nominal - spread), mode: text(nominal), max: text(nominal + spread) },
    normal: { mean: text(nominal), sd: text(spread / 2) },
  };
  return { key, kind, fields: fields[kind] };
}

type Built = { ok: true; request: UncertaintyRequest } | { ok: false; problems: string[] };

/** The request the form describes, or what is wrong, each problem naming the row or field as the screen shows it. */
function buildRequest(
  drafts: readonly InputDraft[],
  labelOf: (key: string) => string,
  settings: { samples: string; seed: string; percentiles: string; accelerationKey: string | undefined; accelerationTarget: string },
): Built {
  const problems: string[] = [];
  const number = (text: string, where: string): number => {
    const value = Number(text.trim());
    if (text.trim() === '' || !Number.isFinite(value)) problems.push(`${where}: type a number, got "${text}"`);
    return value;
  };
  const inputs = drafts.map((draft) => {
    const values = Object.fromEntries(
      fieldsOf[draft.kind].map((field) => [field.name, number(draft.fields[field.name] ?? '', `${labelOf(draft.key)}, ${field.label}`)]),
    );
    return { key: draft.key, distribution: { kind: draft.kind, ...values } };
  });
  if (drafts.length === 0) problems.push('Choose at least one input to vary');
  const percentiles = settings.percentiles
    .split(/[,\s]+/)
    .filter((part) => part !== '')
    .map((part) => number(part, 'Other percentiles'));
  const requirements =
    settings.accelerationKey !== undefined && settings.accelerationTarget.trim() !== ''
      ? [{ output: settings.accelerationKey, atLeast: settings.accelerationTarget.trim() }]
      : [];
  const samples = number(settings.samples, 'Samples');
  const seed = number(settings.seed, 'Seed');
  if (problems.length > 0) return { ok: false, problems };
  const parsed = uncertaintyRequestSchema.safeParse({ inputs, samples, seed, percentiles, requirements });
  if (parsed.success) return { ok: true, request: parsed.data };
  return {
    ok: false,
    problems: parsed.error.issues.map((issue) => {
      const [part, index] = issue.path;
      const where = part === 'inputs' && typeof index === 'number' ? labelOf(drafts[index]?.key ?? '') : String(part ?? 'Study');
      return `${where}: ${issue.message}`;
    }),
  };
}

/** One input's distribution: its kind and its numbers, in the row's unit. */
function InputEditor({
  draft,
  parameter,
  onChange,
  onRemove,
}: {
  draft: InputDraft;
  parameter: Parameter;
  onChange: (draft: InputDraft) => void;
  onRemove: () => void;
}) {
  const unit = formatUnit(parameter.unit);
  return (
    <View style={styles.input} testID={`uncertainty-input-${draft.key}`}>
      <View style={styles.inputHeader}>
        <AppText variant="heading" style={styles.inputTitle}>
          {parameter.label}
          {unit === '' ? '' : ` (${unit})`}
        </AppText>
        <Button label="Remove" tone="quiet" onPress={onRemove} aria-label={`Remove ${parameter.label}`} />
      </View>
      <ChoiceChips
        label="Distribution"
        choices={kinds}
        value={draft.kind}
        onChange={(kind) => {
          const nominal = Number(draft.fields.mean ?? draft.fields.mode ?? Number.NaN);
          const low = Number(draft.fields.min);
          const high = Number(draft.fields.max);
          const centre = Number.isFinite(nominal) ? nominal : (low + high) / 2;
          onChange(draftFor(draft.key, kind, Number.isFinite(centre) ? centre : 0));
        }}
        testID={`uncertainty-kind-${draft.key}`}
      />
      <View style={styles.fields}>
        {fieldsOf[draft.kind].map((field) => (
          <View key={field.name} style={styles.field}>
            <TextField
              label={field.label}
              value={draft.fields[field.name] ?? ''}
              onChangeText={(text) => onChange({ ...draft, fields: { ...draft.fields, [field.name]: text } })}
              inputMode="decimal"
              autoCapitalize="none"
              testID={`uncertainty-${draft.key}-${field.name}`}
            />
          </View>
        ))}
      </View>
    </View>
  );
}

function percentText(probability: number): string {
  return `${formatNumber(probability * 100, 3)} %`;
}

/** Probabilities, the percentile table and a histogram of the chosen figure. */
function StudyResult({ result }: { result: UncertaintyResult }) {
  const [shown, setShown] = useState(result.outputs[0]?.output ?? '');
  const output = result.outputs.find((candidate) => candidate.output === shown) ?? result.outputs[0];
  const percentiles = result.outputs[0]?.percentiles.map((entry) => entry.percentile) ?? [];
  return (
    <View style={styles.result} testID="uncertainty-result">
      <AppText variant="muted">
        {result.samples.toLocaleString('en')} samples, seed {result.seed}.
        {result.invalidSamples > 0
          ? ` ${result.invalidSamples} samples gave some figure no finite value and count as not meeting any requirement.`
          : ''}
      </AppText>
      {result.requirements.length > 0 ? (
        <View style={styles.table} testID="uncertainty-requirements">
          <AppText variant="label" style={styles.tableHead}>
            Probability of meeting each requirement
          </AppText>
          {result.requirements.map((requirement) => (
            <View key={requirement.id} style={styles.tableRow} testID={`uncertainty-requirement-${requirement.id}`}>
              <AppText style={styles.grow}>{requirement.label}</AppText>
              <AppText variant="mono" style={styles.number}>
                {percentText(requirement.probability)}
              </AppText>
            </View>
          ))}
        </View>
      ) : null}
      <View style={styles.table} testID="uncertainty-percentiles">
        <AppText variant="label" style={styles.tableHead}>
          Percentiles ({percentiles.map((p) => `P${p}`).join(', ')}) beside the sheet&apos;s own value
        </AppText>
        {result.outputs.map((figure) => (
          <View key={figure.output} style={styles.figure} testID={`uncertainty-percentiles-${figure.output}`}>
            <AppText style={styles.figureLabel}>{figure.label}</AppText>
            <View style={styles.values}>
              <AppText variant="mono">Nominal {figure.nominal === null ? '—' : formatQuantity(figure.nominal, figure.unit)}</AppText>
              {figure.percentiles.map((entry) => (
                <AppText key={entry.percentile} variant="mono" style={styles.value}>
                  P{entry.percentile} {formatQuantity(entry.value, figure.unit)}
                </AppText>
              ))}
              {figure.invalid > 0 ? <AppText variant="error">{figure.invalid} without a value</AppText> : null}
            </View>
          </View>
        ))}
      </View>
      {output !== undefined ? (
        <>
          <ChoiceChips
            label="Histogram of"
            choices={result.outputs.map((figure) => ({ value: figure.output, label: figure.label }))}
            value={output.output}
            onChange={setShown}
            testID="uncertainty-histogram-choice"
          />
          <HistogramChart
            title={`Distribution of ${output.label.toLowerCase()} over ${result.samples} samples`}
            from={output.histogram.from}
            to={output.histogram.to}
            counts={output.histogram.counts}
            xLabel={axisTitle(output.label, output.unit)}
            markers={output.percentiles
              .filter((entry) => [5, 50, 95].includes(entry.percentile))
              .map((entry) => ({ x: entry.value, label: `P${entry.percentile}`, kind: 'percentile' as const }))}
            formatValue={chartNumber}
            testID="uncertainty-histogram"
          />
        </>
      ) : null}
    </View>
  );
}

function Outcome({
  state,
  ranOn,
  sheet,
  onCancel,
}: {
  state: UncertaintyState;
  ranOn: Sheet | undefined;
  sheet: Sheet;
  onCancel: () => void;
}) {
  switch (state.status) {
    case 'running':
      return (
        <ProgressBar
          label="Study progress"
          done={state.done}
          total={state.total}
          counting="samples"
          onCancel={onCancel}
          testID="uncertainty-progress"
          cancelTestID="uncertainty-cancel"
        />
      );
    case 'failed':
      return <AnalysisProblems problems={state.problems.map((problem) => problem.message)} testID="uncertainty-failed" />;
    case 'cancelled':
      return (
        <AppText variant="muted" testID="uncertainty-cancelled">
          The study was cancelled.
        </AppText>
      );
    case 'done':
      return (
        <>
          {ranOn !== undefined && ranOn !== sheet ? (
            <AppText variant="error" testID="uncertainty-stale">
              The sheet has changed since this study: run it again for figures from the sheet as it is now.
            </AppText>
          ) : null}
          <StudyResult result={state.result} />
        </>
      );
    case 'idle':
      return null;
  }
}

export type UncertaintyPanelProps = { snapshot: SheetSnapshot };

/**
 * The uncertainty study of the sheet as it stands: give inputs a range or a distribution, run a Monte Carlo of
 * the headline figures in a background worker (progress, cancel), and read percentiles, histograms and the
 * probability of meeting each requirement (the sheet's required margin and temperature limit, and a target
 * characteristic acceleration).
 */
export function UncertaintyPanel({ snapshot }: UncertaintyPanelProps) {
  const { sheet } = snapshot;
  const rows = useMemo(() => inputRows(sheet), [sheet]);
  const accelerationKey = sheetRoles(sheet).characteristic_acceleration;
  const accelerationRow = sheet.parameters.find((parameter) => parameter.key === accelerationKey);
  const [drafts, setDrafts] = useState<InputDraft[]>([]);
  const [samples, setSamples] = useState(String(DEFAULT_SAMPLES));
  const [seed, setSeed] = useState('1');
  const [percentiles, setPercentiles] = useState('');
  const [accelerationTarget, setAccelerationTarget] = useState('');
  const [problems, setProblems] = useState<string[]>([]);
  const [ranOn, setRanOn] = useState<Sheet | undefined>(undefined);
  const study = useUncertaintyStudy();

  const parameterOf = (key: string) => sheet.parameters.find((parameter) => parameter.key === key);
  const labelOf = (key: string) => parameterOf(key)?.label ?? key;
  const available = rows.filter((row) => !drafts.some((draft) => draft.key === row.key));

  const add = (key: string) => {
    const nominal = snapshot.values[key]?.value ?? parameterOf(key)?.value ?? 0;
    setDrafts((current) => [...current, draftFor(key, 'normal', nominal)]);
  };

  const run = () => {
    const built = buildRequest(drafts, labelOf, { samples, seed, percentiles, accelerationKey, accelerationTarget });
    setProblems(built.ok ? [] : built.problems);
    if (!built.ok) return;
    setRanOn(sheet);
    study.run(sheet, built.request);
  };

  const accelerationUnit = accelerationRow === undefined ? '' : formatUnit(accelerationRow.unit);
  return (
    <Card testID="uncertainty-panel">
      <AppText variant="heading">Uncertainty</AppText>
      <AppText variant="muted">
        Give inputs a range or a distribution and see how the headline figures spread: percentiles, histograms and the probability of
        meeting each requirement. On the sheet as it stands now; nothing on the sheet changes.
      </AppText>
      {available.length > 0 ? (
        <ChoiceChips
          label="Add an input to vary"
          choices={available.map((row) => ({ value: row.key, label: row.label }))}
          value={null}
          onChange={add}
          testID="uncertainty-add"
        />
      ) : null}
      {drafts.length === 0 ? <AppText variant="muted">No input varies yet: add one above.</AppText> : null}
      {drafts.map((draft) => {
        const parameter = parameterOf(draft.key);
        return parameter === undefined ? null : (
          <InputEditor
            key={draft.key}
            draft={draft}
            parameter={parameter}
            onChange={(next) => setDrafts((current) => current.map((entry) => (entry.key === next.key ? next : entry)))}
            onRemove={() => setDrafts((current) => current.filter((entry) => entry.key !== draft.key))}
          />
        );
      })}
      <View style={styles.fields}>
        <View style={styles.field}>
          <TextField
            label={`Samples (up to ${MAX_SAMPLES.toLocaleString('en')})`}
            value={samples}
            onChangeText={setSamples}
            inputMode="numeric"
            testID="uncertainty-samples"
          />
        </View>
        <View style={styles.field}>
          <TextField label="Seed" value={seed} onChangeText={setSeed} inputMode="numeric" testID="uncertainty-seed" />
        </View>
        <View style={styles.field}>
          <TextField
            label="Other percentiles (e.g. 10, 90)"
            value={percentiles}
            onChangeText={setPercentiles}
            autoCapitalize="none"
            testID="uncertainty-percentiles-extra"
          />
        </View>
      </View>
      {accelerationRow !== undefined ? (
        <TextField
          label={`Required ${rowRoleDefinitions.characteristic_acceleration.label.toLowerCase()}, at least${accelerationUnit === '' ? '' : ` (${accelerationUnit}, or with a unit)`}`}
          value={accelerationTarget}
          onChangeText={setAccelerationTarget}
          autoCapitalize="none"
          testID="uncertainty-target-acceleration"
        />
      ) : null}
      <AppText variant="muted">
        The sheet&apos;s own requirements are judged on every sample too: its template&apos;s checks, its required system margin and its
        film temperature limit.
      </AppText>
      <Button label="Run the study" onPress={run} busy={study.state.status === 'running'} style={styles.start} testID="uncertainty-run" />
      {problems.length > 0 ? <AnalysisProblems problems={problems} testID="uncertainty-problems" /> : null}
      <Outcome state={study.state} ranOn={ranOn} sheet={sheet} onCancel={study.cancel} />
      <SizingCaution testID="uncertainty-caution" />
    </Card>
  );
}

const styles = StyleSheet.create({
  input: { gap: space.sm, borderWidth: 1, borderColor: colors.rule, borderRadius: radii.md, padding: space.md },
  inputHeader: { flexDirection: 'row', alignItems: 'center', justifyContent: 'space-between', gap: space.sm },
  inputTitle: { flexShrink: 1 },
  fields: { flexDirection: 'row', flexWrap: 'wrap', gap: space.md },
  field: { flexGrow: 1, flexBasis: 140 },
  start: { alignSelf: 'flex-start' },
  result: { gap: space.md },
  table: { borderWidth: 1, borderColor: colors.rule, borderRadius: radii.md, overflow: 'hidden' },
  tableHead: { paddingHorizontal: space.md, paddingVertical: space.xs, backgroundColor: colors.recess },
  tableRow: {
    flexDirection: 'row',
    alignItems: 'center',
    gap: space.sm,
    paddingHorizontal: space.md,
    paddingVertical: space.xs,
    borderTopWidth: 1,
    borderTopColor: colors.recess,
  },
  grow: { flex: 1 },
  number: { color: colors.ink, fontVariant: ['tabular-nums'] },
  figure: { paddingHorizontal: space.md, paddingVertical: space.xs, borderTopWidth: 1, borderTopColor: colors.recess, gap: 2 },
  figureLabel: { color: colors.ink },
  values: { flexDirection: 'row', flexWrap: 'wrap', columnGap: space.md },
  value: { color: colors.ink },
});
