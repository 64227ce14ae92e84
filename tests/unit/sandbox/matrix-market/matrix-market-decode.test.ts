import { describe, expect, it } from 'vitest';
import { decodeMatrixMarketBytes } from '@sandbox/matrix-market/matrix-market-decode.ts';
import { MatrixMarketError } from '@sandbox/matrix-market/matrix-market-error.ts';

const encode = (text: string): number[] => Array.from(new TextEncoder().encode(text));
const HEAD = encode('%%MatrixMarket matrix array real general\n% comment\n');

function rejection(bytes: number[], maxBytes?: number): MatrixMarketError {
  try {
    decodeMatrixMarketBytes(new Uint8Array(bytes), maxBytes);
  } catch (error) {
    if (error instanceof MatrixMarketError) return error;
    throw error;
  }
  throw new Error('the bytes were accepted');
}

// Invalid sequences from RFC 3629 §3 and the WHATWG Encoding Standard's UTF-8 decoder.
describe('decodeMatrixMarketBytes', () => {
  it('decodes valid UTF-8 (non-ASCII in a comment) and drops a byte-order mark', () => {
    const bytes = [
      0xef,
      0xbb,
      0xbf,
      ...encode('%%MatrixMarket matrix array real general\n% é ∑ 𝔸\n1 1\n2\n'),
    ];
    expect(decodeMatrixMarketBytes(new Uint8Array(bytes))).toBe(
      '%%MatrixMarket matrix array real general\n% é ∑ 𝔸\n1 1\n2\n',
    );
  });

  it('rejects a lone continuation byte, naming its line', () => {
    const e = rejection([...HEAD, ...encode('1 1\n'), 0x80, 0x0a]);
    expect([e.line, e.code, e.reason]).toEqual([4, 'invalid-utf8', 'the text is not valid UTF-8']);
  });

  it('rejects an overlong encoding of "/" (C0 AF)', () => {
    const e = rejection([...HEAD, 0xc0, 0xaf, 0x0a]);
    expect([e.line, e.code]).toEqual([3, 'invalid-utf8']);
  });

  it('rejects an encoded surrogate (ED A0 80, U+D800)', () => {
    const e = rejection([...encode('%%MatrixMarket '), 0xed, 0xa0, 0x80]);
    expect([e.line, e.code]).toEqual([1, 'invalid-utf8']);
  });

  it('rejects a sequence truncated by the end of the file', () => {
    const e = rejection([...HEAD, ...encode('1 1\n5'), 0xe2, 0x88]);
    expect([e.line, e.code]).toEqual([4, 'invalid-utf8']);
  });

  it('rejects Latin-1 text (é as the single byte E9)', () => {
    const e = rejection([...encode('%%MatrixMarket matrix array real general\n% caf'), 0xe9, 0x0a]);
    expect([e.line, e.code]).toEqual([2, 'invalid-utf8']);
  });

  it('rejects more bytes than the limit before decoding, naming the line where it is crossed', () => {
    const e = rejection([...HEAD, ...encode('1 1\n1\n')], HEAD.length + 2);
    expect([e.line, e.code, e.reason]).toEqual([
      3,
      'file-too-large',
      `the file exceeds the limit of ${HEAD.length + 2} bytes`,
    ]);
  });

  it('throws TypeError for a non-Uint8Array and RangeError for a bad limit', () => {
    expect(() => decodeMatrixMarketBytes('text' as unknown as Uint8Array)).toThrow(TypeError);
    expect(() => decodeMatrixMarketBytes(new Uint8Array(1), -1)).toThrow(/^maxBytes must be/);
  });
});
