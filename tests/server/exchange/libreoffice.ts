import { execFile } from 'node:child_process';
import fs from 'node:fs/promises';
import os from 'node:os';
import path from 'node:path';
import { promisify } from 'node:util';

const run = promisify(execFile);

/** LibreOffice's settings that make Calc recalculate every formula of a workbook it opens (never trust cached values). */
const RECALCULATE_ON_LOAD = `<?xml version="1.0" encoding="UTF-8"?>
<oor:items xmlns:oor="http://openoffice.org/2001/registry" xmlns:xs="http://www.w3.org/2001/XMLSchema" xmlns:xsi="http://www.w3.org/2001/XMLSchema-instance">
<item oor:path="/org.openoffice.Office.Calc/Formula/Load"><prop oor:name="OOXMLRecalcMode" oor:op="fuse"><value>0</value></prop></item>
<item oor:path="/org.openoffice.Office.Calc/Formula/Load"><prop oor:name="ODFRecalcMode" oor:op="fuse"><value>0</value></prop></item>
</oor:items>
`;

/**
 * Opens a workbook in LibreOffice Calc (headless, with a user profile of its own so that no other LibreOffice
 * on the machine and no earlier run interferes), recalculates every formula on load, and saves it again as
 * .xlsx: the cached results in the returned file are LibreOffice's own. Gives up after `timeoutMs`.
 */
export async function recalculateWithLibreOffice(workbook: Buffer, timeoutMs = 120_000): Promise<Buffer> {
  const folder = await fs.mkdtemp(path.join(os.tmpdir(), 'trimsheet-calc-'));
  try {
    const profile = path.join(folder, 'profile');
    await fs.mkdir(path.join(profile, 'user'), { recursive: true });
    await fs.writeFile(path.join(profile, 'user', 'registrymodifications.xcu'), RECALCULATE_ON_LOAD);
    const input = path.join(folder, 'export.xlsx');
    const output = path.join(folder, 'out');
    await fs.writeFile(input, workbook);
    await run(
      'soffice',
      [
        `-env:UserInstallation=file://${profile}`,
        '--headless',
        '--norestore',
        '--nologo',
        '--nodefault',
        '--convert-to',
        'xlsx:Calc MS Excel 2007 XML',
        '--outdir',
        output,
        input,
      ],
      { timeout: timeoutMs, killSignal: 'SIGKILL', env: { ...process.env, HOME: folder } },
    );
    return await fs.readFile(path.join(output, 'export.xlsx'));
  } finally {
    await fs.rm(folder, { recursive: true, force: true });
  }
}
