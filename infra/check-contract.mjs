#!/usr/bin/env node
// Fails when the committed OpenAPI document (apps/api/openapi.json) or the web client generated from it
// (apps/web/src/api/generated/schema.d.ts) differs from what the current code produces.
// Fix: npm run build -w @roundbook/api && npm run api:openapi && npm run web:client
import { spawnSync } from 'node:child_process';
import { mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { root } from './lib/env.mjs';

const tmp = mkdtempSync(path.join(tmpdir(), 'roundbook-contract-'));
const doc = path.join(tmp, 'openapi.json');
const client = path.join(tmp, 'schema.d.ts');
let stale = [];
try {
  const a = spawnSync(process.execPath, [path.join(root, 'apps/api/dist/openapi.js'), doc], {
    encoding: 'utf8',
  });
  if (a.status !== 0) throw new Error(`could not generate the OpenAPI document:\n${a.stderr}`);
  if (readFileSync(doc, 'utf8') !== readFileSync(path.join(root, 'apps/api/openapi.json'), 'utf8'))
    stale.push('apps/api/openapi.json');
  const b = spawnSync('npx', ['openapi-typescript', path.join(root, 'apps/api/openapi.json'), '-o', client], {
    cwd: path.join(root, 'apps/web'),
    encoding: 'utf8',
  });
  if (b.status !== 0) throw new Error(`could not generate the web client:\n${b.stderr}`);
  if (
    readFileSync(client, 'utf8') !==
    readFileSync(path.join(root, 'apps/web/src/api/generated/schema.d.ts'), 'utf8')
  ) {
    stale.push('apps/web/src/api/generated/schema.d.ts');
  }
} finally {
  rmSync(tmp, { recursive: true, force: true });
}
if (stale.length) {
  console.error(
    `Out of date: ${stale.join(', ')}. Regenerate with: npm run build -w @roundbook/api && npm run api:openapi && npm run web:client`,
  );
  process.exit(1);
}
console.log('OpenAPI document and web client are up to date.');
