import { readFileSync } from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import type { BrowserContext } from 'playwright-core';
import { outputDir } from './browser.js';

const pdfjsBuild = fileURLToPath(new URL('../../node_modules/pdfjs-dist/build/', import.meta.url));
/** A made-up origin the viewer page lives on: every request to it is answered here, none reaches a network. */
const origin = 'http://pdf-pages.invalid';

/**
 * The viewer: a module script (kept as text, so the test runner's bundler leaves its import alone)
 * that draws each page asked for on a canvas of its own and answers the pages' text.
 */
const viewerPage = `<!doctype html>
<html>
  <body style="margin:0">
    <script type="module">
      import * as pdfjs from '${origin}/pdf.min.mjs';
      pdfjs.GlobalWorkerOptions.workerSrc = '${origin}/pdf.worker.min.mjs';
      window.renderPages = async (pages) => {
        const pdf = await pdfjs.getDocument({ url: '${origin}/document.pdf' }).promise;
        const texts = [];
        for (const number of pages) {
          const page = await pdf.getPage(number);
          const viewport = page.getViewport({ scale: 1.5 });
          const canvas = document.createElement('canvas');
          canvas.id = 'page-' + number;
          canvas.width = Math.ceil(viewport.width);
          canvas.height = Math.ceil(viewport.height);
          canvas.style.display = 'block';
          document.body.append(canvas);
          await page.render({ canvasContext: canvas.getContext('2d'), viewport }).promise;
          const content = await page.getTextContent();
          texts.push(content.items.map((item) => item.str ?? '').join(' '));
        }
        return texts;
      };
    </script>
  </body>
</html>`;

/**
 * Draws pages of a PDF with pdf.js (pdfjs-dist) in the browser, one canvas per page, and saves each
 * as `<name>-<page>.png` in the browser tests' output folder. Answers each page's text as pdf.js
 * reads it, so a test can check the picture is of the document it expects.
 */
export async function pdfPageScreenshots(
  context: BrowserContext,
  pdf: Buffer,
  pages: readonly number[],
  name: string,
): Promise<{ files: string[]; texts: string[] }> {
  const viewer = await context.newPage();
  try {
    await viewer.route(`${origin}/**`, async (route) => {
      const { pathname } = new URL(route.request().url());
      if (pathname === '/') {
        await route.fulfill({ contentType: 'text/html', body: viewerPage });
      } else if (pathname === '/document.pdf') {
        await route.fulfill({ contentType: 'application/pdf', body: pdf });
      } else if (pathname === '/pdf.min.mjs' || pathname === '/pdf.worker.min.mjs') {
        await route.fulfill({ contentType: 'text/javascript', body: readFileSync(path.join(pdfjsBuild, pathname.slice(1))) });
      } else {
        await route.fulfill({ status: 404, body: '' });
      }
    });
    await viewer.goto(`${origin}/`);
    await viewer.waitForFunction(() => 'renderPages' in window);
    const texts = await viewer.evaluate(
      (pages) => (window as unknown as { renderPages(pages: number[]): Promise<string[]> }).renderPages(pages),
      [...pages],
    );
    const files: string[] = [];
    for (const number of pages) {
      const file = path.join(outputDir, `${name}-${number}.png`);
      await viewer.locator(`#page-${number}`).screenshot({ path: file });
      files.push(file);
    }
    return { files, texts };
  } finally {
    await viewer.close();
  }
}
