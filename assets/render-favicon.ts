/**
 * Draws assets/favicon.png from the mark's geometry (components/ui/sail-mark-shape.ts) in Debian's Chromium,
 * and a sheet of the mark at tab and icon sizes (16, 22 and 32 px, magnified pixel for pixel) to
 * tests/artifacts/sail-mark-sizes.png to judge legibility. Run: `npx tsx assets/render-favicon.ts`.
 * The web build makes favicon.ico (16, 32, 48 px) from the PNG: 96 px scales to each by a whole factor.
 */
import fs from 'node:fs';
import path from 'node:path';
import type { Page } from 'playwright-core';
import {
  booms,
  boomWidth,
  hubDot,
  litQuadrant,
  membraneOutline,
  sailMarkColors,
  sailMarkSize,
  shadedQuadrants,
  type SailMarkBackdrop,
} from '@/components/ui/sail-mark-shape';
import { colors } from '@/components/ui/theme';
import { artifactsDir, launchBrowser } from '@/tests/e2e/browser';

const faviconSize = 96;
const checkedSizes = [16, 22, 32];
const magnification = 6;

/** The mark as SVG text; `rim` rings the membrane in the ground colour (the favicon's, for dark tab bars). */
function markSvg(size: number, backdrop: SailMarkBackdrop, rim = false): string {
  const color = sailMarkColors(backdrop);
  return [
    `<svg xmlns="http://www.w3.org/2000/svg" width="${size}" height="${size}" viewBox="0 0 ${sailMarkSize} ${sailMarkSize}">`,
    rim ? `<path d="${membraneOutline}" fill="none" stroke="${colors.ground}" stroke-width="4" stroke-linejoin="round"/>` : '',
    `<path d="${shadedQuadrants}" fill="${color.membrane}"/>`,
    `<path d="${litQuadrant}" fill="${color.lit}"/>`,
    `<path d="${booms}" stroke="${color.booms}" stroke-width="${boomWidth}" stroke-linecap="round"/>`,
    `<circle cx="${hubDot.cx}" cy="${hubDot.cy}" r="${hubDot.r}" fill="${color.booms}"/>`,
    '</svg>',
  ].join('');
}

async function shoot(page: Page, html: string, width: number, height: number): Promise<Buffer> {
  await page.setViewportSize({ width, height });
  await page.setContent(`<!doctype html><html><body style="margin:0">${html}</body></html>`);
  return page.screenshot({ omitBackground: true, clip: { x: 0, y: 0, width, height } });
}

/** The mark at each checked size on each backdrop, at real pixels (one row per backdrop). */
function sizesSheet(): { html: string; width: number; height: number } {
  const pad = 8;
  const width = checkedSizes.reduce((sum, size) => sum + size + pad, pad);
  const rowHeight = Math.max(...checkedSizes) + 2 * pad;
  // The mark for light and for ink-blue grounds, then the favicon (rimmed) on a dark tab bar.
  const variants = [
    { backdrop: 'ground', rim: false, background: colors.ground },
    { backdrop: 'ink', rim: false, background: colors.ink },
    { backdrop: 'ground', rim: true, background: '#202124' },
  ] as const;
  const rows = variants.map(({ backdrop, rim, background }) => {
    const marks = checkedSizes.map((size) => `<span style="margin-left:${pad}px">${markSvg(size, backdrop, rim)}</span>`).join('');
    return `<div style="display:flex;align-items:center;height:${rowHeight}px;background:${background}">${marks}</div>`;
  });
  return { html: rows.join(''), width, height: variants.length * rowHeight };
}

async function main() {
  const browser = await launchBrowser();
  try {
    const page = await browser.newPage({ deviceScaleFactor: 1 });
    const favicon = await shoot(page, markSvg(faviconSize, 'ground', true), faviconSize, faviconSize);
    fs.writeFileSync(path.resolve(__dirname, 'favicon.png'), favicon);

    const sheet = sizesSheet();
    const real = await shoot(page, sheet.html, sheet.width, sheet.height);
    const magnified = `<img src="data:image/png;base64,${real.toString('base64')}" style="display:block;width:${sheet.width * magnification}px;image-rendering:pixelated">`;
    const shot = await shoot(page, magnified, sheet.width * magnification, sheet.height * magnification);
    fs.writeFileSync(path.join(artifactsDir, 'sail-mark-sizes.png'), shot);
  } finally {
    await browser.close();
  }
}

void main();
