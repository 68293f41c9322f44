#!/usr/bin/env node
// Sums every vitest JSON report in a results directory (default: test-results/) and prints
// exactly one final line: "N passed, N failed".
//
// If the directory holds phases.tsv (written by .ci/run: name <TAB> exit code <TAB> report
// file or "-"), each phase is checked too: a phase that exited non-zero without a report, or
// whose report shows no failed test although the phase failed, counts as 1 failed, with a
// message printed above the final line.
//
// Exit code: 0 when nothing failed and no phase crashed, 1 otherwise.
// Usage: node scripts/count-results.mjs [results-dir]
import { existsSync, readdirSync, readFileSync } from 'node:fs';
import { basename, join, resolve } from 'node:path';

const dir = resolve(process.argv[2] ?? 'test-results');
let passed = 0;
let failed = 0;
const reports = new Map(); // absolute path -> { passed, failed, success }

if (existsSync(dir)) {
  for (const file of readdirSync(dir).filter((f) => f.endsWith('.json')).sort()) {
    const path = join(dir, file);
    let data;
    try {
      data = JSON.parse(readFileSync(path, 'utf8'));
    } catch (err) {
      console.log(`count-results: ${file} is not valid JSON (${err.message}): counted as 1 failed`);
      failed += 1;
      reports.set(path, { passed: 0, failed: 1, success: false });
      continue;
    }
    if (typeof data?.numPassedTests !== 'number' || typeof data?.numFailedTests !== 'number') {
      console.log(`count-results: ${file} is not a vitest JSON report: ignored`);
      continue;
    }
    let fileFailed = data.numFailedTests;
    console.log(`count-results: ${file}: ${data.numPassedTests} passed, ${data.numFailedTests} failed`);
    if (data.success === false && fileFailed === 0) {
      // e.g. a test file that failed to load, or an unhandled error: no test failed, the run did.
      const suites = typeof data.numFailedTestSuites === 'number' ? data.numFailedTestSuites : 0;
      console.log(`count-results: ${file} reports an unsuccessful run with no failed test (${suites} failed suite(s) or errors outside tests): counted as 1 failed`);
      fileFailed = 1;
    }
    passed += data.numPassedTests;
    failed += fileFailed;
    reports.set(path, { passed: data.numPassedTests, failed: fileFailed, success: data.success !== false });
  }
} else {
  console.log(`count-results: no results directory ${dir}`);
}

let crashed = 0;
const phasesFile = join(dir, 'phases.tsv');
if (existsSync(phasesFile)) {
  const lines = readFileSync(phasesFile, 'utf8').split('\n').filter((l) => l.trim() !== '');
  for (const line of lines) {
    const [name, codeText, reportName = '-'] = line.split('\t');
    const code = Number(codeText);
    const reportPath = reportName === '-' ? null : resolve(dir, basename(reportName));
    const report = reportPath ? reports.get(reportPath) : undefined;
    if (reportPath && !report) {
      console.log(`count-results: phase "${name}" ended (exit ${codeText}) without writing ${basename(reportPath)}: counted as 1 failed`);
      crashed += 1;
    } else if (code !== 0 && (!report || report.failed === 0)) {
      const why = report ? 'but its report shows no failed test (errors outside tests?)' : '';
      console.log(`count-results: phase "${name}" failed (exit ${codeText}) ${why}: counted as 1 failed`.replace(' :', ':'));
      crashed += 1;
    }
  }
}

failed += crashed;
console.log(`${passed} passed, ${failed} failed`);
process.exit(failed > 0 ? 1 : 0);
