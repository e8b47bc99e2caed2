import { jsonDepth, loneSurrogatePath, verifyJsonDepth } from './json-guard';

describe('request body guards', () => {
  it('counts nesting without parsing, skipping brackets inside strings', () => {
    expect(jsonDepth('{"a":[1,{"b":2}]}')).toBe(3);
    expect(jsonDepth('{"a":"[[[[{{{{\\"]]"}')).toBe(1);
    expect(jsonDepth('1')).toBe(0);
    expect(jsonDepth('{"a":'.repeat(3000) + '1' + '}'.repeat(3000))).toBe(3000);
  });

  it('refuses a body deeper than 32 levels with a 400 body-parser error, and lets a shallow one through', () => {
    const deep = Buffer.from('['.repeat(40) + ']'.repeat(40));
    expect(() => verifyJsonDepth(null, null, deep)).toThrow(
      expect.objectContaining({ type: 'entity.too.deep', status: 400 }),
    );
    expect(() => verifyJsonDepth(null, null, Buffer.from('{"a":[{"b":[1]}]}'))).not.toThrow();
  });

  it('finds a lone surrogate in values and keys, and accepts proper pairs', () => {
    expect(loneSurrogatePath({ name: 'ok', notes: ['fine', 'a\uD800b'] })).toBe('notes[1]');
    expect(loneSurrogatePath({ ['k\uDC00']: 1 })).toBe('k\uDC00');
    expect(loneSurrogatePath('x\uDBFF')).toBe('(body)');
    expect(loneSurrogatePath({ name: 'Ines 🪨 Carrow', a: { b: '\uD83D\uDE00' } })).toBeNull();
  });
});
