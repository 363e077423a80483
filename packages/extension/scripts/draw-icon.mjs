// Draws the extension icon (128x128 PNG): a plant-room producer feeding a
// main, a riser and branches ending in inlets; and the icon of .vacnet files
// in the explorer (32x32 PNG, the same network without the tile, in colours
// that read on light and dark themes). Pure geometry and zlib, so the icons
// are ours and reproducible: `node scripts/draw-icon.mjs` rewrites
// images/icon.png and images/file-icon.png byte for byte.
import { writeFileSync } from 'node:fs';
import { deflateSync } from 'node:zlib';
import { fileURLToPath } from 'node:url';

const SIZE = 128;
// 4 x 4 samples per pixel for smooth edges (common practice for supersampling).
const SAMPLES = 4;

const background = [14, 90, 111]; // deep teal
const pipe = [244, 248, 250]; // near white
const inlet = [242, 179, 61]; // amber

// Pipes as segments [x1, y1, x2, y2], drawn with round caps.
const PIPE_HALF_WIDTH = 4;
const pipes = [
  [34, 96, 100, 96], // main from the producer
  [64, 96, 64, 26], // riser
  [64, 44, 98, 44], // upper branch
  [64, 68, 30, 68], // lower branch
];
const inlets = [
  [98, 44],
  [30, 68],
  [100, 96],
  [64, 26],
];
const INLET_RADIUS = 8;
const producer = { x: 30, y: 96, outer: 15, inner: 8 };

function distanceToSegment(px, py, [x1, y1, x2, y2]) {
  const dx = x2 - x1;
  const dy = y2 - y1;
  const t = Math.max(0, Math.min(1, ((px - x1) * dx + (py - y1) * dy) / (dx * dx + dy * dy)));
  return Math.hypot(px - (x1 + t * dx), py - (y1 + t * dy));
}

/** Inside a square with rounded corners covering the whole icon. */
function insideTile(px, py) {
  const radius = 26;
  const cx = Math.min(Math.max(px, radius), SIZE - radius);
  const cy = Math.min(Math.max(py, radius), SIZE - radius);
  return Math.hypot(px - cx, py - cy) <= radius;
}

/** The colour at one sample point of the extension icon, or null outside the tile. */
function colourAt(px, py) {
  if (!insideTile(px, py)) return null;
  if (inlets.some(([x, y]) => Math.hypot(px - x, py - y) <= INLET_RADIUS)) return inlet;
  const fromProducer = Math.hypot(px - producer.x, py - producer.y);
  if (fromProducer <= producer.inner) return background;
  if (fromProducer <= producer.outer) return pipe;
  if (pipes.some((segment) => distanceToSegment(px, py, segment) <= PIPE_HALF_WIDTH)) return pipe;
  return background;
}

// The file icon: the same network scaled to 32 px, pipes in a mid teal and
// inlets in amber on a transparent ground (mid tones keep contrast on both
// the light and the dark themes).
const FILE_SIZE = 32;
const FILE_SCALE = FILE_SIZE / SIZE;
const filePipe = [33, 145, 168]; // mid teal
const FILE_PIPE_HALF_WIDTH = 6; // in icon units: 1.5 px at 32 px
const FILE_INLET_RADIUS = 11;

/** The colour at one sample point of the file icon (coordinates in 32 px), or null where transparent. */
function fileColourAt(px, py) {
  const x = px / FILE_SCALE;
  const y = py / FILE_SCALE;
  if (inlets.some(([ix, iy]) => Math.hypot(x - ix, y - iy) <= FILE_INLET_RADIUS)) return inlet;
  const fromProducer = Math.hypot(x - producer.x, y - producer.y);
  if (fromProducer <= producer.outer + 2 && fromProducer > producer.inner - 1) return filePipe;
  if (fromProducer <= producer.inner - 1) return null;
  if (pipes.some((segment) => distanceToSegment(x, y, segment) <= FILE_PIPE_HALF_WIDTH)) return filePipe;
  return null;
}

/** RGBA pixels, row by row, of a square image `size` wide, coloured by `colourOf`. */
function render(size = SIZE, colourOf = colourAt) {
  const pixels = Buffer.alloc(size * size * 4);
  for (let y = 0; y < size; y++) {
    for (let x = 0; x < size; x++) {
      const sum = [0, 0, 0, 0];
      for (let sy = 0; sy < SAMPLES; sy++) {
        for (let sx = 0; sx < SAMPLES; sx++) {
          const colour = colourOf(x + (sx + 0.5) / SAMPLES, y + (sy + 0.5) / SAMPLES);
          if (!colour) continue;
          sum[0] += colour[0];
          sum[1] += colour[1];
          sum[2] += colour[2];
          sum[3] += 255;
        }
      }
      const covered = sum[3] / 255;
      const at = (y * size + x) * 4;
      for (let c = 0; c < 3; c++) pixels[at + c] = covered ? Math.round(sum[c] / covered) : 0;
      pixels[at + 3] = Math.round(sum[3] / (SAMPLES * SAMPLES));
    }
  }
  return pixels;
}

// CRC-32 as the PNG specification (ISO/IEC 15948, annex D) defines it.
const CRC_TABLE = Array.from({ length: 256 }, (_, n) => {
  let c = n;
  for (let k = 0; k < 8; k++) c = c & 1 ? 0xedb88320 ^ (c >>> 1) : c >>> 1;
  return c >>> 0;
});
function crc32(bytes) {
  let c = 0xffffffff;
  for (const byte of bytes) c = CRC_TABLE[(c ^ byte) & 0xff] ^ (c >>> 8);
  return (c ^ 0xffffffff) >>> 0;
}

function chunk(type, data) {
  const length = Buffer.alloc(4);
  length.writeUInt32BE(data.length);
  const body = Buffer.concat([Buffer.from(type, 'latin1'), data]);
  const crc = Buffer.alloc(4);
  crc.writeUInt32BE(crc32(body));
  return Buffer.concat([length, body, crc]);
}

/** RGBA pixels as PNG file bytes (8-bit RGBA, no interlace). */
function png(size, pixels) {
  const header = Buffer.alloc(13);
  header.writeUInt32BE(size, 0);
  header.writeUInt32BE(size, 4);
  header[8] = 8; // bit depth
  header[9] = 6; // colour type: RGBA
  const rows = Buffer.alloc(size * (size * 4 + 1));
  for (let y = 0; y < size; y++) {
    rows[y * (size * 4 + 1)] = 0; // filter: none
    pixels.copy(rows, y * (size * 4 + 1) + 1, y * size * 4, (y + 1) * size * 4);
  }
  return Buffer.concat([
    Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]),
    chunk('IHDR', header),
    chunk('IDAT', deflateSync(rows, { level: 9 })),
    chunk('IEND', Buffer.alloc(0)),
  ]);
}

/** The extension icon as PNG file bytes. */
export function drawIcon() {
  return png(SIZE, render());
}

/** The .vacnet file icon as PNG file bytes. */
export function drawFileIcon() {
  return png(FILE_SIZE, render(FILE_SIZE, fileColourAt));
}

if (process.argv[1] === fileURLToPath(import.meta.url)) {
  writeFileSync(new URL('../images/icon.png', import.meta.url), drawIcon());
  writeFileSync(new URL('../images/file-icon.png', import.meta.url), drawFileIcon());
}
