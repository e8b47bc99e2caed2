/** Jest for packages/geomath: TypeScript through @swc/jest, ESM-only helpers transformed to CJS. */
module.exports = {
  testEnvironment: 'node',
  roots: ['<rootDir>/src', '<rootDir>/test'],
  testMatch: ['**/*.test.ts'],
  transform: {
    '^.+\\.(t|j|mj)s$': [
      '@swc/jest',
      { jsc: { parser: { syntax: 'typescript' }, target: 'es2022' }, module: { type: 'commonjs' } },
    ],
  },
  transformIgnorePatterns: ['/node_modules/(?!(d3-.*|internmap|delaunator|robust-predicates)/)'],
  moduleNameMapper: { '^(\\.{1,2}/.*)\\.js$': '$1' },
};
