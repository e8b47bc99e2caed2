// End-to-end tests (test/*.e2e-spec.ts) against the real MariaDB, S3 fake and SMTP fake that infra/ starts.
const base = require('./jest.config.cjs');
module.exports = { ...base, testRegex: 'test/.*\\.e2e-spec\\.ts$', testTimeout: 30000 };
