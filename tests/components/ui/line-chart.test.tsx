import { screen, within } from '@testing-library/dom';
import { BarChart } from '@/components/ui/bar-chart';
import { LineChart } from '@/components/ui/line-chart';
import { MarginBar } from '@/components/ui/margin-bar';
import { renderDom } from '../helpers/render';

describe('LineChart', () => {
  it('writes the axis titles as text, a legend entry per line, and sums the data up for screen readers', () => {
    renderDom(
      <LineChart
        title="Drag versus speed"
        x={[0, 1, 2, 3]}
        series={[
          { label: 'Measured', color: '#000', values: [0, 1, Number.NaN, 9] },
          { label: 'Model', color: '#333', values: [0, 1, 4, 9], dashed: true },
        ]}
        xLabel="Speed (m/s)"
        yLabel="Drag (N)"
        reference={{ y: 5, label: 'Limit' }}
        testID="chart"
      />,
    );
    const chart = screen.getByTestId('chart');
    expect(within(chart).getByTestId('chart-x-label').textContent).toBe('Speed (m/s)');
    expect(within(chart).getByTestId('chart-y-label').textContent).toBe('Drag (N)');
    expect(within(within(chart).getByTestId('chart-legend')).getAllByText(/^(Measured|Model|Limit)$/)).toHaveLength(3);
    expect(within(chart).getByRole('img').getAttribute('aria-label')).toBe(
      'Drag versus speed. Speed (m/s) from 0 to 3. Measured: 0 to 9. Model: 0 to 9. Limit at 5.',
    );
  });

  it('leaves a gap where a value is missing instead of joining across it', () => {
    renderDom(
      <LineChart
        title="Gap"
        x={[0, 1, 2, 3]}
        series={[{ label: 'Line', color: '#000', values: [0, 1, Number.NaN, 9] }]}
        xLabel="x"
        yLabel="y"
        testID="chart"
      />,
    );
    const path = screen.getByTestId('chart').querySelector('path')?.getAttribute('d') ?? '';
    // Two runs: each starts with a move.
    expect(path.match(/M/g)).toHaveLength(2);
  });
});

describe('BarChart', () => {
  it('labels both axes and names each bar with its value', () => {
    renderDom(
      <BarChart
        title="Mass by part"
        bars={[
          { label: 'Booms', value: 40, color: '#000' },
          { label: 'Bus', value: 60, color: '#333' },
        ]}
        valueLabel="Share (%)"
        categoryLabel="Part"
        formatValue={(value) => `${value} %`}
        testID="bars"
      />,
    );
    const chart = screen.getByTestId('bars');
    expect(within(chart).getByTestId('chart-x-label').textContent).toBe('Share (%)');
    expect(within(chart).getByTestId('chart-y-label').textContent).toBe('Part');
    expect(within(chart).getByRole('img').getAttribute('aria-label')).toBe('Mass by part. Booms: 40 %. Bus: 60 %.');
  });
});

describe('MarginBar', () => {
  it('says over the allocation when the predicted mass passes it', () => {
    renderDom(
      <MarginBar
        title="Mass against allocation"
        allocation={30}
        predicted={33}
        requiredMargin={4.5}
        belowRequired
        valueLabel="Mass (kg)"
        formatValue={(value) => `${value} kg`}
        testID="margin"
      />,
    );
    const chart = screen.getByTestId('margin');
    expect(within(chart).getByText('Over the allocation')).toBeTruthy();
    expect(within(chart).getByRole('img').getAttribute('aria-label')).toContain(
      'margin -3 kg, required 4.5 kg, below the required margin.',
    );
  });
});
