import { Decimal } from 'decimal.js';
import { chromium } from 'playwright-core';
import type { ControlStatus, Verdict } from '../../../contract/result.js';
import { projectStateLabels, type ProjectState } from '../../../contract/review.js';
import { dec, text } from '../compliance/numbers.js';
import type { PackageInput } from './package-input.js';

/** Debian's Chromium, the one `npm start` and `npm test` install (service/ops/system.mjs). */
export const chromiumPath = '/usr/bin/chromium';

/** The longest a launch, the page's load or the printing may take before the package fails. */
const stepTimeoutMs = 60_000;

const chromiumArgs = ['--headless', '--no-sandbox', '--disable-gpu', '--no-first-run', '--disable-background-networking', '--disable-sync'];

function escape(text: string | number | null | undefined): string {
  return String(text ?? '').replace(
    /[&<>"']/g,
    (character) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[character]!,
  );
}

const verdictWords: Record<Verdict, string> = {
  complies: 'Complies',
  'does-not-comply': 'Does not comply',
  incomplete: 'Incomplete: items remain to verify',
};

const controlWords: Record<ControlStatus, string> = {
  met: 'Met',
  'not-met': 'Not met',
  'exception-claimed': 'Exception claimed',
  'to-verify': 'To verify',
  'not-required': 'Not required',
};

function editionTitle(id: string): string {
  const ashrae = /^ashrae-90\.1-(\d{4})$/.exec(id);
  if (ashrae) return `ASHRAE/IES 90.1-${ashrae[1]}`;
  const iecc = /^iecc-(\d{4})$/.exec(id);
  return iecc ? `IECC ${iecc[1]}` : id;
}

/** A decimal as people read it: rounded to two places at most (half away from zero), thousands grouped. */
export function figure(value: string | null | undefined, unit = ''): string {
  if (value === null || value === undefined) return '—';
  const rounded = text(dec(value).toDecimalPlaces(2, Decimal.ROUND_HALF_UP));
  const [whole = '', fraction] = rounded.replace(/^-/, '').split('.');
  const grouped = whole.replace(/\B(?=(\d{3})+(?!\d))/g, ',');
  const shown = `${rounded.startsWith('-') ? '−' : ''}${grouped}${fraction ? `.${fraction}` : ''}`;
  return unit ? `${shown} ${unit}` : shown;
}

/** A figure with its unit, or a level's short name, reads on one line. */
const unbroken = /^(−?[\d,.]+( [^\s]+)?|Level \d+)$/;

function rows(cells: (string | null | undefined)[][]): string {
  return cells
    .map((row) => `<tr>${row.map((cell) => `<td${unbroken.test(cell ?? '') ? ' class="figure"' : ''}>${escape(cell)}</td>`).join('')}</tr>`)
    .join('');
}

function dateWords(iso: string): string {
  return new Date(iso).toLocaleString('en-US', { dateStyle: 'long', timeStyle: 'short', timeZone: 'UTC' }) + ' UTC';
}

/** The print view of a package: the same facts as the Word document, laid out for paper. */
export function packageHtml(input: PackageInput): string {
  const { project, result, revision } = input;
  const area = result.units === 'si' ? 'm²' : 'ft²';
  const exterior = result.exterior;
  const spaces = result.interior.spaces;
  const cover: [string, string | null | undefined][] = [
    ['Address', project.address],
    ['Jurisdiction', project.jurisdiction],
    ['Code edition', editionTitle(result.edition)],
    ['Compliance method', result.method === 'space-by-space' ? 'Space by space' : 'Building area'],
    ['Units', result.units === 'si' ? 'Metric (SI)' : 'Inch-pound'],
    ['Exterior lighting zone', project.lightingZone === null ? 'Not set' : `Zone ${project.lightingZone}`],
    ['Prepared by', [project.designerName, project.designerFirm].filter(Boolean).join(', ') || revision.madeBy],
    ['Submittal revision', `${revision.number}${revision.draft ? ' (draft)' : ''}`],
    ['Made', dateWords(revision.madeAt)],
    ['Design state', projectStateLabels[project.state as ProjectState] ?? project.state],
  ];
  const controls = spaces.flatMap((space) =>
    space.controls.map((control) => [space.name, control.label, controlWords[control.status], control.reason, control.section]),
  );
  return `<!doctype html>
<html lang="en"><head><meta charset="utf-8"><title>${escape(project.name)} — submittal revision ${revision.number}</title>
<style>
  @page { size: Letter; margin: 18mm 14mm 20mm; }
  body { font-family: 'DejaVu Sans', 'Liberation Sans', sans-serif; font-size: 9.5pt; color: #1b1b1b; }
  h1 { font-size: 20pt; margin: 0 0 4mm; } h2 { font-size: 13pt; margin: 7mm 0 2mm; border-bottom: 1px solid #7a7a7a; }
  table { border-collapse: collapse; width: 100%; } th, td { border: 1px solid #b5b5b5; padding: 1.2mm 1.6mm; text-align: left; vertical-align: top; }
  th { background: #e8efee; } thead { display: table-header-group; } tr { break-inside: avoid; }
  .draft { font-weight: bold; color: #8a1c1c; font-size: 12pt; }
  .cover th { width: 45mm; } td.figure { white-space: nowrap; } .fingerprint { font-family: 'DejaVu Sans Mono', monospace; word-break: break-all; }
</style></head><body>
${revision.draft ? '<p class="draft">DRAFT — not for permit</p>' : ''}
<h1>${escape(project.name)}</h1>
<p>Lighting energy-code compliance submittal, revision ${revision.number}.</p>
<table class="cover"><tbody>${cover.map(([label, value]) => `<tr><th>${escape(label)}</th><td>${escape(value || '—')}</td></tr>`).join('')}</tbody></table>
<p>Content fingerprint (SHA-256 of the result): <span class="fingerprint">${escape(revision.fingerprint)}</span></p>

<h2>Summary</h2>
<table><thead><tr><th></th><th>Allowance</th><th>Installed</th><th>Exempt</th><th>Margin</th><th>Within</th></tr></thead><tbody>
${rows([
  [
    'Interior',
    figure(result.interior.allowanceW, 'W'),
    figure(result.interior.installedW, 'W'),
    figure(result.interior.exemptW, 'W'),
    figure(result.interior.marginW, 'W'),
    result.interior.complies ? 'Yes' : 'No',
  ],
  ...(exterior
    ? [
        [
          'Exterior',
          figure(exterior.allowanceW, 'W'),
          figure(exterior.installedW, 'W'),
          figure(exterior.exemptW, 'W'),
          figure(text(dec(exterior.allowanceW).minus(dec(exterior.installedW))), 'W'),
          exterior.complies ? 'Yes' : 'No',
        ],
      ]
    : []),
])}
</tbody></table>
<p>Controls: ${result.controlsComply ? 'every required control is met or excepted' : 'not every required control is met'}. Verdict: <strong>${escape(verdictWords[result.verdict])}</strong>.</p>

<h2>Interior spaces</h2>
<table><thead><tr><th>Space</th><th>Level</th><th>Type</th><th>Area</th><th>Allowance</th><th>Installed</th><th>Margin</th></tr></thead><tbody>
${rows(spaces.map((space) => [space.name, space.level ?? '—', space.lpdBasis.label, figure(space.area, area), figure(space.allowanceW, 'W'), figure(space.installedW, 'W'), figure(space.marginW, 'W')]))}
</tbody></table>

<h2>Controls per space</h2>
${controls.length ? `<table><thead><tr><th>Space</th><th>Control</th><th>Status</th><th>Why</th><th>Section</th></tr></thead><tbody>${rows(controls)}</tbody></table>` : '<p>No controls are listed.</p>'}

${
  exterior
    ? `<h2>Exterior applications</h2>
<table><thead><tr><th>Application</th><th>Tradable</th><th>Quantity</th><th>Allowance</th><th>Installed</th></tr></thead><tbody>
${rows(exterior.applications.map((application) => [application.label, application.tradable ? 'Tradable' : 'Nontradable', figure(application.quantity, application.unit.split('/')[1] ?? ''), figure(application.allowanceW, 'W'), figure(application.installedW, 'W')]))}
</tbody></table>`
    : ''
}

<h2>Values used that are not yet verified</h2>
${result.unverifiedValues.length ? `<table><thead><tr><th>Value</th><th>Source</th></tr></thead><tbody>${rows(result.unverifiedValues.map((value) => [value.what, value.source]))}</tbody></table>` : '<p>None.</p>'}

<h2>Cautions</h2>
${result.cautions.length ? `<ul>${result.cautions.map((caution) => `<li>${escape(caution)}</li>`).join('')}</ul>` : '<p>None.</p>'}

<h2>Revisions</h2>
<table><thead><tr><th>Revision</th><th>Made</th><th>By</th><th>Kind</th><th>Fingerprint</th></tr></thead><tbody>
${rows([...input.history, revision].map((stamp) => [String(stamp.number), dateWords(stamp.madeAt), stamp.madeBy, stamp.draft ? 'Draft' : 'Final', stamp.fingerprint]))}
</tbody></table>
</body></html>`;
}

/** Each page's foot: the fingerprint (and the draft mark) with the page number, in Chromium's template. */
function footerTemplate(input: PackageInput): string {
  const draft = input.revision.draft ? '<b>DRAFT — not for permit</b> · ' : '';
  return `<div style="font-size:7pt;width:100%;margin:0 14mm;display:flex;justify-content:space-between;font-family:sans-serif">
<span>${draft}${escape(input.project.name)} · revision ${input.revision.number} · fingerprint ${escape(input.revision.fingerprint)}</span>
<span>page <span class="pageNumber"></span> of <span class="totalPages"></span></span></div>`;
}

/** One rendering at a time: a Chromium per package is a few hundred megabytes. */
let queue: Promise<unknown> = Promise.resolve();

/** The package as a print-ready PDF: its print view rendered by headless Chromium, offline. */
export function buildPackagePdf(input: PackageInput): Promise<Buffer> {
  const run = queue.then(() => render(input));
  queue = run.catch(() => undefined);
  return run;
}

async function render(input: PackageInput): Promise<Buffer> {
  const browser = await chromium.launch({ executablePath: chromiumPath, args: chromiumArgs, timeout: stepTimeoutMs });
  try {
    const page = await browser.newPage({ javaScriptEnabled: false });
    page.setDefaultTimeout(stepTimeoutMs);
    // The print view is self-contained; nothing it names may reach the network.
    await page.route('**/*', (route) => route.abort());
    await page.setContent(packageHtml(input), { waitUntil: 'load' });
    const pdf = await page.pdf({
      format: 'Letter',
      printBackground: true,
      displayHeaderFooter: true,
      headerTemplate: '<span></span>',
      footerTemplate: footerTemplate(input),
      margin: { top: '18mm', bottom: '20mm', left: '14mm', right: '14mm' },
    });
    return Buffer.from(pdf);
  } finally {
    await browser.close();
  }
}
