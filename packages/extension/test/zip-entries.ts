/**
 * Lists the file names in a zip archive (a .vsix is one) by reading its
 * central directory, as the PKWARE APPNOTE (section 4.3) lays it out. Enough
 * for tests; no decompression.
 */
import { readFileSync } from 'node:fs';

// Record signatures and fixed sizes from PKWARE APPNOTE 6.3.x, sections 4.3.12 and 4.3.16.
const END_OF_CENTRAL_DIRECTORY = 0x06054b50;
const CENTRAL_FILE_HEADER = 0x02014b50;
const END_RECORD_SIZE = 22;
const CENTRAL_HEADER_SIZE = 46;
const MAX_COMMENT = 0xffff;

export function zipEntries(path: string): string[] {
  const zip = readFileSync(path);
  let end = -1;
  const lowest = Math.max(0, zip.length - END_RECORD_SIZE - MAX_COMMENT);
  for (let at = zip.length - END_RECORD_SIZE; at >= lowest; at--) {
    if (zip.readUInt32LE(at) === END_OF_CENTRAL_DIRECTORY) {
      end = at;
      break;
    }
  }
  if (end < 0) throw new Error(`${path}: no zip end-of-central-directory record`);
  const count = zip.readUInt16LE(end + 10);
  let at = zip.readUInt32LE(end + 16);
  const names: string[] = [];
  for (let i = 0; i < count; i++) {
    if (zip.readUInt32LE(at) !== CENTRAL_FILE_HEADER) throw new Error(`${path}: bad central directory entry ${i}`);
    const nameLength = zip.readUInt16LE(at + 28);
    const extraLength = zip.readUInt16LE(at + 30);
    const commentLength = zip.readUInt16LE(at + 32);
    names.push(zip.toString('utf8', at + CENTRAL_HEADER_SIZE, at + CENTRAL_HEADER_SIZE + nameLength));
    at += CENTRAL_HEADER_SIZE + nameLength + extraLength + commentLength;
  }
  return names;
}
