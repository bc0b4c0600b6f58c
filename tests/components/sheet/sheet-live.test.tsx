import { fireEvent, screen, waitFor } from '@testing-library/dom';
import { FakeEventSource } from '../helpers/event-source';
import { craftId, renderSheet, revisionId, setWindowWidth } from './sheet-fixtures';

const statusText = () => screen.getByTestId('sheet-live-status').textContent ?? '';
const valueText = (key: string) => screen.getByTestId(`sheet-value-${key}`).textContent ?? '';

describe('SheetScreen live updates', () => {
  beforeEach(() => setWindowWidth(1280));
  afterEach(() => {
    delete (globalThis as { EventSource?: unknown }).EventSource;
  });

  it('polls, and says so, where the browser has no events stream', async () => {
    renderSheet();
    await screen.findByTestId('sheet-input-sail_side');
    expect(statusText()).toContain('Checking every 2 s');
  });

  it('merges others’ edits from the events stream without losing the row the person is typing in', async () => {
    (globalThis as { EventSource?: unknown }).EventSource = FakeEventSource;
    const { server } = renderSheet();
    await screen.findByTestId('sheet-input-sail_side');
    const source = FakeEventSource.last;
    if (source === undefined) throw new Error('no events stream opened');
    expect(source.url).toBe(`/api/crafts/${craftId}/events`);
    source.open();
    expect(statusText()).toContain('Live');

    fireEvent.change(screen.getByTestId('sheet-input-sail_side'), { target: { value: '50' } });
    server.othersSet('boom_count', 6, 'Kenji Hollis');
    server.othersSet('sail_side', 45, 'Amara Osei');
    source.send('parameters_changed', {
      type: 'parameters_changed',
      craftId,
      revisionId,
      keys: ['boom_count', 'sail_side'],
      by: { id: 'f4c1a2b3-5d6e-4f70-8a9b-0c1d2e3f4a5b', name: 'Kenji Hollis' },
      at: '2026-12-02T10:00:00.000Z',
    });
    await waitFor(() => expect((screen.getByTestId('sheet-input-boom_count') as HTMLInputElement).value).toBe('6'));
    // The person's own text stays in the field and in the engine: 50 m × 50 m = 2500 m².
    expect((screen.getByTestId('sheet-input-sail_side') as HTMLInputElement).value).toBe('50');
    expect(valueText('sail_area')).toBe('2500 m²');

    // Saving it now is checked against the version the person started from, so Amara's change is not lost.
    fireEvent.keyDown(screen.getByTestId('sheet-input-sail_side'), { key: 'Enter' });
    expect((await screen.findByTestId('sheet-conflict-sail_side')).textContent).toContain('Amara Osei');

    source.drop();
    expect(statusText()).toContain('Checking every 2 s');
  });
});
