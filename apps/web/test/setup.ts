import '@testing-library/jest-dom';

afterEach(() => {
  window.localStorage.clear();
});
