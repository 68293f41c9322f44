// Bad input, issue 8: the 'uploads' routes of tests/integration/bad-input.routes.ts (see
// bad-input.test.ts). A file per group so vitest fuzzes the groups in parallel.
import { fuzzGroup } from './bad-input.fuzz.js';

fuzzGroup('uploads');
