/**
 * One package builder in a process of its own, so its peak memory is its own: reads a package
 * input (JSON) from the file named first, builds the document named second (docx or xlsx), and
 * prints one JSON line: the build's time, the process's peak resident memory (`maxRSS`, which the
 * kernel keeps, so no peak between samples is missed) and the file's size. Run by `run.ts`.
 */
import { readFileSync } from 'node:fs';
import { performance } from 'node:perf_hooks';
import { buildCompliancePackage, buildComplianceWorkbook } from '../../service/src/package/builders.js';
import type { PackageInput } from '../../service/src/package/package-input.js';

const [file, format] = process.argv.slice(2);
if (file === undefined || (format !== 'docx' && format !== 'xlsx')) {
  console.error('usage: package-builder.ts <input.json> <docx|xlsx>');
  process.exit(2);
}
const input = JSON.parse(readFileSync(file, 'utf8')) as PackageInput;
const loadedRssKb = process.resourceUsage().maxRSS;
const start = performance.now();
const cpuStart = process.cpuUsage();
const body = format === 'docx' ? await buildCompliancePackage(input) : await buildComplianceWorkbook(input);
const ms = performance.now() - start;
const cpu = process.cpuUsage(cpuStart);
// maxRSS is in kilobytes (Node.js docs, process.resourceUsage()).
// CPU time (user and system, all threads) beside the wall time: on a shared machine it varies less.
console.log(
  JSON.stringify({
    ms,
    cpuMs: (cpu.user + cpu.system) / 1000,
    peakRssMb: process.resourceUsage().maxRSS / 1024,
    loadedRssMb: loadedRssKb / 1024,
    bytes: body.length,
  }),
);
