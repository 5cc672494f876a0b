import { defineConfig } from 'vitest/config';

/**
 * Test files that read a built demo site share one build, made once per run by the `site`
 * project's global setup (test/setup/demo-build.ts) and injected as `demoBuild`. Its global setup
 * runs only when one of its files runs. Every build of the suite takes the checkout's build lock,
 * so builds run one at a time however many test files run at once.
 */
const SITE_TESTS = ['test/site-build.test.ts', 'test/e2e-site.test.ts', 'test/site-cache.test.ts'];

export default defineConfig({
  test: {
    testTimeout: 60_000,
    // Vitest's default is one worker fewer than the cores: on a 2-core machine, one file at a time.
    maxWorkers: 2,
    projects: [
      { extends: true, test: { name: 'unit', include: ['test/**/*.test.ts'], exclude: SITE_TESTS, isolate: false } },
      { extends: true, test: { name: 'site', include: SITE_TESTS, globalSetup: ['test/setup/demo-build.ts'] } },
    ],
  },
});
