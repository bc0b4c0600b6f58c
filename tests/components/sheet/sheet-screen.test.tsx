import { fireEvent, screen, waitFor } from '@testing-library/dom';
import { act } from 'react';
import { detailFor, renderSheet, revisionPath, requests, setWindowWidth, subsystemId } from './sheet-fixtures';

const patchSailSide = `PATCH ${revisionPath}/parameters/sail_side`;

function input(key: string): HTMLInputElement {
  return screen.getByTestId(`sheet-input-${key}`) as HTMLInputElement;
}

function type(key: string, text: string) {
  fireEvent.change(input(key), { target: { value: text } });
}

function enter(key: string) {
  fireEvent.keyDown(input(key), { key: 'Enter', code: 'Enter', keyCode: 13 });
}

/** Lets React finish its effects (a button just enabled takes its press handler in one). */
const settle = () => act(async () => undefined);

const text = (testID: string) => screen.getByTestId(testID).textContent ?? '';

describe('SheetScreen on a wide screen', () => {
  beforeEach(() => setWindowWidth(1280));

  it('recomputes the outputs in the browser as a person types, before any request resolves', async () => {
    const { fetchMock } = renderSheet({ routes: { [patchSailSide]: 'pending' } });
    await screen.findByTestId('sheet-input-sail_side');
    // Area of a square (geometry): 40 m × 40 m = 1600 m².
    expect(text('sheet-value-sail_area')).toBe('1600 m²');
    type('sail_side', '50');
    // 50 m × 50 m = 2500 m², worked out without a round trip.
    expect(text('sheet-value-sail_area')).toBe('2500 m²');
    expect(requests(fetchMock, 'PATCH', `${revisionPath}/parameters/sail_side`)).toEqual([]);
    enter('sail_side');
    await waitFor(() => expect(requests(fetchMock, 'PATCH', `${revisionPath}/parameters/sail_side`)).toEqual([{ version: 1, value: 50 }]));
    expect(text('sheet-value-sail_area')).toBe('2500 m²');
    expect(text('sheet-status-sail_area')).toBe('ok');
  });

  it('shows a value typed with another unit of the row converted, and a unit of another dimension as refused', async () => {
    renderSheet({ routes: { [patchSailSide]: 'pending' } });
    await screen.findByTestId('sheet-input-sail_side');
    type('sail_side', '0.05 km');
    // 0.05 km = 50 m, so the area is 2500 m².
    expect(text('sheet-value-sail_area')).toBe('2500 m²');
    type('sail_side', '5 kg');
    expect(text('sheet-status-sail_side')).toContain('Not accepted');
    expect(input('sail_side').getAttribute('aria-invalid')).toBe('true');
  });

  it('rolls a refused save back and shows the server’s message beside the row', async () => {
    renderSheet({
      routes: {
        [patchSailSide]: { status: 400, body: { error: { code: 'invalid_value', message: 'sail_side: the booms cannot be that long' } } },
      },
    });
    await screen.findByTestId('sheet-input-sail_side');
    type('sail_side', '50');
    enter('sail_side');
    expect((await screen.findByTestId('sheet-row-message-sail_side')).textContent).toContain('the booms cannot be that long');
    await waitFor(() => expect(text('sheet-value-sail_area')).toBe('1600 m²'));
    expect(input('sail_side').value).toBe('40');
  });

  it('shows a version conflict beside the row, and keeping mine re-sends it at the current version', async () => {
    const { fetchMock, server } = renderSheet();
    await screen.findByTestId('sheet-input-sail_side');
    server.othersSet('sail_side', 45, 'Amara Osei');
    type('sail_side', '50');
    enter('sail_side');
    const panel = await screen.findByTestId('sheet-conflict-sail_side');
    expect(panel.textContent).toContain('Amara Osei');
    expect(panel.textContent).toContain('50 m');
    expect(panel.textContent).toContain('45 m');
    // Theirs is what the sheet now computes with: 45 m × 45 m = 2025 m².
    await waitFor(() => expect(text('sheet-value-sail_area')).toBe('2025 m²'));
    fireEvent.click(screen.getByTestId('conflict-keep-mine'));
    await waitFor(() =>
      expect(requests(fetchMock, 'PATCH', `${revisionPath}/parameters/sail_side`)).toEqual([
        { version: 1, value: 50 },
        { version: 2, value: 50 },
      ]),
    );
    expect(screen.queryByTestId('sheet-conflict-sail_side')).toBeNull();
    await waitFor(() => expect(text('sheet-value-sail_area')).toBe('2500 m²'));
    expect(server.row('sail_side')).toMatchObject({ value: 50, version: 3 });
  });

  it('takes their copy when the person chooses it, sending nothing more', async () => {
    const { fetchMock, server } = renderSheet();
    await screen.findByTestId('sheet-input-sail_side');
    server.othersSet('sail_side', 45, 'Amara Osei');
    type('sail_side', '50');
    enter('sail_side');
    await screen.findByTestId('sheet-conflict-sail_side');
    fireEvent.click(screen.getByTestId('conflict-take-theirs'));
    expect(screen.queryByTestId('sheet-conflict-sail_side')).toBeNull();
    await waitFor(() => expect(text('sheet-value-sail_area')).toBe('2025 m²'));
    expect(input('sail_side').value).toBe('45');
    expect(requests(fetchMock, 'PATCH', `${revisionPath}/parameters/sail_side`)).toHaveLength(1);
  });

  it('keeps a formula the engine cannot read beside the row and does not send it', async () => {
    const { fetchMock } = renderSheet();
    await screen.findByTestId('sheet-input-sail_area');
    type('sail_area', '=sail_side^2 +');
    expect(text('sheet-status-sail_area')).not.toBe('ok');
    enter('sail_area');
    type('sail_area', '=sail_side * 2 m');
    enter('sail_area');
    await settle();
    expect(requests(fetchMock, 'PATCH', `${revisionPath}/parameters/sail_area`)).toEqual([]);
  });

  it('saves a formula typed in place and recomputes from it', async () => {
    const { fetchMock } = renderSheet({ routes: { [`PATCH ${revisionPath}/parameters/sail_area`]: 'pending' } });
    await screen.findByTestId('sheet-input-sail_area');
    type('sail_area', '=sail_side^2 / 2');
    // Half of 40 m × 40 m.
    expect(text('sheet-value-sail_area')).toBe('800 m²');
    enter('sail_area');
    await waitFor(() =>
      expect(requests(fetchMock, 'PATCH', `${revisionPath}/parameters/sail_area`)).toEqual([{ formula: '=sail_side^2 / 2', version: 1 }]),
    );
  });

  it('keeps the summary in view beside the table and shows the mass budget as another view', async () => {
    renderSheet();
    await screen.findByTestId('sheet-input-sail_side');
    expect(screen.getByTestId('sheet-summary')).toBeTruthy();
    expect(screen.getByTestId('sheet-summary-caution').textContent).toContain('Preliminary sizing estimates');
    fireEvent.click(screen.getByRole('radio', { name: 'Mass budget' }));
    expect(await screen.findByTestId('mass-budget-view')).toBeTruthy();
    expect(screen.queryByTestId('sheet-table')).toBeNull();
  });

  it('shows a subsystem owner the other subsystems’ rows read-only, with the reason', async () => {
    const detail = detailFor({ editableSubsystemIds: [], manageRows: false, manageSubsystems: false });
    const booms = detail.subsystems.find((subsystem) => subsystem.name === 'Booms');
    renderSheet({
      role: 'subsystem_owner',
      detail: { ...detail, abilities: { ...detail.abilities, editableSubsystemIds: booms ? [booms.id] : [] } },
    });
    await screen.findByTestId('sheet-input-boom_linear_density');
    expect(screen.queryByTestId('sheet-input-sail_side')).toBeNull();
    // Said once for the group, not under each of its rows.
    expect(text('sheet-group-reason-Sail membrane')).toContain('Sail membrane');
    expect(text('sheet-group-reason-Sail membrane')).toContain('edited by their owner or an engineer');
    expect(screen.queryByTestId('sheet-row-message-sail_side')).toBeNull();
    expect(screen.queryByTestId('sheet-group-reason-Booms')).toBeNull();
    expect(screen.queryByTestId('sheet-row-message-boom_linear_density')).toBeNull();
    expect(screen.queryByTestId('sheet-add-row')).toBeNull();
  });

  it('tells a viewer once why the sheet is read-only and offers no field', async () => {
    renderSheet({ role: 'viewer', detail: detailFor({ editableSubsystemIds: [], manageRows: false, manageSubsystems: false }) });
    expect((await screen.findByTestId('sheet-read-only')).textContent).toContain('Viewers read the sheet');
    expect(screen.queryByTestId('sheet-input-sail_side')).toBeNull();
    expect(screen.getByTestId('sheet-value-sail_area').textContent).toBe('1600 m²');
  });

  it('moves between rows with the arrow keys, and Escape puts the saved value back', async () => {
    const { fetchMock } = renderSheet();
    await screen.findByTestId('sheet-input-boom_count');
    input('boom_count').focus();
    fireEvent.keyDown(input('boom_count'), { key: 'ArrowDown' });
    expect(document.activeElement).toBe(input('boom_linear_density'));
    fireEvent.keyDown(input('boom_linear_density'), { key: 'ArrowUp' });
    expect(document.activeElement).toBe(input('boom_count'));
    type('boom_count', '6');
    fireEvent.keyDown(input('boom_count'), { key: 'Escape' });
    expect(input('boom_count').value).toBe('4');
    expect(requests(fetchMock, 'PATCH', `${revisionPath}/parameters/boom_count`)).toEqual([]);
  });

  it('saves on Enter and goes on to the next row', async () => {
    const { fetchMock } = renderSheet({ routes: { [`PATCH ${revisionPath}/parameters/boom_count`]: 'pending' } });
    await screen.findByTestId('sheet-input-boom_count');
    input('boom_count').focus();
    type('boom_count', '6');
    fireEvent.keyDown(input('boom_count'), { key: 'Enter', code: 'Enter', keyCode: 13 });
    await waitFor(() => expect(requests(fetchMock, 'PATCH', `${revisionPath}/parameters/boom_count`)).toEqual([{ value: 6, version: 1 }]));
    expect(document.activeElement).toBe(input('boom_linear_density'));
  });

  it('folds a subsystem’s rows away and back', async () => {
    renderSheet();
    await screen.findByTestId('sheet-row-boom_count');
    fireEvent.click(screen.getByTestId('sheet-group-Booms'));
    expect(screen.queryByTestId('sheet-row-boom_count')).toBeNull();
    expect(screen.getByTestId('sheet-group-Booms').getAttribute('aria-expanded')).toBe('false');
    expect(screen.getByTestId('sheet-row-sail_side')).toBeTruthy();
    fireEvent.click(screen.getByTestId('sheet-group-Booms'));
    expect(screen.getByTestId('sheet-row-boom_count')).toBeTruthy();
  });

  it('undoes a saved edit by sending the old value at the row’s current version, and redoes it', async () => {
    const { fetchMock, server } = renderSheet();
    await screen.findByTestId('sheet-input-sail_side');
    type('sail_side', '50');
    enter('sail_side');
    expect(screen.getByTestId('sheet-undo').hasAttribute('disabled')).toBe(true);
    await waitFor(() => expect(screen.getByTestId('sheet-undo').hasAttribute('disabled')).toBe(false));
    expect(server.row('sail_side')).toMatchObject({ value: 50, version: 2 });
    await settle();
    fireEvent.click(screen.getByTestId('sheet-undo'));
    await waitFor(() => expect(requests(fetchMock, 'PATCH', `${revisionPath}/parameters/sail_side`)).toHaveLength(2));
    expect(requests(fetchMock, 'PATCH', `${revisionPath}/parameters/sail_side`)[1]).toEqual({ value: 40, version: 2 });
    await waitFor(() => expect(text('sheet-value-sail_area')).toBe('1600 m²'));
    await waitFor(() => expect(screen.getByTestId('sheet-redo').hasAttribute('disabled')).toBe(false));
    await settle();
    fireEvent.click(screen.getByTestId('sheet-redo'));
    await waitFor(() => expect(requests(fetchMock, 'PATCH', `${revisionPath}/parameters/sail_side`)).toHaveLength(3));
    expect(requests(fetchMock, 'PATCH', `${revisionPath}/parameters/sail_side`)[2]).toEqual({ value: 50, version: 3 });
    await waitFor(() => expect(server.row('sail_side')).toMatchObject({ value: 50, version: 4 }));
  });
});

describe('SheetScreen on a phone', () => {
  beforeEach(() => setWindowWidth(390));

  it('lists the rows and opens a row’s edit sheet with its value field', async () => {
    renderSheet({ routes: { [patchSailSide]: 'pending' } });
    const row = await screen.findByTestId('sheet-row-sail_side');
    expect(screen.queryByTestId('sheet-input-sail_side')).toBeNull();
    fireEvent.click(row.querySelector('[role="button"]') as HTMLElement);
    const editor = await screen.findByTestId('sheet-row-editor');
    expect(editor.textContent).toContain('Sail side length');
    type('sail_side', '50');
    expect(text('sheet-value-sail_area')).toBe('2500 m²');
    fireEvent.click(screen.getByTestId('sheet-row-editor-close'));
    await waitFor(() => expect(screen.queryByTestId('sheet-row-editor')).toBeNull());
  });

  it('keeps the sticky summary to the figures and shows the caution once, under it', async () => {
    renderSheet();
    await screen.findByTestId('sheet-summary');
    expect(screen.queryByTestId('sheet-summary-caution')).toBeNull();
    expect(screen.getAllByText(/Preliminary sizing estimates/)).toHaveLength(1);
    expect(text('sheet-caution')).toContain('Preliminary sizing estimates');
  });

  it('tells a subsystem owner once per group why its rows are read-only, and again in the row’s edit sheet', async () => {
    const detail = detailFor({ editableSubsystemIds: [subsystemId('Booms')], manageRows: false, manageSubsystems: false });
    renderSheet({ role: 'subsystem_owner', detail });
    expect((await screen.findByTestId('sheet-group-reason-Sail membrane')).textContent).toContain('edited by their owner or an engineer');
    expect(screen.queryByTestId('sheet-row-message-sail_side')).toBeNull();
    fireEvent.click(screen.getByTestId('sheet-row-sail_side').querySelector('[role="button"]') as HTMLElement);
    await screen.findByTestId('sheet-row-editor');
    expect(text('sheet-row-message-sail_side')).toContain('Sail membrane');
  });
});
