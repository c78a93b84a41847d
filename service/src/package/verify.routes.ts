import { Router } from 'express';
import type { Database } from '../db/database.js';
import { finalPackagesByFingerprint } from './package.repository.js';

const fingerprintPattern = /^[0-9a-fA-F]{64}$/;

function escape(text: string): string {
  return text.replace(/[&<>"']/g, (character) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[character]!);
}

function dateWords(iso: string): string {
  return `${new Date(iso).toLocaleString('en-US', { dateStyle: 'long', timeStyle: 'short', timeZone: 'UTC' })} UTC`;
}

function page(title: string, body: string): string {
  return `<!doctype html>
<html lang="en"><head><meta charset="utf-8"><meta name="viewport" content="width=device-width, initial-scale=1">
<title>${escape(title)} · Allowlight</title>
<style>body{font-family:system-ui,sans-serif;max-width:40rem;margin:2rem auto;padding:0 1rem;line-height:1.5;color:#1b1b1b}
code{word-break:break-all}h1{font-size:1.4rem}</style></head>
<body><main><h1>${escape(title)}</h1>${body}</main></body></html>`;
}

/**
 * `GET /verify/:fingerprint`, open to anyone: whether a final submittal package with that
 * fingerprint was issued, for which project and revision, and when, so a permit office can check a
 * printed copy. Nothing else about the project is told, and drafts are never found. A page for
 * people; JSON for a client that asks for it.
 */
export function verifyRouter(db: Database): Router {
  const router = Router();
  router.get('/:fingerprint', async (req, res) => {
    const given = String(req.params['fingerprint'] ?? '');
    const fingerprint = fingerprintPattern.test(given) ? given.toLowerCase() : null;
    const issued = fingerprint ? await finalPackagesByFingerprint(db, fingerprint) : [];
    res.setHeader('Cache-Control', 'no-store');
    res.status(issued.length > 0 ? 200 : 404);
    if (req.accepts(['html', 'json']) === 'json') {
      res.json({
        fingerprint: fingerprint ?? given.slice(0, 64),
        issued: issued.length > 0,
        packages: issued.map((found) => ({ projectName: found.projectName, revision: found.number, issuedAt: found.issuedAt })),
      });
      return;
    }
    const shown = `<p>Fingerprint <code>${escape(fingerprint ?? given.slice(0, 64))}</code></p>`;
    if (issued.length === 0) {
      res.send(
        page(
          'No issued package has this fingerprint',
          `${shown}<p>${fingerprint ? 'No final submittal package with this fingerprint was issued through Allowlight.' : 'This is not a package fingerprint: a fingerprint is 64 letters and digits (0–9, a–f), printed in the foot of every page.'} Check that it was copied in full from the foot of a page; a draft package is never issued and is not found here.</p>`,
        ),
      );
      return;
    }
    const items = issued
      .map(
        (found) => `<li>${escape(found.projectName)}, submittal revision ${found.number}, issued ${escape(dateWords(found.issuedAt))}</li>`,
      )
      .join('');
    res.send(
      page(
        'This package was issued',
        `${shown}<p>A final submittal package with this fingerprint was issued:</p><ul>${items}</ul><p>The fingerprint is taken over the package's compliance result: a copy whose figures differ would carry another one.</p>`,
      ),
    );
  });
  return router;
}
