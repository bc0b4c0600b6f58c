import { fireEvent, screen, waitFor, within } from '@testing-library/dom';
import { MassBudgetView } from '@/components/sheet/budget/mass-budget-view';
import { formatNumber } from '@/shared/format/quantity';
import { SIZING_CAUTION } from '@/shared/analyses/caution';
import { findPreset } from '@/shared/budget/presets';
import { withAllowanceTable } from '@/shared/budget/craft-table';
import type { Sheet } from '@/shared/schemas/sheet';
import { demoSession, demoUser, mockFetch, setupQueryClient } from '../../helpers/api';
import { renderDom } from '../../helpers/render';
import { snapshotOf, templateWith } from '../../helpers/template-snapshot';

function renderSheet(sheet: Sheet, canEditTable = false) {
  const snapshot = snapshotOf(sheet);
  const { wrapper: Wrapper } = setupQueryClient();
  renderDom(
    <Wrapper>
      <MassBudgetView snapshot={snapshot} craftId="craft-1" canEditTable={canEditTable} />
    </Wrapper>,
  );
  return snapshot.budget;
}

function renderBudget(inputs: Record<string, number> = {}) {
  return renderSheet(templateWith(inputs));
}

function renderRolledUp(inputs: Record<string, number> = {}) {
  const budget = renderBudget(inputs);
  if (!budget.ok) throw new Error('the template’s budget does not roll up');
  return budget.result;
}

describe('MassBudgetView', () => {
  it('lists each subsystem with basic mass, allowance, predicted mass and share, and the rows under it', () => {
    const budget = renderRolledUp();
    const view = screen.getByTestId('mass-budget-view');
    expect(within(view).getByText('Basic mass (kg)')).toBeTruthy();
    expect(within(view).getByText('Allowance')).toBeTruthy();
    for (const subsystem of budget.bySubsystem) {
      const line = screen.getByTestId(`budget-subsystem-${subsystem.subsystem}`);
      expect(line.textContent).toContain(formatNumber(subsystem.cbe));
      expect(line.textContent).toContain(formatNumber(subsystem.predicted));
    }
    // The bus is existing hardware: its row carries the preset's allowance for that maturity, not the subsystem's mix.
    const bus = budget.rows.find((row) => row.key === 'bus_mass');
    expect(screen.getByTestId('budget-row-bus_mass').textContent).toContain(`${Math.round((bus?.allowance ?? Number.NaN) * 100)} %`);
    expect(screen.getByTestId('budget-total').textContent).toContain(formatNumber(budget.total.predicted));
    expect(screen.getByTestId('budget-total').textContent).toContain('100 %');
    expect(within(view).getByText(SIZING_CAUTION)).toBeTruthy();
  });

  it('charts the shares with labelled axes and a summary for screen readers', () => {
    const budget = renderRolledUp();
    const chart = screen.getByTestId('mass-budget-shares');
    expect(within(chart).getByTestId('chart-x-label').textContent).toBe('Share of the predicted mass (%)');
    expect(within(chart).getByTestId('chart-y-label').textContent).toBe('Subsystem');
    const drawing = within(chart).getByRole('img');
    expect(drawing.getAttribute('aria-label')).toContain('Share of the predicted mass by subsystem.');
    for (const subsystem of budget.bySubsystem) expect(drawing.getAttribute('aria-label')).toContain(`${subsystem.subsystem}:`);
  });

  it('draws the predicted mass against the allocation and says when the margin is enough', () => {
    renderBudget();
    const bar = screen.getByTestId('mass-budget-margin');
    expect(within(bar).getByTestId('chart-x-label').textContent).toBe('Mass (kg)');
    expect(within(bar).getByRole('img').getAttribute('aria-label')).toContain('of an allocation of 35 kg');
    expect(within(bar).getByText('Margin')).toBeTruthy();
    expect(screen.getByTestId('mass-budget-margin-text').getAttribute('role')).not.toBe('alert');
  });

  it('warns when the margin is below the required margin', () => {
    renderBudget({ mass_allocation: 30 });
    expect(within(screen.getByTestId('mass-budget-margin')).getByText('Margin, below the required one')).toBeTruthy();
    const text = screen.getByTestId('mass-budget-margin-text');
    expect(text.getAttribute('role')).toBe('alert');
    expect(text.textContent).toContain('below the required margin');
  });

  it('names the row at fault when the budget cannot be rolled up', () => {
    const budget = renderBudget({ mass_allocation: 0 });
    expect(budget.ok).toBe(false);
    expect(within(screen.getByTestId('mass-budget-problems')).getByText(/allocation/)).toBeTruthy();
    expect(screen.queryByTestId('mass-budget-table')).toBeNull();
  });

  it('says the AIAA-style preset is not the standard’s table', () => {
    renderBudget();
    expect(screen.getByTestId('mass-budget-preset-notice').textContent).toMatch(/not the AIAA S-120A table/);
  });

  it('drops that notice once the craft has a table of its own, and states a margin of the predicted mass', () => {
    // ESA SRE-PA/2011.097's rule in a team's table: 20 % of the nominal dry mass is 16.7 % of the allocation.
    const aiaa = findPreset('aiaa-s120a');
    if (aiaa === undefined) throw new Error('aiaa-s120a preset missing');
    const { notice: _notice, ...cells } = aiaa;
    renderSheet(
      withAllowanceTable(templateWith({ mass_allocation: 60 }), {
        ...cells,
        id: 'ours',
        systemMarginPercent: 20,
        systemMarginBasis: 'predicted',
      }),
    );
    expect(screen.queryByTestId('mass-budget-preset-notice')).toBeNull();
    expect(screen.getByTestId('mass-budget-margin-text').textContent).toContain(
      `required 20 % of the predicted mass (${formatNumber(100 / 6, 3)} % of the allocation)`,
    );
  });

  it('saves an edited cell as the craft’s own table', async () => {
    const fetchMock = mockFetch({
      'GET /api/auth/session': { status: 200, body: demoSession(demoUser) },
      'PUT /api/crafts/craft-1/allowance-table': (body) => ({
        status: 200,
        body: { table: (body as { table: unknown }).table, updatedBy: { id: 'u', name: 'Tomás' }, updatedAt: '2026-12-05T00:00:00.000Z' },
      }),
    });
    renderSheet(templateWith(), true);
    fireEvent.click(screen.getByTestId('mass-budget-table-toggle'));
    fireEvent.change(screen.getByTestId('allowance-cell-layout-harness'), { target: { value: '45' } });
    fireEvent.click(screen.getByTestId('allowance-save'));
    await waitFor(() => expect(fetchMock.mock.calls.some(([, init]) => init?.method === 'PUT')).toBe(true));
    const [, init] = fetchMock.mock.calls.find(([, call]) => call?.method === 'PUT') ?? [];
    const sent = JSON.parse(String(init?.body)) as {
      table: { table: Record<string, Record<string, number>>; categories: { label: string }[] };
    };
    expect(sent.table.table.layout?.harness).toBeCloseTo(0.45, 12);
    // The team's cells replace ours: its columns are no longer marked as our extrapolation.
    expect(sent.table.categories.map((category) => category.label)).not.toContainEqual(expect.stringMatching(/extrapolation/));
  });

  it('keeps a viewer from saving the table', () => {
    renderSheet(templateWith(), false);
    fireEvent.click(screen.getByTestId('mass-budget-table-toggle'));
    expect(screen.getByTestId('allowance-cell-layout-harness')).toBeTruthy();
    expect(screen.queryByTestId('allowance-save')).toBeNull();
  });

  it('names a cell that is not a number before sending anything', () => {
    const fetchMock = mockFetch({ 'GET /api/auth/session': { status: 200, body: demoSession(demoUser) } });
    renderSheet(templateWith(), true);
    fireEvent.click(screen.getByTestId('mass-budget-table-toggle'));
    fireEvent.change(screen.getByTestId('allowance-cell-estimated-boom'), { target: { value: 'lots' } });
    fireEvent.click(screen.getByTestId('allowance-save'));
    expect(screen.getByTestId('allowance-problem').textContent).toBe('Estimated × Booms: type a percentage');
    expect(fetchMock.mock.calls.some(([, init]) => init?.method === 'PUT')).toBe(false);
  });
});
