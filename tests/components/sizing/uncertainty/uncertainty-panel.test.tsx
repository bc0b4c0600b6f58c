import { fireEvent, screen, within } from '@testing-library/dom';
import { UncertaintyPanel } from '@/components/sizing/uncertainty/uncertainty-panel';
import { setupQueryClient } from '../../helpers/api';
import { renderDom } from '../../helpers/render';
import { snapshotOf, templateWith } from '../../helpers/template-snapshot';

function renderPanel() {
  const { wrapper: Wrapper } = setupQueryClient();
  renderDom(
    <Wrapper>
      <UncertaintyPanel snapshot={snapshotOf(templateWith())} />
    </Wrapper>,
  );
}

function type(testID: string, text: string) {
  fireEvent.change(screen.getByTestId(testID), { target: { value: text } });
}

function addInput(label: string) {
  fireEvent.click(within(screen.getByTestId('uncertainty-add')).getByRole('radio', { name: label }));
}

jest.setTimeout(30_000);

describe('UncertaintyPanel', () => {
  it('gives an added input a normal distribution around its value, which can become a range', () => {
    renderPanel();
    addInput('Sail side length');
    expect((screen.getByTestId('uncertainty-sail_side-mean') as HTMLInputElement).value).toBe('40');
    expect((screen.getByTestId('uncertainty-sail_side-sd') as HTMLInputElement).value).toBe('2');
    fireEvent.click(within(screen.getByTestId('uncertainty-kind-sail_side')).getByRole('radio', { name: 'Uniform' }));
    expect((screen.getByTestId('uncertainty-sail_side-min') as HTMLInputElement).value).toBe('36');
    expect((screen.getByTestId('uncertainty-sail_side-max') as HTMLInputElement).value).toBe('44');
    // An input already varied is not offered again.
    expect(within(screen.getByTestId('uncertainty-add')).queryByRole('radio', { name: 'Sail side length' })).toBeNull();
  });

  it('runs the study with progress, then shows probabilities, percentiles and a histogram, with the caution', async () => {
    renderPanel();
    addInput('Sail side length');
    addInput('Film thickness');
    type('uncertainty-samples', '12000');
    type('uncertainty-percentiles-extra', '10, 90');
    type('uncertainty-target-acceleration', '0.45');
    fireEvent.click(screen.getByTestId('uncertainty-run'));
    expect(within(screen.getByTestId('uncertainty-progress')).getByRole('progressbar')).toBeTruthy();

    const result = await screen.findByTestId('uncertainty-result', undefined, { timeout: 20_000 });
    expect(within(result).getByText('12,000 samples, seed 1.')).toBeTruthy();
    const requirements = within(result).getByTestId('uncertainty-requirements');
    expect(within(requirements).getByTestId('uncertainty-requirement-temperature').textContent).toMatch(
      /at most the film temperature limit100 %$/,
    );
    expect(within(requirements).getByTestId('uncertainty-requirement-margin').textContent).toMatch(/^System margin at least the required/);
    expect(within(requirements).getByTestId('uncertainty-requirement-request-0').textContent).toMatch(
      /^Characteristic acceleration at least 0\.45 mm\/s²\d+(\.\d+)? %$/,
    );
    const acceleration = within(result).getByTestId('uncertainty-percentiles-characteristic_acceleration').textContent ?? '';
    expect(acceleration).toMatch(/Nominal 0\.4629 mm\/s²/);
    expect(acceleration).toMatch(/P5 .*P10 .*P50 .*P90 .*P95 /);
    const histogram = within(result).getByTestId('uncertainty-histogram');
    expect(within(histogram).getByTestId('chart-x-label').textContent).toBe('Areal density (g/m²)');
    fireEvent.click(within(screen.getByTestId('uncertainty-histogram-choice')).getByRole('radio', { name: 'System margin' }));
    expect(within(screen.getByTestId('uncertainty-histogram')).getByTestId('chart-x-label').textContent).toBe('System margin (kg)');
    expect(screen.getByTestId('uncertainty-caution').textContent).toMatch(/^Preliminary sizing estimates/);
  });

  it('cancels a study under way', async () => {
    renderPanel();
    addInput('Sail side length');
    type('uncertainty-samples', '100000');
    fireEvent.click(screen.getByTestId('uncertainty-run'));
    fireEvent.click(screen.getByTestId('uncertainty-cancel'));
    expect(await screen.findByTestId('uncertainty-cancelled')).toBeTruthy();
    expect(screen.queryByTestId('uncertainty-result')).toBeNull();
  });

  it('says what is wrong before running, naming the input', () => {
    renderPanel();
    fireEvent.click(screen.getByTestId('uncertainty-run'));
    expect(screen.getByTestId('uncertainty-problems').textContent).toMatch(/Choose at least one input to vary/);
    addInput('Sail side length');
    fireEvent.click(within(screen.getByTestId('uncertainty-kind-sail_side')).getByRole('radio', { name: 'Uniform' }));
    type('uncertainty-sail_side-min', '50');
    type('uncertainty-samples', 'many');
    fireEvent.click(screen.getByTestId('uncertainty-run'));
    expect(screen.getByTestId('uncertainty-problems').textContent).toMatch(/Samples: type a number, got "many"/);
    type('uncertainty-samples', '1000');
    fireEvent.click(screen.getByTestId('uncertainty-run'));
    expect(screen.getByTestId('uncertainty-problems').textContent).toMatch(/Sail side length: max must be greater than min/);
    expect(screen.queryByTestId('uncertainty-progress')).toBeNull();
  });
});
