import { screen, within } from '@testing-library/dom';
import { SheetPlots, sweepPlotID } from '@/components/sheet/plots/sheet-plots';
import { SheetSummary } from '@/components/sheet/summary/sheet-summary';
import { SIZING_CAUTION } from '@/shared/analyses/caution';
import { findTemplate, instantiateTemplate, type TemplateDefinition } from '@/shared/templates';
import { setupQueryClient } from '../../helpers/api';
import { renderDom } from '../../helpers/render';
import { snapshotOf } from '../../helpers/template-snapshot';
import { setWindowWidth } from '../sheet-fixtures';

function template(id: string): TemplateDefinition {
  const found = findTemplate(id);
  if (found === undefined) throw new Error(`no template ${id}`);
  return found;
}

function render(element: React.JSX.Element) {
  const { wrapper: Wrapper } = setupQueryClient();
  renderDom(<Wrapper>{element}</Wrapper>);
}

describe('a template’s own figures, checks and caveats on the sheet', () => {
  beforeEach(() => setWindowWidth(1280));

  it('shows the magnetic sail’s headline figures, with the failing validity checks beside the thrust', () => {
    const magnetic = template('magnetic-sail');
    render(<SheetSummary snapshot={snapshotOf(instantiateTemplate(magnetic))} />);
    for (const role of magnetic.roles.headline) expect(screen.getByTestId(`summary-figure-${role}`)).toBeTruthy();
    expect(screen.queryByTestId('summary-figure-areal_density')).toBeNull();
    const thrust = screen.getByTestId('summary-figure-thrust');
    expect(within(thrust).getByTestId('check-far_field_holds').textContent).toMatch(/^Fails: Outside the far field/);
    expect(within(thrust).getByTestId('check-fluid_regime_holds').getAttribute('role')).toBe('alert');
    const caveats = screen.getByTestId('sheet-summary-caveats');
    for (const caveat of magnetic.roles.caveats) expect(within(caveats).getByText(caveat)).toBeTruthy();
    expect(within(screen.getByTestId('sheet-summary')).getByText(SIZING_CAUTION)).toBeTruthy();
  });

  it('lists the failing checks under the figures on a phone, where their words wrap', () => {
    setWindowWidth(390);
    render(<SheetSummary snapshot={snapshotOf(instantiateTemplate(template('magnetic-sail')))} />);
    const thrust = screen.getByTestId('summary-figure-thrust');
    expect(within(thrust).queryByTestId('check-far_field_holds')).toBeNull();
    expect(within(screen.getByTestId('sheet-summary')).getByTestId('check-far_field_holds').textContent).toMatch(/^Fails: /);
  });

  it('lists a check with no figure to sit beside under the figures: the square sail’s vanes', () => {
    const square = instantiateTemplate(template('square-sail'));
    const offset = { ...square, parameters: square.parameters.map((row) => (row.key === 'cp_offset' ? { ...row, value: 0.1 } : row)) };
    render(<SheetSummary snapshot={snapshotOf(offset)} />);
    expect(within(screen.getByTestId('sheet-summary')).getByTestId('check-vanes_can_trim').textContent).toMatch(
      /^Fails: The vanes cannot trim the centre-of-pressure offset/,
    );
  });

  it.each(['spin-disc', 'bladed-sail', 'beam-sail', 'electric-sail', 'magnetic-sail'])(
    'draws every plot %s declares, under its caveats and the caution',
    (id) => {
      const found = template(id);
      render(<SheetPlots snapshot={snapshotOf(instantiateTemplate(found))} />);
      for (const plot of found.roles.plots) {
        if (plot.kind !== 'sweep') continue;
        const card = screen.getByTestId(sweepPlotID(plot));
        expect(within(card).getByTestId(`${sweepPlotID(plot)}-chart`)).toBeTruthy();
        expect(within(card).getByText(SIZING_CAUTION)).toBeTruthy();
      }
      expect(screen.queryByTestId('plot-cone-angle')).toBeNull();
      const caveats = screen.getByTestId('sheet-plots-caveats');
      for (const caveat of found.roles.caveats) expect(within(caveats).getByText(caveat)).toBeTruthy();
    },
  );
});
