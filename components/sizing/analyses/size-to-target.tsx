import { useMemo, useState } from 'react';
import { StyleSheet, View } from 'react-native';
import { Button } from '@/components/ui/button';
import { ChoiceChips } from '@/components/ui/choice-chips';
import { TextField } from '@/components/ui/text-field';
import { AppText } from '@/components/ui/text';
import { colors, fonts, space } from '@/components/ui/theme';
import { sizeToTarget, sizingChoices, sizingTargets } from '@/shared/analyses';
import type { AnalysisResult, TargetSolveResult } from '@/shared/engine';
import type { Sheet } from '@/shared/schemas/sheet';
import { rowRoleDefinitions, sheetRoles, type RowRole } from '@/shared/templates';
import { editText, formatQuantity, formatUnit } from '@/shared/format/quantity';
import { AnalysisCard, AnalysisProblems } from './analysis-card';

export type TargetSolveAnalysisProps = {
  sheet: Sheet;
  /** Sets the solved input on the live sheet (an undoable edit). */
  onApply: (key: string, text: string) => void;
};

function unitOf(sheet: Sheet, role: RowRole): string {
  const key = sheetRoles(sheet)[role];
  return formatUnit(sheet.parameters.find((parameter) => parameter.key === key)?.unit ?? '');
}

function withUnit(label: string, unit: string): string {
  return unit === '' ? label : `${label} (${unit})`;
}

/** "Find <input> so that <output> = <target>" on the current sheet, solved when asked. */
export function TargetSolveAnalysis({ sheet, onApply }: TargetSolveAnalysisProps) {
  const inputs = useMemo(() => sizingChoices(sheet).map((choice) => ({ ...choice, value: choice.role })), [sheet]);
  const outputs = useMemo(() => sizingTargets(sheet).map((role) => ({ value: role, label: rowRoleDefinitions[role].label })), [sheet]);
  const [chosenInput, setInput] = useState<RowRole | undefined>(inputs[0]?.role);
  const [chosenOutput, setOutput] = useState<RowRole | undefined>(outputs[0]?.value);
  const [range, setRange] = useState({ from: inputs[0]?.from ?? '', to: inputs[0]?.to ?? '' });
  const [target, setTarget] = useState('0.5');
  // An answer belongs to the sheet it was solved on; after an edit it is no longer shown.
  const [answer, setAnswer] = useState<{ sheet: Sheet; result: AnalysisResult<TargetSolveResult> } | undefined>(undefined);

  const chooseInput = (role: RowRole) => {
    const choice = inputs.find((candidate) => candidate.role === role);
    setInput(role);
    if (choice !== undefined) setRange({ from: choice.from, to: choice.to });
    setAnswer(undefined);
  };
  const card = {
    title: 'Size to a target',
    summary: 'Find the input value at which an output reaches a target, everything else as on the sheet.',
  };
  const input = chosenInput;
  const output = chosenOutput;
  if (input === undefined || output === undefined) {
    return (
      <AnalysisCard {...card} testID="analysis-size-to-target">
        <AnalysisProblems
          problems={['This sheet has no row its template offers to size, or no figure to size it for.']}
          testID="size-to-target-result"
        />
      </AnalysisCard>
    );
  }
  const run = () => setAnswer({ sheet, result: sizeToTarget(sheet, { input, output, from: range.from, to: range.to, target }) });
  const inputUnit = unitOf(sheet, input);
  const outputUnit = unitOf(sheet, output);

  return (
    <AnalysisCard {...card} testID="analysis-size-to-target">
      <ChoiceChips label="Find" choices={inputs} value={input} onChange={chooseInput} testID="size-to-target-input" />
      <ChoiceChips
        label="So that"
        choices={outputs}
        value={output}
        onChange={(key) => {
          setOutput(key);
          setAnswer(undefined);
        }}
        testID="size-to-target-output"
      />
      <View style={styles.fields}>
        <View style={styles.field}>
          <TextField
            label={withUnit('Equals', outputUnit)}
            value={target}
            onChangeText={setTarget}
            onSubmitEditing={run}
            autoCapitalize="none"
            testID="size-to-target-target"
          />
        </View>
        <View style={styles.field}>
          <TextField
            label={withUnit('Search from', inputUnit)}
            value={range.from}
            onChangeText={(from) => setRange({ ...range, from })}
            testID="size-to-target-from"
          />
        </View>
        <View style={styles.field}>
          <TextField
            label={withUnit('to', inputUnit)}
            value={range.to}
            onChangeText={(to) => setRange({ ...range, to })}
            testID="size-to-target-to"
          />
        </View>
      </View>
      <Button label="Solve" onPress={run} testID="size-to-target-run" style={styles.run} />
      {answer?.sheet === sheet ? <TargetSolveAnswer answer={answer.result} onApply={onApply} /> : null}
    </AnalysisCard>
  );
}

function TargetSolveAnswer({
  answer,
  onApply,
}: {
  answer: AnalysisResult<TargetSolveResult>;
  onApply: TargetSolveAnalysisProps['onApply'];
}) {
  if (!answer.ok) return <AnalysisProblems problems={answer.errors.map((error) => error.message)} testID="size-to-target-result" />;
  const { result } = answer;
  if (result.status === 'no_solution') {
    return (
      <AppText variant="error" role="alert" testID="size-to-target-result">
        {result.message}
      </AppText>
    );
  }
  return (
    <View style={styles.answer} aria-live="polite">
      <View testID="size-to-target-result">
        <AppText style={styles.solved}>
          {result.input.key} = {formatQuantity(result.input.value, result.input.unit, 6)}
        </AppText>
        <AppText variant="mono">
          gives {result.output.key} = {formatQuantity(result.output.value, result.output.unit, 6)}
        </AppText>
      </View>
      <Button
        label={`Set ${result.input.key} on the sheet`}
        tone="secondary"
        onPress={() => onApply(result.input.key, editText(result.input.value))}
        testID="size-to-target-apply"
      />
    </View>
  );
}

const styles = StyleSheet.create({
  fields: { flexDirection: 'row', flexWrap: 'wrap', gap: space.md },
  field: { flexGrow: 1, flexBasis: 140 },
  run: { alignSelf: 'flex-start' },
  answer: { gap: space.sm },
  solved: { fontFamily: fonts.monoMedium, fontSize: 18, lineHeight: 24, color: colors.ink },
});
