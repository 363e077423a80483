/**
 * Reads a zip archive (a .vsix is one) by its central directory, as the
 * PKWARE APPNOTE (6.3.x, section 4.3) lays it out: the names of its files,
 * and their contents for the two methods vsce writes (0 stored, 8 deflated,
 * section 4.4.5). Enough for tests.
 */
import { readFileSync } from 'node:fs';
import { inflateRawSync } from 'node:zlib';

// Record signatures and fixed sizes from PKWARE APPNOTE 6.3.x, sections 4.3.7, 4.3.12 and 4.3.16.
const END_OF_CENTRAL_DIRECTORY = 0x06054b50;
const CENTRAL_FILE_HEADER = 0x02014b50;
const LOCAL_FILE_HEADER = 0x04034b50;
const END_RECORD_SIZE = 22;
const CENTRAL_HEADER_SIZE = 46;
const LOCAL_HEADER_SIZE = 30;
const MAX_COMMENT = 0xffff;
const STORED = 0;
const DEFLATED = 8;

interface CentralEntry {
  name: string;
  method: number;
  compressedSize: number;
  size: number;
  localHeader: number;
}

function centralDirectory(zip: Buffer, path: string): CentralEntry[] {
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
  const entries: CentralEntry[] = [];
  for (let i = 0; i < count; i++) {
    if (zip.readUInt32LE(at) !== CENTRAL_FILE_HEADER) throw new Error(`${path}: bad central directory entry ${i}`);
    const nameLength = zip.readUInt16LE(at + 28);
    const extraLength = zip.readUInt16LE(at + 30);
    const commentLength = zip.readUInt16LE(at + 32);
    entries.push({
      name: zip.toString('utf8', at + CENTRAL_HEADER_SIZE, at + CENTRAL_HEADER_SIZE + nameLength),
      method: zip.readUInt16LE(at + 10),
      compressedSize: zip.readUInt32LE(at + 20),
      size: zip.readUInt32LE(at + 24),
      localHeader: zip.readUInt32LE(at + 42),
    });
    at += CENTRAL_HEADER_SIZE + nameLength + extraLength + commentLength;
  }
  return entries;
}

/** The file names in a zip archive, in the order of its central directory. */
export function zipEntries(path: string): string[] {
  return centralDirectory(readFileSync(path), path).map((entry) => entry.name);
}

/** Every file of a zip archive with its contents (folders left out). */
export function zipFiles(path: string): Map<string, Buffer> {
  const zip = readFileSync(path);
  const files = new Map<string, Buffer>();
  for (const entry of centralDirectory(zip, path)) {
    if (entry.name.endsWith('/')) continue;
    const at = entry.localHeader;
    if (zip.readUInt32LE(at) !== LOCAL_FILE_HEADER) throw new Error(`${path}: bad local header for ${entry.name}`);
    const start = at + LOCAL_HEADER_SIZE + zip.readUInt16LE(at + 26) + zip.readUInt16LE(at + 28);
    const data = zip.subarray(start, start + entry.compressedSize);
    let content: Buffer;
    if (entry.method === STORED) content = Buffer.from(data);
    else if (entry.method === DEFLATED) content = inflateRawSync(data);
    else throw new Error(`${path}: ${entry.name} uses compression method ${entry.method}`);
    if (content.length !== entry.size) throw new Error(`${path}: ${entry.name} is ${content.length} bytes, the directory says ${entry.size}`);
    files.set(entry.name, content);
  }
  return files;
}
