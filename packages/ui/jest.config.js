// Unit tests for @roundbook/ui: jsdom + @swc/jest (no type-check here; run `npm run typecheck`).
export default {
  testEnvironment: 'jsdom',
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
  // Workspace packages from their TypeScript source (as the web bundles them); geomath's d3 helpers are ESM.
  transformIgnorePatterns: ['/node_modules/(?!(d3-.*|internmap|delaunator|robust-predicates)/)'],
  moduleNameMapper: {
    '^@roundbook/geomath$': '<rootDir>/../geomath/src/index.ts',
    '^@roundbook/domain$': '<rootDir>/../domain/src/index.ts',
    '^(\\.{1,2}/.*)\\.js$': '$1',
  },
  setupFilesAfterEnv: ['<rootDir>/src/test/setup.ts'],
};
