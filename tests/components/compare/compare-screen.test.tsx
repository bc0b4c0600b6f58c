import { fireEvent, screen, waitFor, within } from '@testing-library/dom';
import { FakeEventSource } from '../helpers/event-source';
import { setWindowWidth } from '../sheet/sheet-fixtures';
import {
  baseline,
  comparePath,
  comparison,
  draft,
  draftId,
  gets,
  movedTotalMass,
  olderBaseline,
  renderCompare,
  study,
} from './compare-fixtures';

const text = (testID: string) => screen.getByTestId(testID).textContent ?? '';

/** The test ids of the shares on screen, top to bottom. */
function shareOrder(): string[] {
  return Array.from(document.querySelectorAll('[data-testid^="compare-share-"]'), (element) => element.getAttribute('data-testid') ?? '');
}

describe('CompareScreen on a wide screen', () => {
  beforeEach(() => setWindowWidth(1280));

  it('compares the latest baseline with the working draft by default: rows added, removed and changed, and the outputs', async () => {
    const fetchMock = renderCompare();
    await screen.findByTestId('compare-output-sail_area');
    expect(gets(fetchMock, comparePath(baseline.id, draftId))).toBe(1);
    expect(within(screen.getByTestId('compare-from')).getByRole('radio', { name: 'PDR · baseline' }).getAttribute('aria-checked')).toBe(
      'true',
    );
    expect(
      within(screen.getByTestId('compare-to')).getByRole('radio', { name: 'Working draft · draft' }).getAttribute('aria-checked'),
    ).toBe('true');
    expect(text('compare-row-payload_margin')).toContain('2 kg');
    expect(text('compare-row-old_harness')).toContain('1.5 kg');
    const sailSide = text('compare-row-sail_side');
    expect(sailSide).toContain('40 m');
    expect(sailSide).toContain('50 m');
    expect(sailSide).toContain('estimated');
    expect(sailSide).toContain('calculated');
    // 1600 m² → 2500 m²: +900 m², 900 / 1600 = +56.25 %, shown to three digits.
    const area = text('compare-output-sail_area');
    expect(area).toContain('1600 m²');
    expect(area).toContain('2500 m²');
    expect(area).toContain('+900 m²');
    expect(area).toContain('+56.3 %');
    expect(screen.getByTestId('compare-outputs-table')).toBeTruthy();
    expect(text('compare-caution')).toContain('Preliminary sizing estimates');
  });

  it('shows changed outputs only until the person asks for all of them, and narrows by subsystem and search', async () => {
    renderCompare();
    await screen.findByTestId('compare-output-sail_area');
    expect(screen.queryByTestId('compare-output-boom_length')).toBeNull();
    expect(text('compare-outputs-heading')).toContain('2 of 3');
    fireEvent.click(screen.getByTestId('compare-changed-only'));
    expect(text('compare-output-boom_length')).toContain('28.28 m');
    expect(text('compare-outputs-heading')).toContain('3 of 3');

    fireEvent.click(screen.getByRole('radio', { name: 'Sail membrane' }));
    expect(screen.getByTestId('compare-output-sail_area')).toBeTruthy();
    expect(screen.queryByTestId('compare-output-total_mass')).toBeNull();
    expect(screen.getByTestId('compare-row-sail_side')).toBeTruthy();
    expect(screen.queryByTestId('compare-row-payload_margin')).toBeNull();

    fireEvent.click(screen.getByRole('radio', { name: 'All subsystems' }));
    fireEvent.change(screen.getByTestId('compare-output-search'), { target: { value: 'MASS' } });
    expect(screen.getByTestId('compare-output-total_mass')).toBeTruthy();
    expect(screen.queryByTestId('compare-output-sail_area')).toBeNull();
  });

  it('asks the server what moved an output and shows the changed inputs largest share first, then the remainder', async () => {
    const fetchMock = renderCompare({
      routes: {
        [`GET ${comparePath(baseline.id, draftId, 'total_mass')}`]: { status: 200, body: { ...comparison, moved: movedTotalMass } },
      },
    });
    fireEvent.click(await screen.findByTestId('compare-pick-total_mass'));
    const panel = await screen.findByTestId('compare-moved');
    await within(panel).findByTestId('compare-share-sail_side');
    expect(gets(fetchMock, comparePath(baseline.id, draftId, 'total_mass'))).toBe(1);
    // By size whatever the sign: 1.5 kg, −0.4 kg, 0.3 kg.
    expect(shareOrder()).toEqual(['compare-share-sail_side', 'compare-share-film_thickness', 'compare-share-boom_density']);
    expect(text('compare-share-sail_side')).toContain('40 m');
    expect(text('compare-share-sail_side')).toContain('+1.5 kg');
    // 1.5 of the 2 kg change.
    expect(text('compare-share-sail_side')).toContain('75 %');
    expect(text('compare-share-film_thickness')).toContain('−0.4 kg');
    expect(text('compare-remainder')).toContain('+0.6 kg');
    expect(text('compare-moved-other')).toContain('Payload margin (payload_margin): new in "to"');
    expect(screen.getByTestId('compare-moved-chart')).toBeTruthy();

    fireEvent.click(screen.getByTestId('compare-moved-close'));
    await waitFor(() => expect(screen.queryByTestId('compare-moved')).toBeNull());
  });

  it('opens a linked comparison as the address names it, with what moved its output', async () => {
    const fetchMock = renderCompare({
      search: `?from=${study.id}&to=${draftId}&output=total_mass`,
      routes: {
        [`GET ${comparePath(study.id, draftId)}`]: { status: 200, body: { ...comparison, from: study } },
        [`GET ${comparePath(study.id, draftId, 'total_mass')}`]: {
          status: 200,
          body: { ...comparison, from: study, moved: movedTotalMass },
        },
      },
    });
    await screen.findByTestId('compare-share-sail_side');
    expect(within(screen.getByTestId('compare-from')).getByRole('radio', { name: 'Wider sail · study' }).getAttribute('aria-checked')).toBe(
      'true',
    );
    expect(gets(fetchMock, comparePath(baseline.id, draftId))).toBe(0);
  });

  it('compares another pair when the person picks another revision', async () => {
    const fetchMock = renderCompare({
      routes: { [`GET ${comparePath(olderBaseline.id, draftId)}`]: { status: 200, body: { ...comparison, from: olderBaseline } } },
    });
    await screen.findByTestId('compare-output-sail_area');
    fireEvent.click(within(screen.getByTestId('compare-from')).getByRole('radio', { name: 'SRR · baseline' }));
    await waitFor(() => expect(gets(fetchMock, comparePath(olderBaseline.id, draftId))).toBe(1));
    await waitFor(() => expect(text('compare-pair')).toContain('SRR · baseline'));
  });

  it('keeps the comparison on screen when the server cannot say what moved an output', async () => {
    renderCompare({
      routes: {
        [`GET ${comparePath(baseline.id, draftId, 'sail_area')}`]: {
          status: 400,
          body: { error: { code: 'invalid_output', message: 'Invalid input: query.output sail_area has no value on one side' } },
        },
      },
    });
    fireEvent.click(await screen.findByTestId('compare-pick-sail_area'));
    const panel = await screen.findByTestId('compare-moved');
    await waitFor(() => expect(panel.textContent).toContain('Cannot say what moved Sail area'));
    expect(panel.textContent).toContain('has no value on one side');
    expect(screen.getByTestId('compare-output-total_mass')).toBeTruthy();
  });

  it('says so when a revision is not in the craft (404)', async () => {
    const missing = '0a1b2c3d-4e5f-4a6b-8c7d-9e0f1a2b3c4d';
    renderCompare({
      search: `?from=${missing}&to=${draftId}`,
      routes: {
        [`GET ${comparePath(missing, draftId)}`]: { status: 404, body: { error: { code: 'not_found', message: 'Revision not found' } } },
      },
    });
    expect((await screen.findByRole('alert')).textContent).toContain('No such revision');
    expect(screen.queryByRole('button', { name: 'Try again' })).toBeNull();
  });

  it('shows the server’s words when it refuses the request (400)', async () => {
    renderCompare({
      search: `?from=not-a-revision&to=${draftId}`,
      routes: {
        [`GET ${comparePath('not-a-revision', draftId)}`]: {
          status: 400,
          body: { error: { code: 'invalid_input', message: 'Invalid input: query.from must be a UUID' } },
        },
      },
    });
    const alert = await screen.findByRole('alert');
    expect(alert.textContent).toContain('Could not compare these revisions');
    expect(alert.textContent).toContain('query.from must be a UUID');
  });

  it('says there is nothing to compare before any baseline or study exists', async () => {
    renderCompare({ revisions: [{ ...draft, parentId: null }] });
    expect(await screen.findByText('Nothing to compare yet')).toBeTruthy();
  });
});

describe('CompareScreen on a phone', () => {
  beforeEach(() => setWindowWidth(390));

  it('shows rows and outputs as cards, without the wide table', async () => {
    renderCompare({
      routes: {
        [`GET ${comparePath(baseline.id, draftId, 'total_mass')}`]: { status: 200, body: { ...comparison, moved: movedTotalMass } },
      },
    });
    const card = await screen.findByTestId('compare-output-sail_area');
    expect(screen.queryByRole('table')).toBeNull();
    expect(card.textContent).toContain('1600 m² → 2500 m²');
    expect(card.textContent).toContain('Change +900 m² (+56.3 %)');
    expect(text('compare-row-sail_side')).toContain('40 m → 50 m');
    fireEvent.click(screen.getByTestId('compare-pick-total_mass'));
    await screen.findByTestId('compare-share-sail_side');
    expect(shareOrder()).toEqual(['compare-share-sail_side', 'compare-share-film_thickness', 'compare-share-boom_density']);
    expect(screen.queryByRole('table')).toBeNull();
  });
});

describe('CompareScreen live', () => {
  beforeEach(() => setWindowWidth(1280));
  afterEach(() => {
    delete (globalThis as { EventSource?: unknown }).EventSource;
  });

  it('compares again when an edit to the revision compared to is saved, and not for other revisions', async () => {
    (globalThis as { EventSource?: unknown }).EventSource = FakeEventSource;
    const fetchMock = renderCompare();
    await screen.findByTestId('compare-output-sail_area');
    const source = FakeEventSource.last;
    if (source === undefined) throw new Error('the screen listens to the events stream');
    source.open();
    const event = (revisionId: string) => ({
      type: 'parameters_changed',
      craftId: draft.craftId,
      revisionId,
      keys: ['sail_side'],
      by: null,
      at: '2026-12-01T10:00:00.000Z',
    });
    source.send('parameters_changed', event(study.id));
    expect(gets(fetchMock, comparePath(baseline.id, draftId))).toBe(1);
    source.send('parameters_changed', event(draftId));
    await waitFor(() => expect(gets(fetchMock, comparePath(baseline.id, draftId))).toBe(2));
  });
});
