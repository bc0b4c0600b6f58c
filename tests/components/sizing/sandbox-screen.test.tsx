import { fireEvent, screen, within } from '@testing-library/dom';
import { SandboxScreen } from '@/components/sizing/sandbox-screen';
import { createSheetSession } from '@/shared/engine';
import { squareSailTemplate, standardHeadline } from '@/shared/templates';
import { setupQueryClient } from '../helpers/api';
import { renderDom } from '../helpers/render';

function renderScreen() {
  const { wrapper: Wrapper } = setupQueryClient();
  renderDom(
    <Wrapper>
      <SandboxScreen />
    </Wrapper>,
  );
}

function figure(key: string): string {
  return screen.getByTestId(`key-figure-${key}`).textContent ?? '';
}

/** The value shown on the sail area row (a formula row: its formula, then its value). */
function shownArea(): string {
  return within(screen.getByTestId('param-sail_area')).getByText(/m²$/).textContent ?? '';
}

function input(key: string): HTMLInputElement {
  const element = screen.getByTestId(`param-input-${key}`);
  if (!(element instanceof HTMLInputElement)) throw new Error(`param-input-${key} is not an input`);
  return element;
}

/** Types into a row's field and leaves it, which commits the edit (React's onBlur listens to focusout). */
function edit(key: string, text: string) {
  fireEvent.change(input(key), { target: { value: text } });
  fireEvent.focusOut(input(key));
}

function templateInput(key: string): number {
  const value = squareSailTemplate().parameters.find((parameter) => parameter.key === key)?.value;
  if (value === undefined) throw new Error(`the template has no input ${key}`);
  return value;
}

/** How many rows the engine itself recomputes when the template's side becomes 60 m (the screen reports that count). */
function rowsRecomputedBySide(): number {
  const session = createSheetSession(squareSailTemplate());
  try {
    const result = session.setInput('sail_side', '60 m');
    if (!result.ok) throw new Error(result.error.message);
    return result.recomputed.length;
  } finally {
    session.destroy();
  }
}

function isDisabled(testID: string): boolean {
  return screen.getByTestId(testID).getAttribute('aria-disabled') === 'true';
}

describe('SandboxScreen', () => {
  it('says what it is, that nothing is saved, and carries the caution beside the results', () => {
    renderScreen();
    expect(screen.getByTestId('sandbox-screen')).toBeTruthy();
    expect(screen.getByRole('heading', { name: 'Sizing sandbox' })).toBeTruthy();
    expect(screen.getByText('Standard square-sail template, evaluated in your browser. Nothing here is saved.')).toBeTruthy();
    const caution =
      "Preliminary sizing estimates. Use your project's own margin policy, higher-fidelity analysis and licensed engineering practice for design decisions.";
    expect(within(screen.getByTestId('key-figures')).getByText(caution)).toBeTruthy();
    expect(within(screen.getByTestId('parameter-list')).getByText(caution)).toBeTruthy();
  });

  it('shows the sail area of the template as the square of its own side length', () => {
    renderScreen();
    const side = templateInput('sail_side');
    // Geometry: the area of a square is its side squared.
    expect(shownArea()).toBe(`${side ** 2} m²`);
    expect(input('sail_side').value).toBe(String(side));
  });

  it('shows every key figure with its unit and no float noise', () => {
    renderScreen();
    // The template's rows carry their roles' names as keys, so each headline role's figure has its key.
    const headline = [...standardHeadline];
    expect(
      within(screen.getByTestId('key-figures'))
        .getAllByTestId(/^key-figure-/)
        .map((element) => element.getAttribute('data-testid')),
    ).toEqual(headline.map((key) => `key-figure-${key}`));
    for (const key of headline) {
      expect(figure(key)).not.toMatch(/\d{6,}|e-/);
    }
    expect(figure('areal_density')).toMatch(/g\/m²$/);
    expect(figure('characteristic_acceleration')).toMatch(/mm\/s²$/);
    expect(figure('sail_temperature')).toMatch(/ K$/);
    expect(figure('srp_force')).toMatch(/ N$/);
    expect(figure('system_margin')).toMatch(/kg.*% of allocation\nrequired: 15 %/);
  });

  it('recomputes the sail area when the side becomes "60 m"', () => {
    renderScreen();
    edit('sail_side', '60 m');
    // Geometry: a square of side 60 m has an area of 3600 m^2.
    expect(shownArea()).toBe('3600 m²');
    expect(input('sail_side').value).toBe('60');
    expect(screen.queryByTestId('param-error-sail_side')).toBeNull();
    expect(screen.getByText(`Last edit recomputed ${rowsRecomputedBySide()} rows.`)).toBeTruthy();
  });

  it('converts a value typed in another unit of the same dimension into the row unit', () => {
    renderScreen();
    edit('sail_side', '0.06 km');
    // SI: 1 km = 1000 m, so 0.06 km is 60 m and the square's area 3600 m^2.
    expect(input('sail_side').value).toBe('60');
    expect(shownArea()).toBe('3600 m²');
  });

  it('refuses "abc" beside the row and keeps the previous value', () => {
    renderScreen();
    const side = templateInput('sail_side');
    edit('sail_side', 'abc');
    const error = screen.getByTestId('param-error-sail_side').textContent ?? '';
    expect(error).toContain('sail_side');
    expect(error).toContain('"abc" is not a number');
    expect(error).toContain(`Kept ${side} m`);
    expect(input('sail_side').value).toBe('abc');
    expect(input('sail_side').getAttribute('aria-invalid')).toBe('true');
    expect(shownArea()).toBe(`${side ** 2} m²`);
    expect(isDisabled('undo')).toBe(true);
  });

  it('refuses a mass typed into a length row, naming both dimensions', () => {
    renderScreen();
    edit('sail_side', '25 kg');
    const error = screen.getByTestId('param-error-sail_side').textContent ?? '';
    expect(error).toContain('unit "m" expects m but "25 kg" is kg');
    expect(shownArea()).toBe(`${templateInput('sail_side') ** 2} m²`);
  });

  it('names an unknown unit', () => {
    renderScreen();
    edit('film_thickness', '25 furlongz');
    expect(screen.getByTestId('param-error-film_thickness').textContent).toContain('unknown unit "furlongz"');
  });

  it('clears a refused edit once the row gets a good value', () => {
    renderScreen();
    edit('film_thickness', 'thin');
    expect(screen.getByTestId('param-error-film_thickness')).toBeTruthy();
    edit('film_thickness', '25 um');
    expect(screen.queryByTestId('param-error-film_thickness')).toBeNull();
    expect(input('film_thickness').value).toBe('25');
  });

  it('undoes and redoes an edit, with the buttons enabled only when there is something to do', () => {
    renderScreen();
    expect(isDisabled('undo')).toBe(true);
    expect(isDisabled('redo')).toBe(true);
    edit('sail_side', '60');
    expect(isDisabled('undo')).toBe(false);

    fireEvent.click(screen.getByTestId('undo'));
    expect(shownArea()).toBe('1600 m²');
    expect(input('sail_side').value).toBe('40');
    expect(isDisabled('undo')).toBe(true);
    expect(isDisabled('redo')).toBe(false);

    fireEvent.click(screen.getByTestId('redo'));
    expect(shownArea()).toBe('3600 m²');
    expect(input('sail_side').value).toBe('60');
    expect(isDisabled('redo')).toBe(true);
  });

  it('resets to the template and drops the history', () => {
    renderScreen();
    edit('sail_side', '60');
    edit('boom_count', '6');
    fireEvent.click(screen.getByTestId('reset-template'));
    expect(input('sail_side').value).toBe(String(templateInput('sail_side')));
    expect(input('boom_count').value).toBe(String(templateInput('boom_count')));
    expect(isDisabled('undo')).toBe(true);
  });

  it('flags a system margin below the required one', () => {
    renderScreen();
    expect(within(screen.getByTestId('key-figure-system_margin')).queryByText('Below the required margin')).toBeNull();
    edit('mass_allocation', '30');
    const margin = figure('system_margin');
    // AIAA S-120A-2015: margin = allocation - predicted mass; the template's predicted mass is about 28.25 kg,
    // leaving about 1.75 kg, under 15 % of 30 kg.
    expect(margin).toMatch(/^System margin1\.75\d? kg/);
    expect(margin).toContain('Below the required margin');
  });

  it('shows formulas, constants with their source read-only, and notes on request', () => {
    renderScreen();
    const area = screen.getByTestId('param-sail_area');
    expect(within(area).getByText('=sail_side^2')).toBeTruthy();
    expect(within(area).queryByRole('textbox')).toBeNull();

    const light = screen.getByTestId('param-speed_of_light');
    // SI definition of the metre: c = 299 792 458 m/s exactly, shown with all its digits.
    expect(within(light).getByText('2.99792458 × 10⁸ m/s')).toBeTruthy();
    expect(within(light).getByText('Source: SI definition of the metre (exact)')).toBeTruthy();
    expect(screen.queryByTestId('param-input-speed_of_light')).toBeNull();

    const note = 'Area of a square of side sail_side (geometry).';
    expect(within(area).queryByText(note)).toBeNull();
    fireEvent.click(screen.getByTestId('param-note-sail_area'));
    expect(within(area).getByText(note)).toBeTruthy();
  });

  it('groups the rows by subsystem in the order of the sheet', () => {
    renderScreen();
    const headings = within(screen.getByTestId('parameter-list'))
      .getAllByRole('heading', { level: 3 })
      .map((heading) => heading.textContent);
    const subsystems = [...new Set(squareSailTemplate().parameters.map((parameter) => parameter.subsystem))];
    expect(subsystems.slice(0, 3)).toEqual(['Constants', 'Sail membrane', 'Booms']);
    expect(headings).toEqual(subsystems);
  });
});
