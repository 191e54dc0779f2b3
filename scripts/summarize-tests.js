// Adds up Jest's JSON results into the one plain line CI reads: "N passed, N failed".
// A test file that could not run at all counts as one failure.
const fs = require('node:fs');

let passed = 0;
let failed = 0;
let skipped = 0;
for (const file of process.argv.slice(2)) {
  let result;
  try {
    result = JSON.parse(fs.readFileSync(file, 'utf8'));
  } catch {
    console.error(`summarize-tests: ${file} is missing or unreadable (runner crashed?)`);
    failed += 1;
    continue;
  }
  passed += result.numPassedTests;
  failed += result.numFailedTests;
  skipped += result.numPendingTests + (result.numTodoTests ?? 0);
  for (const suite of result.testResults) {
    if (suite.status === 'failed' && suite.assertionResults.length === 0) {
      console.error(`summarize-tests: ${suite.name} failed to run: ${(suite.message || '').split('\n')[0]}`);
      failed += 1;
    }
  }
}
console.log(`\n${passed} passed, ${failed} failed${skipped ? `, ${skipped} skipped` : ''}`);
process.exit(failed > 0 || passed === 0 ? 1 : 0);
