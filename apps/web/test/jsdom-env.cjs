// jsdom lacks the fetch family and TextEncoder that React Router 7's data router needs;
// hand Node's own implementations to the test window.
const { TestEnvironment } = require('jest-environment-jsdom');

const NODE_GLOBALS = [
  'TextEncoder',
  'TextDecoder',
  'Request',
  'Response',
  'Headers',
  'fetch',
  'FormData',
  'Blob',
  'ReadableStream',
  'WritableStream',
  'TransformStream',
  'AbortController',
  'AbortSignal',
  'structuredClone',
];

module.exports = class RoundbookJsdomEnvironment extends TestEnvironment {
  constructor(config, context) {
    super(config, context);
    for (const name of NODE_GLOBALS) {
      if (globalThis[name] !== undefined) this.global[name] = globalThis[name];
    }
  }
};
