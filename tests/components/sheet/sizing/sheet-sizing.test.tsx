import { fireEvent, screen, within } from '@testing-library/dom';
import { act, useState } from 'react';
import { chunkBounds } from '@/components/sheet/sizing/chunked-sweep';
import { SheetSizing } from '@/components/sheet/sizing/sheet-sizing';
import type { SheetSnapshot } from '@/components/sizing/use-sheet-session';
import { evaluateSheet } from '@/shared/engine';
import { setupQueryClient } from '../../helpers/api';
import { renderDom } from '../../helpers/render';
import { snapshotOf, templateWith } from '../../helpers/template-snapshot';

function renderSizing(canApply: boolean) {
  const onApply = jest.fn();
  const { wrapper: Wrapper } = setupQueryClient();
  let setSnapshot: (snapshot: SheetSnapshot) => void = () => undefined;
  // Holds the snapshot in state, as the sheet screen does, so a test can hand it a newer sheet.
  function Harness() {
    const [snapshot, set] = useState(() => snapshotOf(templateWith()));
    setSnapshot = set;
    return <SheetSizing snapshot={snapshot} canApply={canApply} onApply={onApply} />;
  }
  renderDom(
    <Wrapper>
      <Harness />
    </Wrapper>,
  );
  return { onApply, showSheet: (snapshot: SheetSnapshot) => act(() => setSnapshot(snapshot)) };
}

function type(testID: string, text: string) {
  fireEvent.change(screen.getByTestId(testID), { target: { value: text } });
}

function solveForSide(target: string) {
  fireEvent.click(screen.getByRole('radio', { name: 'Size to a target' }));
  fireEvent.click(screen.getByRole('radio', { name: 'Sail side' }));
  type('sizing-target', target);
  fireEvent.click(screen.getByTestId('sizing-solve'));
}

describe('SheetSizing', () => {
  it('offers the template’s sizing inputs first, with their ranges', () => {
    renderSizing(false);
    const inputs = within(screen.getByTestId('sizing-input')).getAllByRole('radio');
    expect(inputs.slice(0, 2).map((radio) => radio.getAttribute('aria-label'))).toEqual(['Sail side', 'Film thickness']);
    expect((screen.getByTestId('sizing-from') as HTMLInputElement).value).toBe('5 m');
    expect((screen.getByTestId('sizing-to') as HTMLInputElement).value).toBe('200 m');
  });

  it('sweeps an input in chunks with progress, then shows each output as a chart and a table', async () => {
    renderSizing(false);
    type('sizing-points', '5000');
    fireEvent.click(screen.getByRole('switch', { name: 'Lightness number' }));
    fireEvent.click(screen.getByTestId('sizing-run'));
    expect(within(screen.getByTestId('sizing-progress')).getByRole('progressbar')).toBeTruthy();

    const result = await screen.findByTestId('sizing-sweep-result', undefined, { timeout: 10_000 });
    const chart = within(result).getByTestId('sizing-chart-characteristic_acceleration');
    expect(within(chart).getByTestId('chart-x-label').textContent).toBe('Sail side (m)');
    expect(within(chart).getByTestId('chart-y-label').textContent).toBe('Characteristic acceleration (mm/s²)');
    expect(within(result).getByTestId('sizing-chart-lightness_number')).toBeTruthy();
    expect(within(result).getByText('The table shows 11 of the 5000 points, evenly spread.')).toBeTruthy();
    expect(screen.getByTestId('sizing-table-row-0').textContent).toMatch(/^5/);
    expect(screen.getByTestId('sizing-table-row-4999').textContent).toMatch(/^200/);
    // Those who may not edit the sheet get no way to apply a value.
    expect(screen.queryByTestId('sizing-apply-0')).toBeNull();
  });

  it('applies a swept point to the sheet for those who may edit', async () => {
    const { onApply } = renderSizing(true);
    type('sizing-points', '3');
    fireEvent.click(screen.getByTestId('sizing-run'));
    fireEvent.click(await screen.findByTestId('sizing-apply-1'));
    // Three points from 5 m to 200 m: the middle one is halfway.
    expect(onApply).toHaveBeenCalledWith('sail_side', '102.5');
  });

  it('says what is wrong with a range before running', () => {
    renderSizing(false);
    type('sizing-from', '5 kg');
    type('sizing-points', '1');
    fireEvent.click(screen.getByTestId('sizing-run'));
    const problems = screen.getByTestId('sizing-problems');
    expect(within(problems).getByText(/^From: /)).toBeTruthy();
    expect(within(problems).getByText('Points: a whole number from 2 to 100000, got "1"')).toBeTruthy();
    expect(screen.queryByTestId('sizing-progress')).toBeNull();
  });

  it('solves for the sail side that reaches a characteristic acceleration and applies it through onApply', async () => {
    const { onApply } = renderSizing(true);
    solveForSide('0.1');
    const answer = await screen.findByTestId('sizing-target-answer');
    expect(answer.textContent).toMatch(/^Sail side length = [\d.]+ m gives Characteristic acceleration = 0\.1 mm\/s²$/);
    const chart = screen.getByTestId('sizing-target-chart');
    expect(within(chart).getByTestId('chart-x-label').textContent).toBe('Sail side (m)');

    fireEvent.click(screen.getByTestId('sizing-apply-solution'));
    expect(onApply).toHaveBeenCalledTimes(1);
    const [key, text] = onApply.mock.calls[0] as [string, string];
    expect(key).toBe('sail_side');
    // The applied side, set on the sheet, gives the target back.
    const applied = evaluateSheet(templateWith({ sail_side: Number(text) }));
    expect(applied.values.characteristic_acceleration?.value).toBeCloseTo(0.1, 6);
  });

  it('offers no apply to people who may not edit the sheet', async () => {
    const { onApply } = renderSizing(false);
    solveForSide('0.1 mm/s^2');
    await screen.findByTestId('sizing-target-answer');
    expect(screen.queryByTestId('sizing-apply-solution')).toBeNull();
    expect(onApply).not.toHaveBeenCalled();
  });

  it('says when the sheet has changed since the result was computed', async () => {
    const { showSheet } = renderSizing(true);
    solveForSide('0.1');
    await screen.findByTestId('sizing-target-answer');
    expect(screen.queryByTestId('sizing-stale')).toBeNull();
    showSheet(snapshotOf(templateWith({ film_thickness: 5 })));
    expect(screen.getByTestId('sizing-stale')).toBeTruthy();
  });

  it('says so when the target cannot be reached in the range', async () => {
    renderSizing(true);
    solveForSide('100');
    expect((await screen.findByTestId('sizing-target-none')).textContent).toMatch(/never reaches/);
  });
});

describe('chunkBounds', () => {
  it('covers every point once, in chunks of at least two points', () => {
    const bounds = chunkBounds(1001, 400);
    expect(bounds).toEqual([
      [0, 333],
      [334, 666],
      [667, 1000],
    ]);
    expect(chunkBounds(3, 400)).toEqual([[0, 2]]);
  });
});
