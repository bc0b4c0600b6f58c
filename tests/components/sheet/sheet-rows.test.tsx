import { fireEvent, screen, waitFor, within } from '@testing-library/dom';
import { squareSailTemplate } from '@/shared/templates';
import { detailFor, renderSheet, requests, revisionPath, setWindowWidth } from './sheet-fixtures';

const text = (testID: string) => screen.getByTestId(testID).textContent ?? '';

function change(testID: string, value: string) {
  fireEvent.change(screen.getByTestId(testID), { target: { value } });
}

describe('SheetScreen rows', () => {
  beforeEach(() => setWindowWidth(1280));

  it('adds a row from the form, showing it before the server answers', async () => {
    const { fetchMock } = renderSheet({ routes: { [`POST ${revisionPath}/parameters`]: 'pending' } });
    fireEvent.click(await screen.findByTestId('sheet-add-row'));
    const form = await screen.findByTestId('sheet-add-row-form');
    change('add-row-key', 'harness_mass');
    change('add-row-label', 'Harness mass');
    fireEvent.click(within(form).getByRole('radio', { name: 'Spacecraft' }));
    change('add-row-unit', 'kg');
    change('add-row-entry', '1500 g');
    fireEvent.click(screen.getByTestId('add-row-submit'));
    await waitFor(() =>
      expect(requests(fetchMock, 'POST', `${revisionPath}/parameters`)).toEqual([
        { parameter: { key: 'harness_mass', label: 'Harness mass', subsystem: 'Spacecraft', unit: 'kg', value: 1.5 } },
      ]),
    );
    // 1500 g is 1.5 kg.
    await waitFor(() => expect(text('sheet-value-harness_mass')).toBe('1.5 kg'));
  });

  it('refuses a key that looks like a grid address in the form, sending nothing', async () => {
    const { fetchMock } = renderSheet();
    fireEvent.click(await screen.findByTestId('sheet-add-row'));
    await screen.findByTestId('sheet-add-row-form');
    change('add-row-key', 'boom2');
    change('add-row-label', 'Second boom');
    change('add-row-entry', '3');
    fireEvent.click(screen.getByTestId('add-row-submit'));
    expect((await screen.findByTestId('add-row-key-error')).textContent).toContain('looks like a grid address');
    expect(requests(fetchMock, 'POST', `${revisionPath}/parameters`)).toEqual([]);
  });

  it('lists the rows that still use a row the server refuses to delete, and keeps the row', async () => {
    renderSheet({
      routes: {
        [`DELETE ${revisionPath}/parameters/sail_side?version=1`]: {
          status: 409,
          body: { error: { code: 'in_use', message: 'Other rows use sail_side.', details: { keys: ['sail_area', 'boom_length'] } } },
        },
      },
    });
    fireEvent.click(await screen.findByTestId('sheet-open-sail_side'));
    fireEvent.click(await screen.findByTestId('row-delete'));
    fireEvent.click(screen.getByTestId('row-delete-confirm'));
    const message = await screen.findByTestId('sheet-row-message-sail_side');
    expect(message.textContent).toContain('Other rows use sail_side.');
    expect(message.textContent).toContain('sail_area, boom_length');
    expect(text('sheet-value-sail_area')).toBe('1600 m²');
  });

  it('changes a row’s unit among those of its dimension, keeping the quantity', async () => {
    const { fetchMock } = renderSheet({ routes: { [`PATCH ${revisionPath}/parameters/sail_side`]: 'pending' } });
    fireEvent.click(await screen.findByTestId('sheet-open-sail_side'));
    const picker = await screen.findByTestId('row-unit-picker');
    expect(within(picker).queryByRole('radio', { name: 'kg' })).toBeNull();
    fireEvent.click(within(picker).getByRole('radio', { name: 'km' }));
    await waitFor(() =>
      expect(requests(fetchMock, 'PATCH', `${revisionPath}/parameters/sail_side`)).toEqual([{ unit: 'km', value: 0.04, version: 1 }]),
    );
    // 40 m = 0.04 km, so the area stays 1600 m².
    expect(text('sheet-value-sail_area')).toBe('1600 m²');
  });

  it('moves a row down within its subsystem', async () => {
    const { fetchMock } = renderSheet({ routes: { [`PATCH ${revisionPath}/parameters/bus_mass`]: 'pending' } });
    fireEvent.click(await screen.findByTestId('sheet-open-bus_mass'));
    fireEvent.click(await screen.findByTestId('row-move-down'));
    await waitFor(() =>
      expect(requests(fetchMock, 'PATCH', `${revisionPath}/parameters/bus_mass`)).toEqual([{ before: null, version: 1 }]),
    );
    const order = () => {
      const spacecraft = screen.getByTestId('sheet-group-Spacecraft').closest('[role="rowgroup"]');
      return Array.from(spacecraft?.querySelectorAll('[data-testid^="sheet-row-"]') ?? []).map((row) => row.getAttribute('data-testid'));
    };
    await waitFor(() => expect(order()).toEqual(['sheet-row-payload_mass', 'sheet-row-bus_mass']));
  });

  it('shows a partner the shared rows read-only and the headline figures from the server', async () => {
    const template = squareSailTemplate();
    const shared = { ...template, parameters: template.parameters.filter((parameter) => parameter.subsystem === 'Sail membrane') };
    const detail = {
      ...detailFor({ editableSubsystemIds: [], manageRows: false, manageSubsystems: false, wholeSheet: false }, shared),
      headlineFigures: [
        {
          role: 'characteristic_acceleration',
          key: 'characteristic_acceleration',
          label: 'Characteristic acceleration',
          value: 0.0512,
          unit: 'mm/s^2',
        },
        { role: 'system_margin', key: 'system_margin', label: 'System margin', value: 1.2, unit: 'kg', flag: 'below the required margin' },
      ],
      // A formula row shows the value the server computed over the whole sheet, not one from the shared rows alone.
      serverValues: { membrane_mass: { value: 1.234, unit: 'kg' } },
    };
    renderSheet({ role: 'partner', detail });
    expect((await screen.findByTestId('sheet-headline-characteristic_acceleration')).textContent).toContain('0.0512 mm/s²');
    expect(text('sheet-headline-system_margin')).toContain('below the required margin');
    expect(text('sheet-read-only')).toContain('Partners read the rows shared with them');
    expect(screen.queryByTestId('sheet-input-sail_side')).toBeNull();
    expect(screen.queryByTestId('sheet-row-boom_mass')).toBeNull();
    expect(screen.queryByTestId('sheet-views')).toBeNull();
    expect(text('sheet-value-membrane_mass')).toBe('1.234 kg');
    expect(text('sheet-status-membrane_mass')).toBe('ok');
  });
});
