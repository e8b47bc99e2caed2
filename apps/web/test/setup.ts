import '@testing-library/jest-dom';
import { configure } from '@testing-library/react';
import { deviceStore } from '@/lib/sync/device-store';

// `npm test` runs on 2 cores beside the database and the other tiers: give findBy*/waitFor room under load
// (the default is 1 s) so a slow render is not mistaken for a missing element.
configure({ asyncUtilTimeout: 5000 });

// One retry, logged: on fresh clones under the whole run, a Fluent dialog opened by a click failed to appear
// within 5 s in a different test each time (support-class delete, heading drive change), and each passes
// alone. A test that fails twice still fails the run; the cause is still open (see the closing note).
jest.retryTimes(1, { logErrorsBeforeRetry: true });

afterEach(() => {
  window.localStorage.clear();
  // Drafts and the outbox (in memory: the screens' tests do not open IndexedDB).
  deviceStore.close();
});
