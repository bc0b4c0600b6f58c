import { fireEvent, screen, waitFor, within } from '@testing-library/dom';
import { act } from 'react';
import { QueryClientProvider } from '@tanstack/react-query';
import { EvidenceSection } from '@/components/sheet/evidence/evidence-section';
import { MaturityPicker } from '@/components/sheet/evidence/maturity-picker';
import type { Attachment, RowAttachments } from '@/shared/schemas/attachments';
import { demoSession, demoUser, mockFetch, setupQueryClient, type Route } from '../../helpers/api';
import { renderDom } from '../../helpers/render';

const craftId = '3c2b1a09-8f7e-4d6c-9b5a-4f3e2d1c0b9a';
const revisionId = '7d6c5b4a-3f2e-4d1c-8b0a-9f8e7d6c5b4a';
const listPath = `/api/crafts/${craftId}/revisions/${revisionId}/parameters/boom_mass/attachments`;

function file(id: number, change: Partial<Attachment> = {}): Attachment {
  return {
    id: `00000000-0000-4000-9000-${String(id).padStart(12, '0')}`,
    name: 'Boom datasheet.pdf',
    mediaType: 'application/pdf',
    size: 14_200,
    kind: 'datasheet',
    uploadedBy: { id: '5a0c1b2d-3e4f-4a5b-8c6d-7e8f9a0b1c2d', name: 'Kenji Hollis' },
    uploadedAt: '2026-11-20T16:30:12.000Z',
    removable: true,
    ...change,
  };
}

/** A stand-in for XMLHttpRequest that records the upload and lets the test report progress and answer. */
class FakeUpload {
  static last: FakeUpload | undefined;
  headers: Record<string, string> = {};
  url = '';
  body: FormData | undefined;
  status = 0;
  responseText = '';
  withCredentials = false;
  upload: {
    onprogress: ((event: { lengthComputable: boolean; loaded: number; total: number }) => void) | null;
    onload: (() => void) | null;
  } = { onprogress: null, onload: null };
  onload: (() => void) | null = null;
  onerror: (() => void) | null = null;
  open(_method: string, url: string) {
    this.url = url;
  }
  setRequestHeader(name: string, value: string) {
    this.headers[name] = value;
  }
  send(body: FormData) {
    this.body = body;
    FakeUpload.last = this;
  }
  progress(loaded: number, total: number) {
    act(() => this.upload.onprogress?.({ lengthComputable: true, loaded, total }));
  }
  sent() {
    act(() => this.upload.onload?.());
  }
  answer(status: number, body: unknown) {
    this.status = status;
    this.responseText = JSON.stringify(body);
    act(() => this.onload?.());
  }
}

function render(ui: React.ReactNode, routes: Record<string, Route>) {
  const fetchMock = mockFetch({ 'GET /api/auth/session': { status: 200, body: demoSession(demoUser) }, ...routes });
  const { queryClient } = setupQueryClient();
  renderDom(<QueryClientProvider client={queryClient}>{ui}</QueryClientProvider>);
  return fetchMock;
}

const section = <EvidenceSection craftId={craftId} revisionId={revisionId} rowKey="boom_mass" />;

beforeEach(() => {
  FakeUpload.last = undefined;
  (globalThis as { XMLHttpRequest: unknown }).XMLHttpRequest = FakeUpload;
});

describe('the Evidence section of a row', () => {
  it('lists each file with its kind, size, who and when, as a download link', async () => {
    const list: RowAttachments = {
      attachments: [file(2, { name: 'Weighing 1.pdf', kind: 'weighing_report', size: 812, uploadedBy: null }), file(1)],
    };
    render(section, { [`GET ${listPath}`]: { status: 200, body: list } });
    const items = await screen.findAllByTestId('row-evidence-item');
    expect(items.map((item) => item.textContent)).toEqual([
      expect.stringContaining('Weighing 1.pdfWeighing report · 812 B · A former member · 2026-11-20 16:30 UTC'),
      expect.stringContaining('Boom datasheet.pdfDatasheet · 14.2 kB · Kenji Hollis · 2026-11-20 16:30 UTC'),
    ]);
    const link = within(items[1] as HTMLElement).getByTestId('row-evidence-download');
    expect(link.tagName).toBe('A');
    expect(link.getAttribute('href')).toBe(`/api/crafts/${craftId}/attachments/${file(1).id}`);
    expect(link.getAttribute('download')).toBe('Boom datasheet.pdf');
  });

  it('says so when nothing is attached', async () => {
    render(section, { [`GET ${listPath}`]: { status: 200, body: { attachments: [] } } });
    expect(await screen.findByText('No datasheet, weighing report or test report attached yet.')).toBeTruthy();
  });

  it('uploads the picked file with the chosen kind, shows its progress, then lists it', async () => {
    let list: RowAttachments = { attachments: [] };
    render(section, { [`GET ${listPath}`]: () => ({ status: 200, body: list }) });
    await screen.findByText('No datasheet, weighing report or test report attached yet.');
    fireEvent.click(within(screen.getByTestId('row-evidence-kind')).getByRole('radio', { name: 'Weighing report' }));
    const picked = new File(['%PDF-1.4'], 'weighing.pdf', { type: 'application/pdf' });
    fireEvent.change(screen.getByTestId('row-evidence-attach-input'), { target: { files: [picked] } });

    await waitFor(() => expect(FakeUpload.last).toBeDefined());
    const upload = FakeUpload.last as FakeUpload;
    expect(upload.url).toBe(listPath);
    expect(upload.headers['x-csrf-token']).toBe('test-csrf-token');
    expect(upload.withCredentials).toBe(true);
    expect(upload.body?.get('kind')).toBe('weighing_report');
    expect((upload.body?.get('file') as File).name).toBe('weighing.pdf');

    upload.progress(512, 1024);
    const bar = await screen.findByRole('progressbar');
    expect(bar.getAttribute('aria-valuenow')).toBe('50');
    expect(screen.getByTestId('row-evidence-progress').textContent).toContain('Uploading weighing.pdf: 50 %');
    upload.sent();
    expect(screen.getByTestId('row-evidence-progress').textContent).toContain('Checking weighing.pdf…');

    list = { attachments: [file(3, { name: 'weighing.pdf', kind: 'weighing_report' })] };
    upload.answer(201, list.attachments[0]);
    expect(await screen.findByText('weighing.pdf')).toBeTruthy();
    await waitFor(() => expect(screen.queryByRole('progressbar')).toBeNull());
  });

  it("shows the server's reason when it refuses a file", async () => {
    render(section, { [`GET ${listPath}`]: { status: 200, body: { attachments: [] } } });
    await screen.findByText('No datasheet, weighing report or test report attached yet.');
    fireEvent.change(screen.getByTestId('row-evidence-attach-input'), { target: { files: [new File(['MZ'], 'spec.pdf')] } });
    await waitFor(() => expect(FakeUpload.last).toBeDefined());
    const message = 'spec.pdf is a Windows executable by its content; accepted here: a PDF';
    (FakeUpload.last as FakeUpload).answer(415, { error: { code: 'unsupported_file_type', message } });
    expect(await screen.findByText(message)).toBeTruthy();
  });

  it('removes a file after a confirmation, and shows why when the server keeps it', async () => {
    const fetchMock = render(section, {
      [`GET ${listPath}`]: { status: 200, body: { attachments: [file(1, { kind: 'weighing_report' })] } },
      [`DELETE ${listPath}/${file(1).id}`]: {
        status: 409,
        body: {
          error: { code: 'evidence_required', message: 'Row "boom_mass" is measured and "Boom datasheet.pdf" is its only weighing report' },
        },
      },
    });
    fireEvent.click(await screen.findByTestId('row-evidence-remove'));
    fireEvent.click(screen.getByTestId('row-evidence-remove-confirm'));
    expect(await screen.findByText(/is its only weighing report/)).toBeTruthy();
    expect(fetchMock.mock.calls.filter(([, init]) => init?.method === 'DELETE')).toHaveLength(1);
  });

  it('removes a file once confirmed and lists what is left', async () => {
    let list: RowAttachments = { attachments: [file(1)] };
    render(section, {
      [`GET ${listPath}`]: () => ({ status: 200, body: list }),
      [`DELETE ${listPath}/${file(1).id}`]: () => {
        list = { attachments: [] };
        return { status: 204 };
      },
    });
    fireEvent.click(await screen.findByTestId('row-evidence-remove'));
    expect(screen.getByText('Boom datasheet.pdf')).toBeTruthy();
    fireEvent.click(screen.getByTestId('row-evidence-remove-confirm'));
    expect(await screen.findByText('No datasheet, weighing report or test report attached yet.')).toBeTruthy();
  });

  it('gives a reader the list and the reason they may not attach, and no controls', async () => {
    render(section, {
      [`GET ${listPath}`]: {
        status: 200,
        body: { attachments: [file(1, { removable: false })], attachRefusal: 'This baseline is locked: its rows cannot change' },
      },
    });
    expect(await screen.findByText('This baseline is locked: its rows cannot change')).toBeTruthy();
    expect(screen.queryByTestId('row-evidence-attach')).toBeNull();
    expect(screen.queryByTestId('row-evidence-remove')).toBeNull();
  });
});

describe('the maturity of a mass row', () => {
  const maturities = [
    { id: 'layout', label: 'Layout' },
    { id: 'measured', label: 'Actual (measured)' },
  ];

  /** The picker of a row at layout maturity with these files attached; returns its onChange. */
  function renderPicker(attachments: Attachment[]) {
    const onChange = jest.fn();
    render(
      <MaturityPicker
        craftId={craftId}
        revisionId={revisionId}
        rowKey="boom_mass"
        maturities={maturities}
        value="layout"
        onChange={onChange}
      />,
      { [`GET ${listPath}`]: { status: 200, body: { attachments } } },
    );
    return onChange;
  }

  it('withholds the measured maturity until a weighing report is attached, and says why', async () => {
    renderPicker([file(1)]);
    const note = await screen.findByTestId('row-maturity-measured-note');
    expect(note.textContent).toBe('Actual (measured) is offered once a weighing report of this item is attached (see Evidence below).');
    expect(within(screen.getByTestId('row-maturity')).queryByRole('radio', { name: 'Actual (measured)' })).toBeNull();
  });

  it('offers it once a weighing report is attached', async () => {
    const onChange = renderPicker([file(1, { kind: 'weighing_report' })]);
    await waitFor(() => expect(screen.queryByTestId('row-maturity-measured-note')).toBeNull());
    fireEvent.click(await within(screen.getByTestId('row-maturity')).findByRole('radio', { name: 'Actual (measured)' }));
    expect(onChange).toHaveBeenCalledWith('measured');
  });
});
