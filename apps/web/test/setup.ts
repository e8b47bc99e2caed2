import '@testing-library/jest-dom';
import { configure } from '@testing-library/react';
import { deviceStore } from '@/lib/sync/device-store';

// `npm test` runs on 2 cores beside the database and the other tiers: give findBy*/waitFor room under load
// (the default is 1 s) so a slow render is not mistaken for a missing element.
configure({ asyncUtilTimeout: 5000 });

// One retry, logged. The failures that led to it (a Fluent dialog "not found" in the support-class delete and
// heading drive tests) had a cause: the dialog was open, but tabster marks its surface aria-hidden a moment
// after it opens in jsdom, which takes its accessible name away; those tests now find dialogs by title with
// `findDialog` (src/testing/dialogs.ts). The retry stays for slow renders under load; a test that fails
// twice still fails the run.
jest.retryTimes(1, { logErrorsBeforeRetry: true });

afterEach(() => {
  window.localStorage.clear();
  // Drafts and the outbox (in memory: the screens' tests do not open IndexedDB).
  deviceStore.close();
});
