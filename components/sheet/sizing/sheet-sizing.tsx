import { useMemo, useState } from 'react';
import { StyleSheet, View } from 'react-native';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { ChoiceChips } from '@/components/ui/choice-chips';
import { LineChart } from '@/components/ui/line-chart';
import { ProgressBar } from '@/components/ui/progress-bar';
import { AppText } from '@/components/ui/text';
import { TextField } from '@/components/ui/text-field';
import { Toggle } from '@/components/ui/toggle';
import { colors, radii, space } from '@/components/ui/theme';
import { editText, formatNumber, formatQuantity, formatUnit } from '@/shared/format/quantity';
import { AnalysisProblems } from '@/components/sizing/analyses/analysis-card';
import { SizingCaution } from '@/components/sizing/sizing-caution';
import type { SheetSnapshot } from '@/components/sizing/use-sheet-session';
import { roleSweep, sizeToTarget, sizingChoices, sizingTargets, type RoleSweepResult } from '@/shared/analyses';
import { valueInRowUnit, type TargetSolveResult } from '@/shared/engine';
import type { Parameter, Sheet } from '@/shared/schemas/sheet';
import { rowRoleDefinitions, sheetRoles, standardHeadline, type RowRole } from '@/shared/templates';
import { axisTitle, chartNumber, lineColor } from '@/components/sizing/analyses/chart-text';
import { useChunkedSweep, type ChunkedSweepState } from './chunked-sweep';

export type SheetSizingProps = {
  snapshot: SheetSnapshot;
  /** Whether the person may set inputs on this sheet: only then is "Apply to the sheet" offered. */
  canApply: boolean;
  /** Sets an input row from text in the row's unit (the sheet screen saves it). */
  onApply: (key: string, text: string) => void;
};

/** An input a person can size: the role, its row, and the range offered at first (text in the row's unit, or empty). */
interface InputChoice {
  readonly role: RowRole;
  readonly parameter: Parameter;
  readonly label: string;
  readonly from: string;
  readonly to: string;
}

/** Sweeps show this many rows in their table, evenly spread over the points. */
const tableRows = 11;
const defaultPoints = '400';
const maxPoints = 100_000;

function parameterOf(sheet: Sheet, key: string | undefined): Parameter | undefined {
  return key === undefined ? undefined : sheet.parameters.find((parameter) => parameter.key === key);
}

/** The inputs to offer: the templates' sizing inputs first (with their ranges), then the other inputs that play a role. */
function inputChoices(sheet: Sheet): InputChoice[] {
  const sized = sizingChoices(sheet).flatMap((choice) => {
    const parameter = parameterOf(sheet, choice.key);
    return parameter === undefined ? [] : [{ role: choice.role, parameter, label: choice.label, from: choice.from, to: choice.to }];
  });
  const roles = sheetRoles(sheet);
  const others = (Object.keys(roles) as RowRole[]).flatMap((role) => {
    const parameter = parameterOf(sheet, roles[role]);
    const isInput = parameter?.value !== undefined && parameter.protected !== true;
    if (parameter === undefined || !isInput || sized.some((choice) => choice.role === role)) return [];
    return [{ role, parameter, label: rowRoleDefinitions[role].label, from: '', to: '' }];
  });
  return [...sized, ...others];
}

/** The figures a sweep can chart or a target can name: the headline roles the sheet has, other than the input. */
function outputChoices(sheet: Sheet, input: RowRole | undefined): RowRole[] {
  const roles = sheetRoles(sheet);
  return standardHeadline.filter((role) => role !== input && roles[role] !== undefined);
}

type Range = { ok: true; from: number; to: number; steps: number } | { ok: false; problems: string[] };

/** The typed range and points of a run, converted to the input row's unit, or what is wrong with each. */
function readRange(parameter: Parameter, fromText: string, toText: string, pointsText: string): Range {
  const problems: string[] = [];
  const from = valueInRowUnit(parameter, fromText.trim() === '' ? Number.NaN : fromText);
  const to = valueInRowUnit(parameter, toText.trim() === '' ? Number.NaN : toText);
  if (!from.ok) problems.push(`From: ${from.error.message}`);
  if (!to.ok) problems.push(`To: ${to.error.message}`);
  const steps = Number(pointsText);
  if (!Number.isInteger(steps) || steps < 2 || steps > maxPoints)
    problems.push(`Points: a whole number from 2 to ${maxPoints}, got "${pointsText}"`);
  if (from.ok && to.ok && from.value === to.value) problems.push('From and To must differ');
  return problems.length > 0 || !from.ok || !to.ok ? { ok: false, problems } : { ok: true, from: from.value, to: to.value, steps };
}

/** Several outputs at once: a switch for each. */
function OutputPicker({
  choices,
  chosen,
  onToggle,
}: {
  choices: readonly RowRole[];
  chosen: readonly RowRole[];
  onToggle: (role: RowRole) => void;
}) {
  return (
    <View role="group" aria-label="Outputs to chart" style={styles.field} testID="sizing-outputs">
      <AppText variant="label">Outputs to chart</AppText>
      <View style={styles.outputs}>
        {choices.map((role) => (
          <View key={role} style={styles.output}>
            <Toggle label={rowRoleDefinitions[role].label} value={chosen.includes(role)} onChange={() => onToggle(role)} />
            <AppText>{rowRoleDefinitions[role].label}</AppText>
          </View>
        ))}
      </View>
    </View>
  );
}

type ApplyProps = { canApply: boolean; onApply: (key: string, text: string) => void };

function ApplyButton({
  parameter,
  value,
  label,
  canApply,
  onApply,
  testID,
}: ApplyProps & { parameter: Parameter; value: number; label: string; testID: string }) {
  if (!canApply) return null;
  const shown = formatQuantity(value, parameter.unit);
  return (
    <Button
      label={label}
      aria-label={`Apply ${parameter.label} = ${shown} to the sheet`}
      tone="secondary"
      onPress={() => onApply(parameter.key, editText(value))}
      testID={testID}
    />
  );
}

/** The sweep's outputs as one chart each (their units differ) and a table of evenly spread points. */
function SweepResult({ result, parameter, ...apply }: ApplyProps & { result: RoleSweepResult; parameter: Parameter }) {
  const count = result.input.values.length;
  const shown = Math.min(tableRows, count);
  const picks = Array.from({ length: shown }, (_, i) => Math.round((i * (count - 1)) / Math.max(shown - 1, 1)));
  return (
    <View style={styles.result} testID="sizing-sweep-result">
      {result.outputs.map((output, k) => (
        <LineChart
          key={output.role}
          title={`${output.label} versus ${result.input.label.toLowerCase()}`}
          x={result.input.values}
          series={[{ label: output.label, color: lineColor(k + 2), values: output.values }]}
          xLabel={axisTitle(result.input.label, result.input.unit)}
          yLabel={axisTitle(output.label, output.unit)}
          includeZero={false}
          formatValue={chartNumber}
          testID={`sizing-chart-${output.role}`}
        />
      ))}
      {result.invalidPoints > 0 ? (
        <AppText variant="error">{result.invalidPoints} points have no finite value and are left out of the charts.</AppText>
      ) : null}
      <View style={styles.table} testID="sizing-table">
        <View style={styles.tableRow}>
          {[result.input, ...result.outputs].map((series) => (
            <AppText key={series.role} variant="label" style={styles.cell}>
              {axisTitle(series.label, series.unit)}
            </AppText>
          ))}
          {apply.canApply ? <View style={styles.applyCell} /> : null}
        </View>
        {picks.map((point) => (
          <View key={point} style={styles.tableRow} testID={`sizing-table-row-${point}`}>
            {[result.input, ...result.outputs].map((series) => (
              <AppText key={series.role} variant="mono" style={[styles.cell, styles.number]}>
                {formatNumber(series.values[point] ?? Number.NaN)}
              </AppText>
            ))}
            {apply.canApply ? (
              <View style={styles.applyCell}>
                <ApplyButton
                  parameter={parameter}
                  value={result.input.values[point] ?? Number.NaN}
                  label="Apply"
                  testID={`sizing-apply-${point}`}
                  {...apply}
                />
              </View>
            ) : null}
          </View>
        ))}
      </View>
      {count > picks.length ? (
        <AppText variant="muted">
          The table shows {picks.length} of the {count} points, evenly spread.
        </AppText>
      ) : null}
    </View>
  );
}

/** A solved target: the input value that reaches it, the curve over the range with the target and the answer marked. */
function TargetResult({
  solved,
  curve,
  parameter,
  ...apply
}: ApplyProps & { solved: TargetSolveResult; curve: RoleSweepResult | undefined; parameter: Parameter }) {
  if (solved.status === 'no_solution') return <AnalysisProblems problems={[solved.message]} testID="sizing-target-none" />;
  const output = curve?.outputs[0];
  return (
    <View style={styles.result} testID="sizing-target-result">
      <AppText variant="mono" style={styles.answer} testID="sizing-target-answer">
        {parameter.label} = {formatQuantity(solved.input.value, solved.input.unit)} gives {output?.label ?? solved.output.key} ={' '}
        {formatQuantity(solved.output.value, solved.output.unit)}
      </AppText>
      {curve !== undefined && output !== undefined ? (
        <LineChart
          title={`${output.label} versus ${curve.input.label.toLowerCase()}, with the target`}
          x={curve.input.values}
          series={[{ label: output.label, color: colors.film, values: output.values }]}
          xLabel={axisTitle(curve.input.label, curve.input.unit)}
          yLabel={axisTitle(output.label, output.unit)}
          marker={{ x: solved.input.value, label: `Solution ${formatQuantity(solved.input.value, solved.input.unit)}` }}
          reference={{ y: solved.output.value, label: `Target ${formatQuantity(solved.output.value, solved.output.unit)}` }}
          includeZero={false}
          formatValue={chartNumber}
          testID="sizing-target-chart"
        />
      ) : null}
      <ApplyButton
        parameter={parameter}
        value={solved.input.value}
        label={`Apply ${formatQuantity(solved.input.value, solved.input.unit)} to the sheet`}
        testID="sizing-apply-solution"
        {...apply}
      />
    </View>
  );
}

type TargetState =
  | { readonly status: 'idle' }
  | { readonly status: 'running' }
  | { readonly status: 'done'; readonly solved: TargetSolveResult; readonly curve: RoleSweepResult | undefined }
  | { readonly status: 'failed'; readonly problems: readonly string[] };

type Mode = 'sweep' | 'target';

/**
 * Sweeps and sizing to a target on the sheet as it stands: choose an input (the template's sizing inputs
 * first) and a range, then chart outputs across it, or give a target for an output and solve for the
 * input. Long sweeps run in chunks with a progress bar; results come as charts and a table, and those
 * who may edit can apply a value to the sheet.
 */
export function SheetSizing({ snapshot, canApply, onApply }: SheetSizingProps) {
  const { sheet } = snapshot;
  const inputs = useMemo(() => inputChoices(sheet), [sheet]);
  const [mode, setMode] = useState<Mode>('sweep');
  const [inputRole, setInputRole] = useState<RowRole | undefined>(inputs[0]?.role);
  const input = inputs.find((choice) => choice.role === inputRole) ?? inputs[0];
  const outputs = useMemo(() => outputChoices(sheet, input?.role), [sheet, input?.role]);
  const [fromText, setFromText] = useState(input?.from ?? '');
  const [toText, setToText] = useState(input?.to ?? '');
  const [pointsText, setPointsText] = useState(defaultPoints);
  const [chosenOutputs, setChosenOutputs] = useState<RowRole[]>(() => {
    const preferred = sizingTargets(sheet).find((role) => outputs.includes(role));
    return preferred === undefined ? outputs.slice(0, 1) : [preferred];
  });
  const [targetRole, setTargetRole] = useState<RowRole | undefined>(chosenOutputs[0]);
  const [targetText, setTargetText] = useState('');
  const [problems, setProblems] = useState<string[]>([]);
  // The sheet the latest run used: a result from an older sheet says so.
  const [ranOn, setRanOn] = useState<Sheet | undefined>(undefined);
  const sweep = useChunkedSweep();
  const [target, setTarget] = useState<TargetState>({ status: 'idle' });

  if (input === undefined) {
    return (
      <Card testID="sheet-sizing">
        <AppText variant="heading">Sweeps and sizing</AppText>
        <AppText variant="muted">This sheet has no input with a sizing role, so there is nothing to sweep or solve for.</AppText>
      </Card>
    );
  }

  const chooseInput = (role: RowRole) => {
    const choice = inputs.find((candidate) => candidate.role === role);
    setInputRole(role);
    setFromText(choice?.from ?? '');
    setToText(choice?.to ?? '');
    setChosenOutputs((current) => current.filter((output) => output !== role));
    if (targetRole === role) setTargetRole(undefined);
    sweep.cancel();
    setTarget({ status: 'idle' });
  };
  const toggleOutput = (role: RowRole) =>
    setChosenOutputs((current) => (current.includes(role) ? current.filter((output) => output !== role) : [...current, role]));

  const runSweep = () => {
    const range = readRange(input.parameter, fromText, toText, pointsText);
    const found = range.ok ? [] : range.problems;
    if (chosenOutputs.length === 0) found.push('Choose at least one output to chart');
    setProblems(found);
    if (!range.ok || found.length > 0) return;
    setRanOn(sheet);
    sweep.run({ sheet, input: input.role, outputs: chosenOutputs, from: range.from, to: range.to, steps: range.steps });
  };

  const runTarget = () => {
    const range = readRange(input.parameter, fromText, toText, '2');
    const found = range.ok ? [] : range.problems;
    if (targetRole === undefined) found.push('Choose the output to reach');
    if (targetText.trim() === '') found.push('Target: type the value to reach');
    setProblems(found);
    if (!range.ok || targetRole === undefined || found.length > 0) return;
    setRanOn(sheet);
    setTarget({ status: 'running' });
    // Yield first, so the busy state shows before the search holds the thread.
    setTimeout(() => {
      const solved = sizeToTarget(sheet, {
        input: input.role,
        output: targetRole,
        target: targetText.trim(),
        from: range.from,
        to: range.to,
      });
      if (!solved.ok) {
        setTarget({ status: 'failed', problems: solved.errors.map((error) => error.message) });
        return;
      }
      const curve = roleSweep(sheet, { input: input.role, outputs: [targetRole], from: range.from, to: range.to, steps: 200 });
      setTarget({ status: 'done', solved: solved.result, curve: curve.ok ? curve.result : undefined });
    }, 0);
  };

  const targetRow = parameterOf(sheet, targetRole === undefined ? undefined : sheetRoles(sheet)[targetRole]);
  const unitHint = formatUnit(input.parameter.unit);
  return (
    <Card testID="sheet-sizing">
      <AppText variant="heading">Sweeps and sizing</AppText>
      <AppText variant="muted">On the sheet as it stands now. Nothing changes on the sheet until you apply a value.</AppText>
      <ChoiceChips
        label="What to do"
        choices={[
          { value: 'sweep', label: 'Sweep an input' },
          { value: 'target', label: 'Size to a target' },
        ]}
        value={mode}
        onChange={(next: Mode) => {
          setMode(next);
          setProblems([]);
        }}
        testID="sizing-mode"
      />
      <ChoiceChips
        label={mode === 'sweep' ? 'Input to sweep' : 'Solve for'}
        choices={inputs.map((choice) => ({ value: choice.role, label: choice.label }))}
        value={input.role}
        onChange={chooseInput}
        testID="sizing-input"
      />
      <View style={styles.range}>
        {(
          [
            ['From', fromText, setFromText, 'sizing-from'],
            ['To', toText, setToText, 'sizing-to'],
          ] as const
        ).map(([name, text, setText, testID]) => (
          <View key={name} style={styles.rangeField}>
            <TextField
              label={unitHint ? `${name} (${unitHint}, or with a unit)` : name}
              value={text}
              onChangeText={setText}
              autoCapitalize="none"
              testID={testID}
            />
          </View>
        ))}
        {mode === 'sweep' ? (
          <View style={styles.rangeField}>
            <TextField label="Points" value={pointsText} onChangeText={setPointsText} inputMode="numeric" testID="sizing-points" />
          </View>
        ) : null}
      </View>
      {mode === 'sweep' ? (
        <>
          <OutputPicker choices={outputs} chosen={chosenOutputs} onToggle={toggleOutput} />
          <Button
            label="Run the sweep"
            onPress={runSweep}
            busy={sweep.state.status === 'running'}
            style={styles.start}
            testID="sizing-run"
          />
        </>
      ) : (
        <>
          <ChoiceChips
            label="Output to reach"
            choices={outputs.map((role) => ({ value: role, label: rowRoleDefinitions[role].label }))}
            value={targetRole ?? null}
            onChange={setTargetRole}
            testID="sizing-target-output"
          />
          <TextField
            label={`Target${targetRow !== undefined && formatUnit(targetRow.unit) !== '' ? ` (${formatUnit(targetRow.unit)}, or with a unit)` : ''}`}
            value={targetText}
            onChangeText={setTargetText}
            autoCapitalize="none"
            testID="sizing-target"
          />
          <Button
            label={`Solve for ${input.label.toLowerCase()}`}
            onPress={runTarget}
            busy={target.status === 'running'}
            style={styles.start}
            testID="sizing-solve"
          />
        </>
      )}
      {problems.length > 0 ? <AnalysisProblems problems={problems} testID="sizing-problems" /> : null}
      {ranOn !== undefined && ranOn !== sheet ? (
        <AppText variant="error" testID="sizing-stale">
          The sheet has changed since this run: run it again for figures from the sheet as it is now.
        </AppText>
      ) : null}
      {mode === 'sweep' ? (
        <SweepOutcome state={sweep.state} onCancel={sweep.cancel} parameter={input.parameter} canApply={canApply} onApply={onApply} />
      ) : target.status === 'done' ? (
        <TargetResult solved={target.solved} curve={target.curve} parameter={input.parameter} canApply={canApply} onApply={onApply} />
      ) : target.status === 'failed' ? (
        <AnalysisProblems problems={target.problems} testID="sizing-target-problems" />
      ) : null}
      <SizingCaution testID="sheet-sizing-caution" />
    </Card>
  );
}

function SweepOutcome({
  state,
  onCancel,
  parameter,
  ...apply
}: ApplyProps & { state: ChunkedSweepState; onCancel: () => void; parameter: Parameter }) {
  if (state.status === 'running') {
    return (
      <ProgressBar
        label="Sweep progress"
        done={state.done}
        total={state.total}
        counting="points"
        onCancel={onCancel}
        testID="sizing-progress"
        cancelTestID="sizing-cancel"
      />
    );
  }
  if (state.status === 'failed') return <AnalysisProblems problems={state.problems} testID="sizing-sweep-problems" />;
  if (state.status === 'done') return <SweepResult result={state.result} parameter={parameter} {...apply} />;
  return null;
}

const styles = StyleSheet.create({
  field: { gap: space.xs },
  outputs: { flexDirection: 'row', flexWrap: 'wrap', columnGap: space.lg },
  output: { flexDirection: 'row', alignItems: 'center', gap: space.xs, minWidth: 220 },
  range: { flexDirection: 'row', flexWrap: 'wrap', gap: space.md },
  rangeField: { flexGrow: 1, flexBasis: 140 },
  start: { alignSelf: 'flex-start' },
  result: { gap: space.md },
  answer: { color: colors.ink, fontSize: 15 },
  table: { borderWidth: 1, borderColor: colors.rule, borderRadius: radii.md, overflow: 'hidden' },
  tableRow: {
    flexDirection: 'row',
    alignItems: 'center',
    gap: space.sm,
    paddingHorizontal: space.md,
    paddingVertical: space.xs,
    borderBottomWidth: 1,
    borderBottomColor: colors.recess,
  },
  cell: { flex: 1, minWidth: 80 },
  number: { textAlign: 'right', color: colors.ink, fontVariant: ['tabular-nums'] },
  applyCell: { width: 88, alignItems: 'flex-end' },
});
