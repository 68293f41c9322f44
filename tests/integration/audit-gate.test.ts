// scripts/audit-gate.mjs end to end with a stand-in `npm` on PATH that answers as npm audit
// does: clean, a high advisory, the registry refusing the audit service (the reply seen on
// this project's machines: HTTP 405 from the bulk advisory endpoint), and no JSON at all. The
// gate passes only a report it could read with no high or critical finding.
import { execFile } from 'node:child_process';
import { chmodSync, mkdirSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { ROOT } from '../fixtures/server-process.js';

const work = mkdtempSync(path.join(tmpdir(), 'heelwood-audit-gate-'));
afterAll(() => rmSync(work, { recursive: true, force: true }));

// The shape of `npm audit --json` (auditReportVersion 2, npm 7 and later).
const report = (vulnerabilities: Record<string, unknown>, counts: Partial<Record<'info' | 'low' | 'moderate' | 'high' | 'critical', number>>) => ({
  auditReportVersion: 2,
  vulnerabilities,
  metadata: {
    vulnerabilities: { info: 0, low: 0, moderate: 0, high: 0, critical: 0, ...counts, total: Object.values(counts).reduce((s, n) => s + (n ?? 0), 0) },
    dependencies: { prod: 187, dev: 0, optional: 0, peer: 0, peerOptional: 0, total: 187 },
  },
});

let n = 0;
function gate(stdout: string, exitCode: number, extra: string[] = []) {
  const dir = path.join(work, `npm-${++n}`);
  const fakeNpm = path.join(dir, 'npm');
  writeFileSync(path.join(work, `answer-${n}.txt`), stdout);
  mkdirSync(dir, { recursive: true });
  writeFileSync(fakeNpm, `#!/bin/sh\n[ "$1 $2 $3" = "audit --omit=dev --json" ] || { echo "unexpected: $*" >&2; exit 9; }\ncat '${path.join(work, `answer-${n}.txt`)}'\nexit ${exitCode}\n`);
  chmodSync(fakeNpm, 0o755);
  const out = path.join(work, `report-${n}.json`);
  return new Promise<{ code: number; stdout: string; report: { numPassedTests: number; numFailedTests: number; numPendingTests: number; success: boolean } }>((resolve) => {
    execFile(process.execPath, ['scripts/audit-gate.mjs', '--report', out, ...extra], { cwd: ROOT, env: { ...process.env, PATH: `${dir}:${process.env.PATH}` } }, (err, so) => {
      resolve({ code: err ? Number((err as { code?: number }).code) : 0, stdout: so, report: JSON.parse(readFileSync(out, 'utf8')) });
    });
  });
}

describe('npm audit gate', () => {
  it('passes a report with moderate findings only, and counts 1 passed', async () => {
    const r = await gate(JSON.stringify(report({ 'some-lib': { name: 'some-lib', severity: 'moderate', via: [], range: '<2', fixAvailable: true } }, { moderate: 1 })), 1);
    expect(r.code).toBe(0);
    expect(r.stdout).toMatch(/0 critical, 0 high, 1 moderate, 0 low in 187 production dependencies/);
    expect(r.report).toMatchObject({ numPassedTests: 1, numFailedTests: 0, success: true });
  });

  it('fails on a high finding and names the package, the advisory and the fix', async () => {
    const vuln = {
      'bad-lib': {
        name: 'bad-lib',
        severity: 'high',
        via: [{ title: 'Prototype pollution in bad-lib', url: 'https://example.org/advisory/1', severity: 'high' }],
        range: '<1.2.3',
        fixAvailable: { name: 'bad-lib', version: '1.2.3', isSemVerMajor: false },
      },
    };
    const r = await gate(JSON.stringify(report(vuln, { high: 1 })), 1);
    expect(r.code).toBe(1);
    expect(r.stdout).toMatch(/high\s+bad-lib <1\.2\.3 — Prototype pollution in bad-lib/);
    expect(r.stdout).toMatch(/fix: bad-lib@1\.2\.3/);
    expect(r.report).toMatchObject({ numPassedTests: 0, numFailedTests: 1, success: false });
  });

  it('fails on a critical finding reached through another package', async () => {
    const vuln = { wrapper: { name: 'wrapper', severity: 'critical', via: ['inner'], range: '*', fixAvailable: false } };
    const r = await gate(JSON.stringify(report(vuln, { critical: 1 })), 1);
    expect(r.code).toBe(1);
    expect(r.stdout).toMatch(/critical wrapper \* — through inner — no fix available/);
  });

  it('says it could not check, and fails, when the registry refuses the audit service', async () => {
    const refusal = {
      message: '405 Method Not Allowed - POST https://registry.npmjs.org/-/npm/v1/security/advisories/bulk',
      method: 'POST',
      statusCode: 405,
      body: '',
      error: { summary: '', detail: '' },
    };
    const r = await gate(JSON.stringify(refusal), 1);
    expect(r.code).toBe(2);
    expect(r.stdout).toMatch(/NOT CHECKED .*405 Method Not Allowed/);
    expect(r.stdout).toMatch(/not audited; counted as failed/);
    expect(r.report).toMatchObject({ numPassedTests: 0, numFailedTests: 1, success: false });
  });

  it('with --when-unreachable skip (as CI runs it), an unanswered audit is skipped, never passed', async () => {
    const refusal = { message: '405 Method Not Allowed - POST https://registry.npmjs.org/-/npm/v1/security/advisories/bulk', statusCode: 405, error: { summary: '' } };
    const r = await gate(JSON.stringify(refusal), 1, ['--when-unreachable', 'skip']);
    expect(r.code).toBe(0);
    expect(r.stdout).toMatch(/NOT CHECKED .*405 Method Not Allowed/);
    expect(r.stdout).toMatch(/counted as skipped/);
    expect(r.report).toMatchObject({ numPassedTests: 0, numFailedTests: 0, numPendingTests: 1, success: true });
    // A real finding still fails under the same option.
    const vuln = { 'bad-lib': { name: 'bad-lib', severity: 'high', via: [], range: '*', fixAvailable: false } };
    const high = await gate(JSON.stringify(report(vuln, { high: 1 })), 1, ['--when-unreachable', 'skip']);
    expect(high.code).toBe(1);
    expect(high.report).toMatchObject({ numPassedTests: 0, numFailedTests: 1, success: false });
  });

  it('fails when npm prints no JSON (e.g. offline)', async () => {
    const r = await gate('npm error code ENOTFOUND\nnpm error network request failed', 1);
    expect(r.code).toBe(2);
    expect(r.stdout).toMatch(/NOT CHECKED — npm audit did not return a report/);
    expect(r.report.success).toBe(false);
  });
});
