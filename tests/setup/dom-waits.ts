/**
 * For the browser-like (jsdom) test files only: Testing Library's findBy and waitFor wait up to 5 s for the screen
 * to show what a test looks for, instead of 1 s. A lazy screen rendered by two test files at once on a loaded
 * 2-core machine can take over a second; the checks themselves are unchanged, and no timing is measured here.
 */
if (typeof document !== 'undefined') {
  const { configure } = await import('@testing-library/react');
  configure({ asyncUtilTimeout: 5_000 });
}

export {};
