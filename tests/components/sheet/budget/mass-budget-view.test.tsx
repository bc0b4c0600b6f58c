import { screen, within } from '@testing-library/dom';
import { MassBudgetView } from '@/components/sheet/budget/mass-budget-view';
import { formatNumber } from '@/shared/format/quantity';
import { SIZING_CAUTION } from '@/shared/analyses/caution';
import { setupQueryClient } from '../../helpers/api';
import { renderDom } from '../../helpers/render';
import { snapshotOf, templateWith } from '../../helpers/template-snapshot';

function renderBudget(inputs: Record<string, number> = {}) {
  const snapshot = snapshotOf(templateWith(inputs));
  const { wrapper: Wrapper } = setupQueryClient();
  renderDom(
    <Wrapper>
      <MassBudgetView snapshot={snapshot} />
    </Wrapper>,
  );
  return snapshot.budget;
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
});
