import { screen, within } from '@testing-library/dom';
import { ImportPreviewView } from '@/components/exchange/import-preview';
import type { ImportPreview } from '@/shared/schemas/exchange';
import { renderDom } from '../helpers/render';

const preview: ImportPreview = {
  id: '11111111-2222-4333-8444-555555555555',
  craftId: '11111111-2222-4333-8444-666666666666',
  revisionId: '11111111-2222-4333-8444-777777777777',
  revisionLabel: 'Working draft',
  fileName: 'partner.xlsx',
  state: 'pending',
  createdAt: '2026-12-05T00:00:00.000Z',
  expiresAt: '2026-12-06T00:00:00.000Z',
  studyId: null,
  changed: [
    {
      key: 'sail_side',
      label: 'Sail side',
      subsystem: 'Sail membrane',
      cell: 'Parameters!A7',
      changes: [{ field: 'value', from: '45 m', to: '50 m' }],
    },
    {
      key: 'boom_length',
      label: 'Boom length',
      subsystem: 'Booms',
      cell: 'Parameters!A19',
      changes: [{ field: 'formula', from: '=sail_side * SQRT(2) / 2', to: '=sail_side * SQRT(2) / 2 * 1.01' }],
    },
  ],
  added: [{ key: 'hinge_margin', label: 'Hinge margin', subsystem: 'Booms', cell: 'Parameters!A70', definition: '0.25 kg' }],
  removed: [{ key: 'slew_time', label: 'Slew time', subsystem: 'Attitude control' }],
  problems: [{ cell: 'Parameters!E23', key: 'payload_mass', code: 'unknown_unit', message: 'payload_mass: unknown unit "furlongs"' }],
  ignored: [{ cell: 'Parameters!A71', key: 'boom_hinge_mass', reason: 'Rows of "Booms" are not shared with you' }],
};

describe('ImportPreviewView', () => {
  it('lists changes old → new with units, additions, removals, problems by cell and ignored rows with the reason', () => {
    renderDom(<ImportPreviewView preview={preview} />);
    expect(screen.getByText('2 changed (1 with a new formula), 1 added, 1 removed.')).toBeTruthy();
    const changed = screen.getByTestId('import-changed');
    expect(within(changed).getByText('45 m')).toBeTruthy();
    expect(within(changed).getByText('50 m')).toBeTruthy();
    expect(within(changed).getByText('Parameters!A19')).toBeTruthy();
    expect(within(screen.getByTestId('import-added')).getByText('Booms: 0.25 kg')).toBeTruthy();
    expect(within(screen.getByTestId('import-removed')).getByText('slew_time')).toBeTruthy();
    const problems = screen.getByTestId('import-problems');
    expect(within(problems).getByText('Parameters!E23')).toBeTruthy();
    expect(within(problems).getByText('payload_mass: unknown unit "furlongs"')).toBeTruthy();
    expect(within(screen.getByTestId('import-ignored')).getByText('Rows of "Booms" are not shared with you')).toBeTruthy();
  });

  it('says when nothing can be taken and leaves out empty groups', () => {
    renderDom(<ImportPreviewView preview={{ ...preview, changed: [], added: [], removed: [], ignored: [] }} />);
    expect(screen.getByText('The workbook changes nothing that can be taken.')).toBeTruthy();
    expect(screen.queryByTestId('import-changed')).toBeNull();
    expect(screen.getByTestId('import-problems')).toBeTruthy();
  });
});
