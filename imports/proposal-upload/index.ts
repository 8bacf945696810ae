/**
 * Bulk upload of proposal items (imports/README.md, "Proposal upload"): a CSV file of the
 * registry's tabular format, or the same rows as XML. `readUpload` turns bytes into rows (or a
 * FileProblem); `checkRows` checks them with the registry parsers against known references.
 */
import { readCsvUpload } from './csv-upload';
import type { RawUpload } from './upload-rows';
import { decodeUpload, detectFormat } from './upload-text';
import { readXmlUpload } from './xml-upload';

export {
  checkRows,
  type CheckedUpload,
  type KnownReferences,
  type UploadEntry,
} from './check-rows';
export { LAYOUTS, LAYOUT_NAMES, type Layout } from './layouts';
export * from './upload-rows';
export { FileProblem, type FileProblemCode, type UploadFormat } from './upload-text';
export { XML_ROOT } from './xml-upload';

/** Bytes → rows. Throws FileProblem when the file cannot be read as rows at all. */
export function readUpload(bytes: Uint8Array, fileName = ''): RawUpload {
  const text = decodeUpload(bytes);
  return detectFormat(text, fileName) === 'xml' ? readXmlUpload(text) : readCsvUpload(text);
}
