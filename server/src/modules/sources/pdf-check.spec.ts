import { looksLikePdf } from './pdf-check';

const pdf = (body: string) => Buffer.from(`%PDF-1.7\n${body}\ntrailer\n<<>>\n%%EOF\n`, 'latin1');

describe('looksLikePdf', () => {
  it('accepts the header and a trailer, also with trailing bytes after %%EOF', () => {
    expect(looksLikePdf(pdf('1 0 obj << >> endobj'))).toBe(true);
    expect(looksLikePdf(Buffer.concat([pdf(''), Buffer.from('\r\n\0\0')]))).toBe(true);
  });

  it('refuses other files, whatever they are called', () => {
    expect(looksLikePdf(Buffer.from('PK\x03\x04 a zip file', 'latin1'))).toBe(false);
    expect(looksLikePdf(Buffer.from('<html>%PDF-1.4 lies</html>'))).toBe(false);
    expect(looksLikePdf(Buffer.alloc(0))).toBe(false);
  });

  it('refuses a header without a trailer (a truncated upload) and a trailer without a header', () => {
    expect(looksLikePdf(Buffer.from('%PDF-1.4\n1 0 obj\n'))).toBe(false);
    expect(looksLikePdf(Buffer.from('hello\n%%EOF\n'))).toBe(false);
    expect(looksLikePdf(Buffer.from('%PDF-x.y\n%%EOF'))).toBe(false);
  });
});
