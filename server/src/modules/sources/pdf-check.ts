/** Files of other types renamed to .pdf are refused, so only the bytes decide. */
const MAGIC = Buffer.from('%PDF-', 'latin1');
const EOF_MARKER = Buffer.from('%%EOF', 'latin1');
/** The PDF header may follow a little junk (the format allows it within the first 1024 bytes). */
const HEADER_WINDOW = 1024;
/** Writers append whitespace or a few bytes after the trailer's %%EOF; look in the last 2 KiB. */
const TRAILER_WINDOW = 2048;

/** True when the bytes look like a PDF: the `%PDF-` header near the start and a `%%EOF` trailer. */
export function looksLikePdf(bytes: Buffer): boolean {
  const header = bytes.indexOf(MAGIC);
  if (header < 0 || header > HEADER_WINDOW) return false;
  const tail = bytes.subarray(Math.max(header + MAGIC.length, bytes.length - TRAILER_WINDOW));
  return (
    tail.includes(EOF_MARKER) && /^\d\.\d/.test(bytes.toString('latin1', header + 5, header + 8))
  );
}
