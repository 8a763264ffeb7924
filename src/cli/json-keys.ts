/**
 * Duplicate keys in JSON text. JSON.parse keeps the last of two equal keys without a word
 * (RFC 8259 §4: names "SHOULD be unique", and then "the behavior of software … is
 * unpredictable"); a job whose point or reading is written twice is refused instead.
 *
 * @module cli
 */
import { joinPath } from './validate.js';

/** A key written twice in one object: its path, the line of the second one (from 1) and the line of the first. */
export interface DuplicateKey {
  path: string;
  line: number;
  firstLine: number;
}

interface Frame {
  path: string;
  /** For an object: the keys seen, with their lines. */
  keys?: Map<string, number>;
  /** For an object: the key whose value comes next. For an array: the index. */
  key: string | number;
  expectKey: boolean;
}

/**
 * The first key that appears twice in the same object of `text`, which must be valid JSON
 * (call after JSON.parse has accepted it), or undefined. Keys are compared after their escapes
 * are read (`"a"` and `"\u0061"` are the same key). Linear in the length of the text.
 */
export function findDuplicateKey(text: string): DuplicateKey | undefined {
  const stack: Frame[] = [];
  let line = 1;
  const child = (): string => {
    const top = stack[stack.length - 1];
    return top === undefined ? '' : joinPath(top.path, top.key);
  };
  for (let i = 0; i < text.length; i++) {
    const c = text[i];
    if (c === '\n') line++;
    else if (c === '{') stack.push({ path: child(), keys: new Map(), key: '', expectKey: true });
    else if (c === '[') stack.push({ path: child(), key: 0, expectKey: false });
    else if (c === '}' || c === ']') stack.pop();
    else if (c === ',') {
      const top = stack[stack.length - 1]!;
      if (top.keys) top.expectKey = true;
      else top.key = (top.key as number) + 1;
    } else if (c === '"') {
      let j = i + 1;
      while (text[j] !== '"') j += text[j] === '\\' ? 2 : 1;
      const top = stack[stack.length - 1];
      if (top?.keys && top.expectKey) {
        const key = JSON.parse(text.slice(i, j + 1)) as string;
        const first = top.keys.get(key);
        if (first !== undefined) return { path: joinPath(top.path, key), line, firstLine: first };
        top.keys.set(key, line);
        top.key = key;
        top.expectKey = false;
      }
      i = j; // a JSON string holds no raw line break
    }
  }
  return undefined;
}
