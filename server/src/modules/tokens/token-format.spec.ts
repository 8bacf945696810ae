import { generateToken, hashMatches, hashToken, tokenPrefix, TOKEN_PATTERN } from './token-format';

describe('API token format', () => {
  it('has a recognisable marker, a public prefix and a 32-byte secret', () => {
    const { token, prefix } = generateToken();
    expect(token).toMatch(TOKEN_PATTERN);
    expect(token.startsWith(`${prefix}_`)).toBe(true);
    expect(prefix).toMatch(/^thp_[0-9a-f]{16}$/);
    expect(Buffer.from(token.slice(prefix.length + 1), 'base64url')).toHaveLength(32);
  });

  it('gives a different token every time', () => {
    const seen = new Set(Array.from({ length: 200 }, () => generateToken().token));
    expect(seen.size).toBe(200);
  });

  it('reads the prefix of well-formed tokens only', () => {
    const { token, prefix } = generateToken();
    expect(tokenPrefix(token)).toBe(prefix);
    for (const bad of ['x', `${token}x`, token.slice(0, -1), token.replace('thp_', 'tkn_'), '']) {
      expect(tokenPrefix(bad)).toBeNull();
    }
  });

  it('hashes under the key and compares in constant time', () => {
    const { token } = generateToken();
    const hash = hashToken(token, 'k'.repeat(32));
    expect(hash).toMatch(/^[0-9a-f]{64}$/);
    expect(hash).not.toContain(token.slice(21));
    expect(hashMatches(token, hash, 'k'.repeat(32))).toBe(true);
    expect(hashMatches(token, hash, 'j'.repeat(32))).toBe(false);
    expect(hashMatches(generateToken().token, hash, 'k'.repeat(32))).toBe(false);
    expect(hashMatches(token, 'abc', 'k'.repeat(32))).toBe(false);
  });
});
