// The batch workers' computing of a block a slice at a time: the same text, counts and line
// numbers as the block computed whole (the code of the one-thread batch), whatever the slice
// size, with lines longer than a slice, characters of several bytes and output larger than the
// kept buffer; and the worker script answering blocks by id and handing their memory back.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { dirname, join } from 'node:path';
import { pathToFileURL } from 'node:url';
import { Worker } from 'node:worker_threads';
import { batchRows } from '../../src/cli/batch-rows';
import type { RowOptions } from '../../src/cli/batch-rows';
import { BlockComputer } from '../../src/cli/batch-worker';
import type { WorkerAnswer, WorkerSetup } from '../../src/cli/batch-worker';
import { bundleCli, cleanUp } from './helpers';

const names = ['name', 'east1', 'north1', 'east2', 'north2'];
const float: RowOptions = { arithmetic: 'float', digits: 10 };
const rows = (o: RowOptions = float) => batchRows('inverses', names, 1, o);
const encoder = new TextEncoder();
const decoder = new TextDecoder('utf-8', { ignoreBOM: true });

/** Lines of every kind a block meets: plain, quoted, CRLF, comments, blank, multi-byte names. */
function lines(n: number): string {
  let t = '';
  for (let i = 0; i < n; i++) {
    const e = ((i * 7.31) % 1000).toFixed(3);
    if (i % 97 === 0) t += `# comment ${i}\n`;
    if (i % 89 === 0) t += '\n';
    if (i % 13 === 0) t += `"Pt ${i}, ünïcødé ✓",${e},2,3,${i % 7}\r\n`;
    else if (i % 17 === 0) t += `Ω${i} 𝄞,${e},2,3,4\n`;
    else t += `P${i},${e},${i % 5},3,4\n`;
  }
  return t;
}

describe('BlockComputer', () => {
  it('gives the text and counts of the block computed whole, for slices of any size', () => {
    const text = lines(3000);
    const whole = rows().block(text, 1);
    for (const slice of [1, 7, 100, 4096, 1 << 16, 1 << 22]) {
      const got = new BlockComputer(rows(), slice).block(encoder.encode(text));
      expect(decoder.decode(got.bytes)).toBe(whole.text);
      expect({ rows: got.rows, noted: got.noted, lines: got.lines }).toEqual({
        rows: whole.rows,
        noted: whole.noted,
        lines: whole.lines,
      });
      expect(got.problem).toBeUndefined();
    }
    // Not trivially: the block has rows of every kind.
    expect(whole.rows).toBe(3000);
    expect(whole.lines).toBeGreaterThan(3000);
    expect(whole.text).toContain('ünïcødé ✓');
    expect(whole.text).toContain('𝄞');
  });

  it('a last line without a line break is computed', () => {
    const got = new BlockComputer(rows(), 10).block(encoder.encode('A,0,0,3,4\nB,0,0,6,8'));
    expect(decoder.decode(got.bytes)).toBe(
      'A,0,0,3,4,25.00000000,5.000000000,36.86989765\nB,0,0,6,8,100.0000000,10.00000000,36.86989765\n',
    );
    expect(got.lines).toBe(2);
  });

  it('stops at a bad row, numbering its line from 1 in the block, with the rows before it', () => {
    const good = lines(500).split('\n');
    good.splice(400, 0, 'bad,1,2,x,4');
    const text = good.join('\n');
    const whole = rows().block(text, 1);
    expect(whole.problem?.line).toBe(401);
    for (const slice of [64, 1 << 16]) {
      const got = new BlockComputer(rows(), slice).block(encoder.encode(text));
      expect(got.problem).toEqual({
        line: 401,
        column: 'east2',
        reason: '"x" is not a number',
        unsolvable: false,
      });
      expect(got.lines).toBe(401);
      expect(decoder.decode(got.bytes)).toBe(whole.text);
      expect(got.rows).toBe(whole.rows);
    }
    // With --bad-rows note the block goes on: one row noted.
    const noted = new BlockComputer(rows({ ...float, badRows: 'note' }), 64).block(
      encoder.encode(text),
    );
    expect(noted.problem).toBeUndefined();
    expect(noted.noted).toBe(1);
    expect(noted.rows).toBe(501);
    expect(decoder.decode(noted.bytes)).toBe(
      rows({ ...float, badRows: 'note' }).block(text, 1).text,
    );
  });

  it('keeps its output buffer from block to block without changing answers already given', () => {
    const c = new BlockComputer(rows(), 1 << 12);
    const a = c.block(encoder.encode(lines(100)));
    const copy = a.bytes.slice();
    // Output of about 4 MiB: more than the buffer's first size (2 MiB), which must grow.
    const big = lines(60000);
    const b = c.block(encoder.encode(big));
    expect(b.bytes.length).toBeGreaterThan(3 << 20);
    expect(decoder.decode(b.bytes)).toBe(rows().block(big, 1).text);
    expect(a.bytes).toEqual(copy);
    const again = c.block(encoder.encode(lines(100)));
    expect(again.bytes).toEqual(copy);
  });

  it('writes the output into memory handed to it when that is large enough, else into new memory', () => {
    const text = lines(200);
    const want = rows().block(text, 1).text;
    const n = encoder.encode(want).length;
    const c = new BlockComputer(rows(), 1 << 10);
    const roomy = new Uint8Array(n + 10).fill(7);
    const got = c.block(encoder.encode(text), roomy);
    expect(got.bytes.buffer).toBe(roomy.buffer);
    expect(got.bytes.length).toBe(n);
    expect(decoder.decode(got.bytes)).toBe(want);
    expect(roomy[n]).toBe(7); // nothing written past the output
    const small = new Uint8Array(n - 1);
    const other = c.block(encoder.encode(text), small);
    expect(other.bytes.buffer).not.toBe(small.buffer);
    expect(decoder.decode(other.bytes)).toBe(want);
    // The new memory has room to spare for a later, longer output.
    expect(other.bytes.buffer.byteLength).toBeGreaterThan(n);
  });

  it('keeps a byte order mark inside a block (only the one starting the file is removed, by the main thread)', () => {
    const got = new BlockComputer(rows(), 8).block(encoder.encode('\uFEFFA,0,0,3,4\n'));
    // A U+FEFF at a field's edge is trimmed as white space is, whatever the slice.
    expect(decoder.decode(got.bytes)).toBe('A,0,0,3,4,25.00000000,5.000000000,36.86989765\n');
    expect(decoder.decode(got.bytes)).toBe(rows().block('\uFEFFA,0,0,3,4\n', 1).text);
  });
});

describe('the worker script (dist/batch-worker.js)', () => {
  let script: URL;
  beforeAll(async () => {
    script = pathToFileURL(join(dirname(await bundleCli()), 'batch-worker.js'));
  });
  afterAll(cleanUp);

  it('answers each block by id, with its output and counts, and hands the block memory back', async () => {
    const setup: WorkerSetup = { kind: 'inverses', names, headerLine: 1, options: float };
    const w = new Worker(script, { workerData: { batch: setup } });
    try {
      const answers: WorkerAnswer[] = [];
      const got = new Promise<void>((resolve, reject) => {
        w.on('message', (a: WorkerAnswer) => {
          answers.push(a);
          if (answers.length === 2) resolve();
        });
        w.on('error', reject);
      });
      const texts = [lines(2000), 'A,0,0,3,4\nB,1,1,x,2\n'];
      texts.forEach((t, id) => {
        // A block in memory larger than its length: only `length` bytes are lines.
        const bytes = new Uint8Array(encoder.encode(t).length + 100).fill(65);
        const n = encoder.encodeInto(t, bytes).written;
        w.postMessage({ id, bytes: bytes.buffer, length: n }, [bytes.buffer]);
      });
      await got;
      expect(answers.map((a) => a.id)).toEqual([0, 1]);
      for (const a of answers) {
        if ('failure' in a) throw new Error(a.failure);
        expect(a.input.byteLength).toBe(encoder.encode(texts[a.id]!).length + 100);
      }
      const [first, second] = answers as Extract<WorkerAnswer, { result: unknown }>[];
      const text0 = rows().block(texts[0]!, 1).text;
      expect(first!.result.length).toBe(encoder.encode(text0).length);
      expect(decoder.decode(new Uint8Array(first!.result.bytes, 0, first!.result.length))).toBe(
        text0,
      );
      expect(first!.result.rows).toBe(2000);
      expect(second!.result.problem).toMatchObject({ line: 2, column: 'east2' });
      expect(second!.result.rows).toBe(1);
    } finally {
      await w.terminate();
    }
  });
});
