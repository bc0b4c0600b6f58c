import { act, memo } from 'react';
import { useFollowingSheetSession, useLiveRow, type FollowingSheetHandle, type LiveRowSource } from '@/components/sizing/use-sheet-session';
import type { Sheet } from '@/shared/schemas/sheet';
import { renderDom } from '../helpers/render';

const sheet: Sheet = {
  name: 'Two chains',
  parameters: [
    { key: 'side', label: 'Side', subsystem: 's', unit: 'm', value: 10 },
    { key: 'area', label: 'Area', subsystem: 's', unit: 'm^2', formula: '=side^2' },
    { key: 'bus', label: 'Bus', subsystem: 's', unit: 'kg', value: 3 },
    { key: 'bus_twice', label: 'Bus twice', subsystem: 's', unit: 'kg', formula: '=2 * bus' },
  ],
};
const keys = sheet.parameters.map((parameter) => parameter.key);

/** Renders each row as its own subscriber and counts its renders; returns the live sheet and the counts. */
function renderRows() {
  const renders = new Map<string, number>();
  const live: { handle?: FollowingSheetHandle } = {};
  const Row = memo(function Row({ rows, rowKey }: { rows: LiveRowSource; rowKey: string }) {
    const row = useLiveRow(rows, rowKey);
    renders.set(rowKey, (renders.get(rowKey) ?? 0) + 1);
    const text = row.rejection !== undefined ? 'refused' : (row.error?.code ?? String(row.value?.value));
    return <span data-testid={`row-${rowKey}`}>{text}</span>;
  });
  function Rows() {
    const handle = useFollowingSheetSession(sheet);
    live.handle = handle;
    if (handle.state.status !== 'ready') return null;
    return keys.map((key) => <Row key={key} rows={handle.rows} rowKey={key} />);
  }
  const container = renderDom(<Rows />);
  const text = (key: string) => container.querySelector(`[data-testid="row-${key}"]`)?.textContent;
  const handle = () => {
    if (live.handle === undefined) throw new Error('not rendered');
    return live.handle;
  };
  const counts = () => Object.fromEntries(keys.map((key) => [key, renders.get(key) ?? 0]));
  return { handle, text, counts };
}

describe('useLiveRow', () => {
  it('re-renders only the rows an edit changed', () => {
    const { handle, text, counts } = renderRows();
    expect(text('area')).toBe('100');
    const before = counts();
    // Rows out of the edit's reach are not even asked: a keystroke costs the rows it changed, not the sheet.
    const told = { area: jest.fn(), bus: jest.fn() };
    const unsubscribe = [handle().rows.subscribeRow('area', told.area), handle().rows.subscribeRow('bus', told.bus)];
    act(() => {
      handle().setText('side', '20');
    });
    expect(text('area')).toBe('400');
    expect(counts()).toEqual({ ...before, side: (before.side ?? 0) + 1, area: (before.area ?? 0) + 1 });
    expect(told.area).toHaveBeenCalledTimes(1);
    expect(told.bus).not.toHaveBeenCalled();
    unsubscribe.forEach((stop) => stop());
  });

  it('re-renders a row whose text is refused, and its readers when an error reaches them', () => {
    const { handle, text, counts } = renderRows();
    const before = counts();
    act(() => {
      handle().setText('bus', 'three');
    });
    expect(text('bus')).toBe('refused');
    expect(counts()).toEqual({ ...before, bus: (before.bus ?? 0) + 1 });
    act(() => {
      handle().setText('bus', '=bus_twice');
    });
    expect(text('bus')).toBe('cycle');
    expect(text('bus_twice')).toBe('cycle');
    expect(text('area')).toBe('100');
    expect(counts().side).toBe(before.side);
  });

  it('brings every row to a rebuilt sheet, and empties the rows it no longer has', () => {
    const { handle, text } = renderRows();
    const [side, area, bus] = sheet.parameters;
    if (side === undefined || area === undefined || bus === undefined) throw new Error('fixture');
    // Another order and one row fewer: the session is opened again on the new rows.
    act(() => {
      handle().follow({ ...sheet, parameters: [bus, { ...side, value: 3 }, area] }, new Set());
    });
    expect(text('side')).toBe('3');
    expect(text('area')).toBe('9');
    expect(text('bus')).toBe('3');
    expect(text('bus_twice')).toBe('undefined');
  });
});
