import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { readFileSync } from 'node:fs';
import { bundleCli, cleanUp, cli } from './helpers';

const pkg = JSON.parse(readFileSync(new URL('../../package.json', import.meta.url), 'utf8')) as {
  version: string;
};

beforeAll(async () => {
  await bundleCli();
});
afterAll(cleanUp);

describe('quadspread --version', () => {
  it("prints package.json's version (read when the CLI is built), exit 0", () => {
    const r = cli(['--version']);
    expect(r.code).toBe(0);
    expect(r.stdout.trim()).toBe(pkg.version);
  });
});
