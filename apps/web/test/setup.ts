import '@testing-library/jest-dom';
import { configure } from '@testing-library/react';

// `npm test` runs on 2 cores beside the database and the other tiers: give findBy*/waitFor room under load
// (the default is 1 s) so a slow render is not mistaken for a missing element.
configure({ asyncUtilTimeout: 5000 });

afterEach(() => {
  window.localStorage.clear();
});
