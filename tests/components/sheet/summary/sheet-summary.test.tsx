import { screen, within } from '@testing-library/dom';
import { SheetSummary } from '@/components/sheet/summary/sheet-summary';
import { formatQuantity } from '@/shared/format/quantity';
import { SIZING_CAUTION } from '@/shared/analyses/caution';
import { sheetRoles, standardHeadline } from '@/shared/templates';
import { setupQueryClient } from '../../helpers/api';
import { renderDom } from '../../helpers/render';
import { setWindowWidth } from '../sheet-fixtures';
import { snapshotOf, templateWith } from '../../helpers/template-snapshot';

function renderSummary(inputs: Record<string, number> = {}) {
  const snapshot = snapshotOf(templateWith(inputs));
  const { wrapper: Wrapper } = setupQueryClient();
  renderDom(
    <Wrapper>
      <SheetSummary snapshot={snapshot} />
    </Wrapper>,
  );
  return snapshot;
}

function figure(role: string): HTMLElement {
  return screen.getByTestId(`summary-figure-${role}`);
}

describe('SheetSummary', () => {
  // Wide: the card carries the caution (a phone's sticky card leaves it to the screen).
  beforeEach(() => setWindowWidth(1280));

  it('shows every headline figure of the template with the engine’s value, and the caution', () => {
    const snapshot = renderSummary();
    const keys = sheetRoles(snapshot.sheet);
    for (const role of standardHeadline) {
      const value = snapshot.values[keys[role] ?? role];
      if (value === undefined) throw new Error(`the template has no value for ${role}`);
      expect(figure(role).textContent).toContain(formatQuantity(value.value, value.unit));
    }
    expect(within(screen.getByTestId('sheet-summary')).getByText(SIZING_CAUTION)).toBeTruthy();
  });

  it('labels the figures in words and reads the margin against the required share', () => {
    renderSummary();
    expect(within(figure('characteristic_acceleration')).getByText('Characteristic acceleration')).toBeTruthy();
    expect(figure('system_margin').textContent).toContain('required 15 %');
    expect(within(figure('system_margin')).queryByText('Below the required margin')).toBeNull();
  });

  it('flags the margin in the warning style when it falls below the required margin', () => {
    const snapshot = renderSummary({ mass_allocation: 30 });
    const budget = snapshot.budget;
    // AIAA S-120A-2015: margin = allocation − predicted mass; 15 % of 30 kg is more than is left here.
    expect(budget.ok && budget.result.systemMargin.belowRequired).toBe(true);
    expect(within(figure('system_margin')).getByText('Below the required margin')).toBeTruthy();
  });
});
