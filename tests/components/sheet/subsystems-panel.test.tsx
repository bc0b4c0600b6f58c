import { fireEvent, screen, waitFor, within } from '@testing-library/dom';
import { craftId, detailFor, renderSheet, requests, setWindowWidth, subsystemId } from './sheet-fixtures';

const subsystemsPath = `/api/crafts/${craftId}/subsystems`;

function type(testID: string, value: string) {
  fireEvent.change(screen.getByTestId(testID), { target: { value } });
}

describe('SheetScreen subsystems', () => {
  beforeEach(() => setWindowWidth(1280));

  it('adds and renames subsystems through the API', async () => {
    const optics = subsystemId('Optics');
    const { fetchMock } = renderSheet({
      routes: {
        [`POST ${subsystemsPath}`]: { status: 201, body: { id: subsystemId('Attitude control'), name: 'Attitude control', position: 9 } },
        [`PATCH ${subsystemsPath}/${optics}`]: { status: 200, body: { id: optics, name: 'Optical properties', position: 1 } },
      },
    });
    fireEvent.click(await screen.findByTestId('sheet-subsystems'));
    const panel = await screen.findByTestId('sheet-subsystems-panel');
    type('subsystem-new-name', 'Attitude control');
    fireEvent.click(within(panel).getByTestId('subsystem-add'));
    await waitFor(() => expect(requests(fetchMock, 'POST', subsystemsPath)).toEqual([{ name: 'Attitude control' }]));

    const renameButton = within(panel).getByTestId('subsystem-rename-Optics');
    expect(renameButton.getAttribute('aria-disabled')).toBe('true');
    fireEvent.change(within(screen.getByTestId('subsystem-Optics')).getByRole('textbox'), { target: { value: 'Optical properties' } });
    fireEvent.click(renameButton);
    await waitFor(() => expect(requests(fetchMock, 'PATCH', `${subsystemsPath}/${optics}`)).toEqual([{ name: 'Optical properties' }]));
  });

  it('says which rows keep a subsystem from being deleted', async () => {
    const optics = subsystemId('Optics');
    renderSheet({
      routes: {
        [`DELETE ${subsystemsPath}/${optics}`]: {
          status: 409,
          body: { error: { code: 'in_use', message: 'Rows are still in "Optics".', details: { keys: ['reflectivity', 'emissivity_front'] } } },
        },
      },
    });
    fireEvent.click(await screen.findByTestId('sheet-subsystems'));
    fireEvent.click(await screen.findByTestId('subsystem-delete-Optics'));
    const problem = await screen.findByTestId('subsystems-problem');
    expect(problem.textContent).toContain('Rows are still in "Optics".');
    expect(problem.textContent).toContain('reflectivity, emissivity_front');
  });

  it('offers subsystems only to those who may manage them', async () => {
    renderSheet({ role: 'subsystem_owner', detail: detailFor({ manageRows: false, manageSubsystems: false }) });
    await screen.findByTestId('sheet-undo');
    expect(screen.queryByTestId('sheet-subsystems')).toBeNull();
  });
});
