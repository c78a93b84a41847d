// A local SMTP server on loopback for development and tests: it accepts every message and keeps it
// as an .eml file in one folder, so the mail the app sends can be read back. Never exposed beyond
// 127.0.0.1; production points SMTP_HOST at a real relay instead.
import { randomUUID } from 'node:crypto';
import { mkdirSync, renameSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import { SMTPServer } from 'smtp-server';

/** Largest message kept; a bigger one is refused at DATA. */
const maxMessageBytes = 25 * 1024 * 1024;

/**
 * Starts the catcher. `port: 0` picks a free port; the resolved one is returned.
 * @param {{ dir: string, port?: number, host?: string }} options
 * @returns {Promise<{ port: number, dir: string, close: () => Promise<void> }>}
 */
export async function startMailCatcher({ dir, port = 0, host = '127.0.0.1' }) {
  mkdirSync(dir, { recursive: true });
  const server = new SMTPServer({
    // Loopback only and no credentials to protect, so no TLS and no AUTH to negotiate.
    disabledCommands: ['STARTTLS', 'AUTH'],
    authOptional: true,
    size: maxMessageBytes,
    logger: false,
    onData(stream, _session, callback) {
      const chunks = [];
      stream.on('data', (chunk) => chunks.push(chunk));
      stream.on('end', () => {
        if (stream.sizeExceeded) {
          callback(Object.assign(new Error('Message too large'), { responseCode: 552 }));
          return;
        }
        // Written under a temporary name and renamed, so a reader never sees half a message.
        const name = `${new Date().toISOString().replace(/[:.]/g, '-')}-${randomUUID()}.eml`;
        const partial = path.join(dir, `.${name}.partial`);
        writeFileSync(partial, Buffer.concat(chunks));
        renameSync(partial, path.join(dir, name));
        callback();
      });
    },
  });
  await new Promise((resolve, reject) => {
    server.once('error', reject);
    server.listen(port, host, () => {
      server.off('error', reject);
      resolve(undefined);
    });
  });
  const address = server.server.address();
  return {
    port: typeof address === 'object' && address ? address.port : port,
    dir,
    close: () => new Promise((resolve) => server.close(() => resolve(undefined))),
  };
}
