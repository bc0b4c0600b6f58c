import fs from 'node:fs';
import ExcelJS from 'exceljs';
import { importPreviewSchema } from '@/shared/schemas/exchange';
import { workbookBomb } from '@/tests/server/exchange/workbook-files';
import { revisionPath } from './api';
import { medianMilliseconds } from './statistics';

/**
 * Spreadsheet exchange on the running server: the export of a large revision as a workbook, the import of that
 * workbook with one cell changed (upload, checks, parsing and the stored preview), and the server's resident
 * memory while it refuses a zip bomb (a 400 MB worksheet in about 1 MB that lies about its size), sampled from
 * /proc every few milliseconds for the server process and its children.
 */
export interface ExchangeFigures {
  exportMedian: number;
  importMedian: number;
  workbookBytes: number;
  bomb: { bytes: number; status: number; peakRssDeltaBytes: number | undefined };
}

/** Resident memory of a process and its descendants (Linux /proc), in bytes; undefined elsewhere. */
function residentBytes(pid: number): number | undefined {
  try {
    const status = fs.readFileSync(`/proc/${pid}/status`, 'utf8');
    const own = Number(/VmRSS:\s+(\d+) kB/.exec(status)?.[1] ?? 0) * 1024;
    const children = fs
      .readFileSync(`/proc/${pid}/task/${pid}/children`, 'utf8')
      .trim()
      .split(/\s+/)
      .filter(Boolean)
      .map((child) => residentBytes(Number(child)) ?? 0);
    return own + children.reduce((sum, bytes) => sum + bytes, 0);
  } catch {
    return undefined;
  }
}

function upload(url: string, token: string, bytes: Buffer, fileName: string): Promise<Response> {
  const form = new FormData();
  form.append('file', new Blob([new Uint8Array(bytes)]), fileName);
  return fetch(url, { method: 'POST', headers: { authorization: `Bearer ${token}` }, body: form });
}

/** Medians of 10 exports and 10 imports of the revision, and the peak memory of one refusal of a zip bomb. */
export async function benchExchange(
  appUrl: string,
  token: string,
  revision: { craftId: string; revisionId: string; rows: number },
  serverPid: number | undefined,
): Promise<ExchangeFigures> {
  const base = `${appUrl}${revisionPath(revision.craftId, revision.revisionId)}`;
  // The bomb first, while the server has not yet grown its heap on the large workbooks.
  const bomb = await workbookBomb(400, 'lie');
  const before = serverPid === undefined ? undefined : residentBytes(serverPid);
  let peak = before ?? 0;
  const sampler = setInterval(() => {
    peak = Math.max(peak, (serverPid === undefined ? undefined : residentBytes(serverPid)) ?? 0);
  }, 3);
  const refused = await upload(`${base}/imports`, token, bomb, 'bomb.xlsx');
  await refused.text();
  clearInterval(sampler);
  let exported = Buffer.alloc(0);
  const exportMedian = await medianMilliseconds(10, async () => {
    const response = await fetch(`${base}/export.xlsx`, { headers: { authorization: `Bearer ${token}` } });
    if (!response.ok) throw new Error(`GET ${base}/export.xlsx: ${response.status} ${(await response.text()).slice(0, 300)}`);
    exported = Buffer.from(await response.arrayBuffer());
  });

  // A partner's edit: one value changed, so that the preview has a change to show.
  const workbook = new ExcelJS.Workbook();
  await workbook.xlsx.load(exported as unknown as ExcelJS.Buffer);
  const parameters = workbook.getWorksheet('Parameters');
  const value = parameters?.getCell('D7');
  if (value === undefined || typeof value.value !== 'number') throw new Error('the exported workbook has no value in Parameters!D7');
  value.value = value.value * 1.1;
  const edited = Buffer.from(await workbook.xlsx.writeBuffer());
  const importMedian = await medianMilliseconds(10, async () => {
    const response = await upload(`${base}/imports`, token, edited, 'partner.xlsx');
    if (response.status !== 201) throw new Error(`POST ${base}/imports: ${response.status} ${(await response.text()).slice(0, 300)}`);
    const preview = importPreviewSchema.parse(await response.json());
    if (preview.changed.length !== 1) throw new Error(`the preview shows ${preview.changed.length} changed rows, not 1`);
  });

  return {
    exportMedian,
    importMedian,
    workbookBytes: exported.length,
    bomb: { bytes: bomb.length, status: refused.status, peakRssDeltaBytes: before === undefined ? undefined : peak - before },
  };
}
