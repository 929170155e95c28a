/**
 * A strict JSON reader (RFC 8259) into a tree whose objects are Maps in the order their
 * members were written, for reading back a sealed section that may have been edited by
 * hand. JSON.parse would do the parsing, but it reorders keys that look like integers (a
 * column called "1" moves first) and builds plain objects from a document's names; here
 * order is kept, duplicate keys are refused, and every failure names its position.
 */
import { sealMsg } from '../messages/seal.ts';

/** A JSON object: members in the order written. */
export class JsonObject {
  readonly members: Map<string, JsonTree>;
  constructor(members: Map<string, JsonTree>) {
    this.members = members;
  }
}

/** A JSON value. */
export type JsonTree = null | boolean | number | string | readonly JsonTree[] | JsonObject;

/** JSON that cannot be read, with the offset where reading stopped. */
export class JsonSyntaxError extends Error {
  readonly offset: number;
  constructor(message: string, offset: number) {
    super(message);
    this.name = 'JsonSyntaxError';
    this.offset = offset;
  }
}

const MAX_DEPTH = 500;
const NUMBER = /-?(?:0|[1-9]\d*)(?:\.\d+)?(?:[eE][-+]?\d+)?/y;

/** Reads one JSON value that fills the whole text. */
export function readJson(text: string): JsonTree {
  let i = 0;
  const fail = (what: string): never => {
    throw new JsonSyntaxError(sealMsg.jsonAt(what, i + 1), i);
  };
  const space = (): void => {
    while (i < text.length && (text[i] === ' ' || text[i] === '\t' || text[i] === '\n' || text[i] === '\r')) i++;
  };
  const value = (depth: number): JsonTree => {
    if (depth > MAX_DEPTH) fail(sealMsg.jsonNestedTooDeeply());
    space();
    const c = text[i];
    if (c === '{') {
      i++;
      const members = new Map<string, JsonTree>();
      space();
      if (text[i] === '}') {
        i++;
        return new JsonObject(members);
      }
      for (;;) {
        space();
        if (text[i] !== '"') fail(sealMsg.jsonExpectedName());
        const at = i;
        const key = string();
        space();
        if (text[i] !== ':') fail(sealMsg.jsonExpected(':'));
        i++;
        if (members.has(key)) {
          i = at;
          fail(`the name ${JSON.stringify(key)} appears twice`);
        }
        members.set(key, value(depth + 1));
        space();
        if (text[i] === ',') {
          i++;
          continue;
        }
        if (text[i] === '}') {
          i++;
          return new JsonObject(members);
        }
        fail(sealMsg.jsonExpectedEither(',', '}'));
      }
    }
    if (c === '[') {
      i++;
      const items: JsonTree[] = [];
      space();
      if (text[i] === ']') {
        i++;
        return items;
      }
      for (;;) {
        items.push(value(depth + 1));
        space();
        if (text[i] === ',') {
          i++;
          continue;
        }
        if (text[i] === ']') {
          i++;
          return items;
        }
        fail(sealMsg.jsonExpectedEither(',', ']'));
      }
    }
    if (c === '"') return string();
    if (text.startsWith('true', i)) {
      i += 4;
      return true;
    }
    if (text.startsWith('false', i)) {
      i += 5;
      return false;
    }
    if (text.startsWith('null', i)) {
      i += 4;
      return null;
    }
    NUMBER.lastIndex = i;
    const m = NUMBER.exec(text);
    if (m === null) return fail(i >= text.length ? 'the text ends too early' : `unexpected ${JSON.stringify(text[i])}`);
    i += m[0].length;
    return Number(m[0]);
  };
  const string = (): string => {
    const start = i;
    i++;
    for (; i < text.length; i++) {
      const ch = text.charCodeAt(i);
      if (ch === 0x22) break;
      if (ch < 0x20) fail(sealMsg.jsonControlCharacter());
      if (ch === 0x5c) {
        i++;
        const e = text[i];
        if (e === 'u') {
          if (!/^[0-9a-fA-F]{4}$/.test(text.slice(i + 1, i + 5))) fail(sealMsg.jsonBadUnicodeEscape());
          i += 4;
        } else if (e === undefined || !'"\\/bfnrt'.includes(e)) fail(sealMsg.jsonBadEscape());
      }
    }
    if (i >= text.length) fail(sealMsg.jsonUnclosedText());
    i++;
    // the escapes were checked above, so JSON.parse of this one literal cannot misread it
    return JSON.parse(text.slice(start, i)) as string;
  };
  const v = value(0);
  space();
  if (i < text.length) fail(sealMsg.jsonTrailingText());
  return v;
}

/** True for two JSON trees that are the same, numbers bit for bit, members in order. */
export function sameTree(a: JsonTree, b: JsonTree): boolean {
  if (typeof a === 'number' || typeof b === 'number') return typeof a === 'number' && typeof b === 'number' && Object.is(a, b);
  if (a === null || b === null || typeof a !== 'object' || typeof b !== 'object') return a === b;
  if (a instanceof JsonObject || b instanceof JsonObject) {
    if (!(a instanceof JsonObject && b instanceof JsonObject) || a.members.size !== b.members.size) return false;
    const kb = [...b.members.keys()];
    let k = 0;
    for (const [key, x] of a.members) {
      if (kb[k++] !== key || !sameTree(x, b.members.get(key)!)) return false;
    }
    return true;
  }
  const xa = a as readonly JsonTree[];
  const xb = b as readonly JsonTree[];
  if (xa.length !== xb.length) return false;
  for (let i = 0; i < xa.length; i++) if (!sameTree(xa[i]!, xb[i]!)) return false;
  return true;
}
