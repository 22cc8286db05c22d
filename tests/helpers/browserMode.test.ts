/** Browser tests fail in CI when Chromium is missing, instead of skipping (tests/report/browserHarness.ts). */
import { describe, expect, it } from 'vitest';
import { spawnSync } from 'node:child_process';
import { chromiumTestMode, isCi } from '../report/browserHarness.js';

describe('browser test mode', () => {
  it('runs with Chromium, fails without it in CI, skips without it elsewhere', () => {
    expect(chromiumTestMode(true, true)).toBe('run');
    expect(chromiumTestMode(true, false)).toBe('run');
    expect(chromiumTestMode(false, true)).toBe('fail');
    expect(chromiumTestMode(false, false)).toBe('skip');
  });
  it('reads CI as CI services set it', () => {
    for (const v of ['true', '1', 'TRUE', 'yes']) expect(isCi(v), v).toBe(true);
    for (const v of [undefined, '', '0', 'false', 'False']) expect(isCi(v), String(v)).toBe(false);
  });
  it('end to end: with CI=true and no Chromium every browser test file fails', () => {
    // one worker: the two files share its module graph (isolate: false) instead of importing it twice
    const r = spawnSync(process.execPath, ['node_modules/vitest/vitest.mjs', 'run', '--maxWorkers=1', 'tests/report/browser.test.ts', 'tests/report/demoReportBrowser.test.ts'], {
      encoding: 'utf8', env: { ...process.env, CI: 'true', SORBSHARE_CHROMIUM: '/nonexistent/chromium' },
    });
    expect(r.status).not.toBe(0);
    expect(r.stdout + r.stderr).toMatch(/\/nonexistent\/chromium is missing; CI must install it/);
    expect(r.stdout + r.stderr).toMatch(/2 failed/);
  }, 120_000);
});
