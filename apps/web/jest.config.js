// Web unit tests: jsdom with Node's fetch globals (test/jsdom-env.cjs), TS/TSX through @swc/jest.
export default {
  testTimeout: 20000,
  testEnvironment: '<rootDir>/test/jsdom-env.cjs',
  roots: ['<rootDir>/src'],
  transform: {
    '^.+\\.(t|j|mj)sx?$': [
      '@swc/jest',
      {
        jsc: {
          parser: { syntax: 'typescript', tsx: true },
          transform: { react: { runtime: 'automatic' } },
          target: 'es2022',
        },
        module: { type: 'commonjs' },
      },
    ],
  },
  // geomath's d3 helpers and konva ship as ESM only; let @swc/jest turn them into CommonJS.
  transformIgnorePatterns: [
    '/node_modules/(?!(d3-.*|internmap|delaunator|robust-predicates|konva|react-konva|its-fine)/)',
  ],
  moduleNameMapper: {
    '^@/(.*)$': '<rootDir>/src/$1',
    // Workspace packages are tested from their TypeScript source, like Vite bundles them.
    '^@roundbook/geomath$': '<rootDir>/../../packages/geomath/src/index.ts',
    '^@roundbook/domain$': '<rootDir>/../../packages/domain/src/index.ts',
    // geomath uses NodeNext-style relative imports ending in .js for its .ts files.
    '^(\\.{1,2}/.*)\\.js$': '$1',
    '\\.css$': '<rootDir>/test/style-mock.cjs',
  },
  testEnvironmentOptions: { url: 'http://127.0.0.1:8080/' },
  // jsdom has no 2D canvas; Konva needs one.
  setupFiles: ['jest-canvas-mock'],
  setupFilesAfterEnv: ['<rootDir>/test/setup.ts'],
};
