import { fireEvent, screen } from '@testing-library/dom';
import { act } from 'react';
import { createRoot } from 'react-dom/client';
import { SizingWorkspace } from '@/components/sizing/sizing-workspace';
import * as engine from '@/shared/engine';
import type { Sheet } from '@/shared/schemas/sheet';
import { setupQueryClient } from '../helpers/api';
import { renderDom } from '../helpers/render';

jest.mock('@/shared/engine', () => {
  const actual: typeof engine = jest.requireActual('@/shared/engine');
  return { ...actual, createSheetSession: jest.fn(actual.createSheetSession) };
});

const createSheetSession = jest.mocked(engine.createSheetSession);

function renderWorkspace(sheet: Sheet) {
  const { wrapper: Wrapper } = setupQueryClient();
  renderDom(
    <Wrapper>
      <SizingWorkspace sheet={sheet} resetLabel="Start again" />
    </Wrapper>,
  );
}

const brokenSheet: Sheet = {
  name: 'Broken',
  parameters: [
    { key: 'sail_side', label: 'Sail side length', subsystem: 'Sail membrane', unit: 'm', value: 20, role: 'sail_side' },
    {
      key: 'sail_area',
      label: 'Sail area',
      subsystem: 'Sail membrane',
      unit: 'm^2',
      formula: '=sail_side * missing_row',
      role: 'sail_area',
    },
    { key: 'membrane_mass', label: 'Membrane mass', subsystem: 'Sail membrane', unit: 'kg', formula: '=sail_side + 1' },
    {
      key: 'sail_loading',
      label: 'Sail loading',
      subsystem: 'Performance',
      unit: 'g/m^2',
      formula: '=membrane_mass / sail_area',
      role: 'areal_density',
    },
  ],
};

describe('SizingWorkspace', () => {
  it('shows the errors of a sheet beside their rows and keeps the other rows', () => {
    renderWorkspace(brokenSheet);
    expect(screen.getByTestId('param-error-sail_area').textContent).toContain('missing_row');
    expect(screen.getByTestId('param-error-membrane_mass').textContent).toContain('membrane_mass');
    // The headline figure is found by its role, under the row's own key, and names the row it depends on.
    expect(screen.getByTestId('key-figure-sail_loading').textContent).toContain('—');
    expect(screen.getByTestId('key-figure-sail_loading').textContent).toContain('sail_loading: depends on');
    expect((screen.getByTestId('param-input-sail_side') as HTMLInputElement).value).toBe('20');
    expect(screen.getByRole('button', { name: 'Start again' })).toBeTruthy();
  });

  it('says why the mass budget cannot be rolled up when the sheet has no allocation', () => {
    renderWorkspace(brokenSheet);
    expect(screen.getByTestId('key-figure-system_margin').textContent).toContain('mass_allocation');
  });

  it('shows an error state, with a retry, when the engine cannot be built', () => {
    createSheetSession.mockImplementationOnce(() => {
      throw new Error('workbook could not be created');
    });
    renderWorkspace(brokenSheet);
    expect(screen.getByRole('alert').textContent).toContain('workbook could not be created');
    expect(screen.queryByTestId('undo')).toBeNull();
    fireEvent.click(screen.getByRole('button', { name: 'Try again' }));
    expect(screen.getByTestId('param-sail_side')).toBeTruthy();
  });

  it('says so when the sheet has no rows', () => {
    renderWorkspace({ name: 'Empty', parameters: [] });
    expect(screen.getByText('No rows to size')).toBeTruthy();
  });

  it('frees the engine workbook when it leaves the screen', () => {
    const destroy = jest.fn();
    createSheetSession.mockImplementationOnce((sheet) => {
      const session = jest.requireActual<typeof engine>('@/shared/engine').createSheetSession(sheet);
      const release = session.destroy.bind(session);
      session.destroy = () => {
        destroy();
        release();
      };
      return session;
    });
    const { wrapper: Wrapper } = setupQueryClient();
    const root = createRoot(document.body.appendChild(document.createElement('div')));
    act(() =>
      root.render(
        <Wrapper>
          <SizingWorkspace sheet={brokenSheet} resetLabel="Start again" />
        </Wrapper>,
      ),
    );
    expect(destroy).not.toHaveBeenCalled();
    act(() => root.unmount());
    expect(destroy).toHaveBeenCalledTimes(1);
  });
});
