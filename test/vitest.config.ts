import { fileURLToPath } from 'node:url';
import { defineConfig } from 'vitest/config';

const root = fileURLToPath(new URL('..', import.meta.url));

/** Calculation, reference, schema, service and browser tests. The web unit tests run through `ng test`. */
export default defineConfig({
  root,
  test: {
    include: ['test/**/*.test.ts'],
    globalSetup: ['test/support/global-setup.ts'],
    testTimeout: 20_000,
    hookTimeout: 60_000,
    // A poll waits for what the page shows; a loaded machine may take seconds to recompute, so the wait is long and the test still ends at the first match.
    expect: { poll: { timeout: 10_000 } },
    pool: 'forks',
    // The S3 client warns once per process that its releases from 2027 need Node.js 22; the project
    // runs on Node.js 20 (see STACK), and the warning would repeat in every test file's output.
    env: { AWS_SDK_JS_NODE_VERSION_SUPPORT_WARNING_DISABLED: 'true' },
    reporters: ['default'],
  },
});
