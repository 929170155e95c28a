/**
 * Bytes to text: UTF-8 only, and a byte-order mark kept, so that a document that starts with
 * one comes back with it and a doubled mark is not taken for a document.
 */
import { describe, expect, it } from 'vitest';
import { readDocument, writeDocument } from '../../src/doc/format.ts';
import { NotUtf8Error, decodeUtf8 } from '../../src/doc/utf8.ts';
import { msg } from '../../src/messages/language.ts';

const bytes = (s: string): Uint8Array => new TextEncoder().encode(s);

describe('decodeUtf8', () => {
  it('keeps a byte-order mark, so a document with one is written back with it, byte for byte', () => {
    const original = bytes('\uFEFFfurrow 1\ntitle: marked\n\n--- formula\nx = 1\n');
    const text = decodeUtf8(original);
    expect(text.charCodeAt(0)).toBe(0xfeff);
    const doc = readDocument(text).document;
    expect(doc.bom).toBe(true);
    expect(new TextEncoder().encode(writeDocument(doc))).toEqual(original);
  });
  it('a doubled mark is not a document', () => {
    const text = decodeUtf8(bytes('\uFEFF\uFEFFfurrow 1\n'));
    expect(() => readDocument(text)).toThrow(msg.notADocument());
  });
  it('refuses bytes that are not UTF-8 instead of replacing them', () => {
    expect(() => decodeUtf8(new Uint8Array([0x61, 0xff, 0x62]))).toThrow(NotUtf8Error);
    expect(() => decodeUtf8(new Uint8Array([0xc3]))).toThrow(NotUtf8Error); // cut in the middle of a character
    expect(decodeUtf8(bytes('é µ'))).toBe('é µ');
  });
});
