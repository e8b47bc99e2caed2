/** Jest for packages/domain: TypeScript through @swc/jest; geomath from its source, like the web bundles it. */
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
  moduleNameMapper: {
    '^@roundbook/geomath$': '<rootDir>/../geomath/src/index.ts',
    '^(\\.{1,2}/.*)\\.js$': '$1',
  },
};
