import { fireEvent, screen, within } from '@testing-library/dom';
import { SheetPlots } from '@/components/sheet/plots/sheet-plots';
import { SIZING_CAUTION } from '@/shared/analyses/caution';
import { setupQueryClient } from '../../helpers/api';
import { renderDom } from '../../helpers/render';
import { snapshotOf, templateWith } from '../../helpers/template-snapshot';

function renderPlots(inputs: Record<string, number> = {}) {
  const { wrapper: Wrapper } = setupQueryClient();
  renderDom(
    <Wrapper>
      <SheetPlots snapshot={snapshotOf(templateWith(inputs))} />
    </Wrapper>,
  );
}

function axes(testID: string): [string | null, string | null] {
  const chart = screen.getByTestId(testID);
  return [within(chart).getByTestId('chart-x-label').textContent, within(chart).getByTestId('chart-y-label').textContent];
}

function summary(testID: string): string {
  return within(screen.getByTestId(testID)).getByRole('img').getAttribute('aria-label') ?? '';
}

describe('SheetPlots', () => {
  it('draws force versus cone angle with labelled axes, a legend and the best angle across the sun line', () => {
    renderPlots();
    expect(axes('plot-cone-angle-force')).toEqual(['Cone angle (°)', 'Force (N)']);
    const legend = within(screen.getByTestId('plot-cone-angle-force')).getByTestId('chart-legend');
    expect(within(legend).getByText('Total (optical)')).toBeTruthy();
    expect(within(legend).getByText('Largest force across the sun line')).toBeTruthy();
    expect(summary('plot-cone-angle-force')).toMatch(/^Force versus cone angle\. Cone angle \(°\) from 0 to 90\./);
    // McInnes 1999 ch. 2: an ideal flat sail's force across the sun line peaks at tan α = 1/√2 (35.26°);
    // the optical model of the template sits close to it.
    const best = screen.getByTestId('plot-cone-angle-best').textContent ?? '';
    const angle = Number(/at (\d+(\.\d+)?)°/.exec(best)?.[1]);
    expect(angle).toBeGreaterThan(30);
    expect(angle).toBeLessThan(40);
  });

  it('switches the cone-angle chart to acceleration', () => {
    renderPlots();
    fireEvent.click(screen.getByRole('radio', { name: 'Acceleration' }));
    expect(axes('plot-cone-angle-acceleration')).toEqual(['Cone angle (°)', 'Acceleration (mm/s²)']);
    expect(screen.queryByTestId('plot-cone-angle-force')).toBeNull();
  });

  it('draws the film thickness trade: characteristic acceleration versus sail side for three thicknesses', () => {
    renderPlots();
    const trade = screen.getByTestId('plot-film-trade');
    expect(axes('plot-film-trade-chart')).toEqual(['Sail side (m)', 'Characteristic acceleration (mm/s²)']);
    // The template's film is 2.5 µm: the trade draws half, the same and double.
    for (const thickness of ['1.25 µm film', '2.5 µm film', '5 µm film']) expect(within(trade).getByText(thickness)).toBeTruthy();
    expect(summary('plot-film-trade-chart')).toContain('2.5 µm film:');
  });

  it('draws temperature versus distance with the film limit marked and the closest safe distance', () => {
    renderPlots();
    expect(axes('plot-temperature-chart')).toEqual(['Distance from the Sun (AU)', 'Sail temperature (K)']);
    const legend = within(screen.getByTestId('plot-temperature-chart')).getByTestId('chart-legend');
    expect(within(legend).getByText(/^Film limit \d/)).toBeTruthy();
    expect(summary('plot-temperature-chart')).toContain('Film limit');
    expect(screen.getByTestId('plot-temperature-closest').textContent).toMatch(/^Closest safe distance: 0\.\d+ AU$/);
    expect(within(screen.getByTestId('plot-temperature')).getByText(SIZING_CAUTION)).toBeTruthy();
  });

  it('names the row at fault instead of a chart the sheet cannot give', () => {
    renderPlots({ film_thickness: 0 });
    expect(within(screen.getByTestId('plot-film-trade-problems')).getByText(/film_thickness/)).toBeTruthy();
    expect(screen.getByTestId('plot-temperature-chart')).toBeTruthy();
  });
});
