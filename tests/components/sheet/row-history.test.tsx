import { fireEvent, screen, waitFor, within } from '@testing-library/dom';
import { act } from 'react';
import { sheetKeys } from '@/components/sheet/queries';
import type { RowHistory, RowHistoryEntry } from '@/shared/schemas/history';
import { craftId, detailFor, renderSheet, requests, revisionId, revisionPath, setWindowWidth } from './sheet-fixtures';

const historyPath = `${revisionPath}/history?key=sail_side`;
const draft = { id: revisionId, kind: 'draft' as const, label: 'Working draft' };
const sailSide = { key: 'sail_side', label: 'Sail side length', subsystem: 'Sail membrane', unit: 'm' };

function entry(id: number, change: Partial<RowHistoryEntry>): RowHistoryEntry {
  return {
    id: `00000000-0000-4000-9000-${String(id).padStart(12, '0')}`,
    at: '2026-11-20T16:30:12.000Z',
    action: 'update',
    key: 'sail_side',
    before: { ...sailSide, value: 40, version: 1 },
    after: { ...sailSide, value: 45, version: 2 },
    by: { id: '5a0c1b2d-3e4f-4a5b-8c6d-7e8f9a0b1c2d', name: 'Amara Osei' },
    revision: draft,
    ...change,
  };
}

const history: RowHistory = {
  changes: [
    entry(2, {}),
    entry(1, {
      at: '2026-10-01T08:05:00.000Z',
      action: 'rename',
      before: { ...sailSide, key: 'side', value: 40, version: 1 },
      after: { ...sailSide, value: 40, version: 1 },
      by: null,
      revision: { id: '1e2d3c4b-5a69-4788-9a0b-1c2d3e4f5a6b', kind: 'draft', label: 'Earlier draft' },
    }),
  ],
  limit: 200,
  truncated: false,
};

const reader = { editableSubsystemIds: [], manageRows: false, manageSubsystems: false };

describe('a row’s history in its sheet', () => {
  beforeEach(() => setWindowWidth(1280));

  it('offers a reader a History button and lists who changed what, when, from what to what, and where', async () => {
    renderSheet({ role: 'viewer', detail: detailFor(reader), routes: { [`GET ${historyPath}`]: { status: 200, body: history } } });
    const open = await screen.findByTestId('sheet-open-sail_side');
    expect(open.textContent).toBe('History');
    fireEvent.click(open);
    const entries = await within(await screen.findByTestId('row-history')).findAllByTestId('row-history-entry');
    expect(entries.map((element) => element.textContent)).toEqual([
      '40 m → 45 mAmara Osei · 2026-11-20 16:30 UTC',
      'Renamed: side → sail_sideA former member · 2026-10-01 08:05 UTC · in Earlier draft',
    ]);
    // A reader gets no edit controls in the sheet.
    expect(screen.queryByTestId('row-unit-picker')).toBeNull();
  });

  it('shows an editor the history under the edit controls and reads it again when the craft changes', async () => {
    const { fetchMock, queryClient } = renderSheet({ routes: { [`GET ${historyPath}`]: { status: 200, body: history } } });
    const open = await screen.findByTestId('sheet-open-sail_side');
    expect(open.textContent).toBe('Edit');
    fireEvent.click(open);
    await screen.findByTestId('row-unit-picker');
    await waitFor(() => expect(screen.getAllByTestId('row-history-entry')).toHaveLength(2));
    expect(requests(fetchMock, 'GET', historyPath)).toHaveLength(1);
    // A live event of the craft invalidates its key: the open history is read again.
    await act(() => queryClient.invalidateQueries({ queryKey: sheetKeys.craft(craftId) }));
    await waitFor(() => expect(requests(fetchMock, 'GET', historyPath)).toHaveLength(2));
  });

  it('says when a row has no changes, and when only the newest are shown', async () => {
    renderSheet({
      routes: {
        [`GET ${historyPath}`]: { status: 200, body: { changes: [], limit: 200, truncated: false } },
        [`GET ${revisionPath}/history?key=boom_count`]: {
          status: 200,
          body: {
            ...history,
            changes: [
              entry(3, {
                key: 'boom_count',
                before: { key: 'boom_count', label: 'Booms', subsystem: 'Booms', unit: '', value: 4, version: 1 },
                after: { key: 'boom_count', label: 'Booms', subsystem: 'Deployer', unit: '', value: 4, version: 2 },
              }),
            ],
            truncated: true,
          },
        },
      },
    });
    fireEvent.click(await screen.findByTestId('sheet-open-sail_side'));
    expect((await within(screen.getByTestId('row-history')).findByText(/No changes recorded/)).textContent).toContain('as it was created');
    fireEvent.click(screen.getByTestId('sheet-row-editor-close'));
    fireEvent.click(await screen.findByTestId('sheet-open-boom_count'));
    const [moved] = await screen.findAllByTestId('row-history-entry');
    expect(moved?.textContent).toContain('Subsystem: Booms → Deployer');
    expect(screen.getByTestId('row-history').textContent).toContain('The 200 newest changes are shown.');
  });

  it('says so when the history cannot be loaded', async () => {
    renderSheet({
      routes: { [`GET ${historyPath}`]: { status: 500, body: { error: { code: 'internal', message: 'The server is down' } } } },
    });
    fireEvent.click(await screen.findByTestId('sheet-open-sail_side'));
    expect((await within(screen.getByTestId('row-history')).findByText(/Could not load the history/)).textContent).toContain(
      'The server is down',
    );
  });
});
