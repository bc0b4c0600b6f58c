import { execFileSync } from 'node:child_process';

/**
 * pdf-parse runs PDF.js, whose worker needs dynamic import(), which jest's module sandbox refuses: the
 * text is extracted by a plain Node process instead, the PDF on its stdin and the pages as JSON on its stdout.
 */
const extractor = `
const { PDFParse } = require('pdf-parse');
const chunks = [];
process.stdin.on('data', (chunk) => chunks.push(chunk));
process.stdin.on('end', async () => {
  const parser = new PDFParse({ data: new Uint8Array(Buffer.concat(chunks)) });
  const text = await parser.getText();
  await parser.destroy();
  process.stdout.write(JSON.stringify(text.pages.map((page) => page.text)));
});
`;

/** The text of each page of a PDF, as a reader would extract it. */
export function pdfPages(pdf: Buffer): string[] {
  const output = execFileSync(process.execPath, ['-e', extractor], { input: pdf, cwd: process.cwd(), maxBuffer: 64 * 1024 * 1024 });
  return JSON.parse(output.toString('utf8')) as string[];
}
