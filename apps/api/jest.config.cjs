// Unit tests beside the code (*.spec.ts). @nestjs/* and file-type are ESM-only: transformed by @swc/jest.
const swc = {
  jsc: {
    parser: { syntax: 'typescript', decorators: true },
    transform: { legacyDecorator: true, decoratorMetadata: true },
    target: 'es2022',
    keepClassNames: true,
  },
  module: { type: 'commonjs' },
  sourceMaps: 'inline',
};
module.exports = {
  moduleFileExtensions: ['js', 'mjs', 'json', 'ts'],
  rootDir: '.',
  testEnvironment: 'node',
  testRegex: 'src/.*\\.spec\\.ts$',
  transform: { '^.+\\.(t|j|mj)s$': ['@swc/jest', swc] },
  transformIgnorePatterns: [
    '/node_modules/(?!(@nestjs|file-type|strtok3|token-types|@tokenizer|uint8array-extras|@borewit|d3-.*|internmap)/)',
  ],
  moduleNameMapper: {
    '^@roundbook/geomath$': '<rootDir>/../../packages/geomath/src/index.ts',
    '^@roundbook/domain$': '<rootDir>/../../packages/domain/src/index.ts',
    '^(\\.{1,2}/.*)\\.js$': '$1',
  },
};
