// Print vitest's JSON report as one plain closing line: "Tests: N passed, N failed, N skipped".
import { readFileSync } from 'node:fs';

const report = JSON.parse(readFileSync(process.argv[2], 'utf8'));
const skipped = report.numPendingTests + report.numTodoTests;
console.log(`Tests: ${report.numPassedTests} passed, ${report.numFailedTests} failed, ${skipped} skipped`);
