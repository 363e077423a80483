// Draws the extension icon (128x128 PNG): a plant-room producer feeding a
// main, a riser and branches ending in inlets. Pure geometry and zlib, so the
// icon is ours and reproducible: `node scripts/draw-icon.mjs` rewrites
// images/icon.png byte for byte.
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

/** The colour at one sample point, or null outside the tile. */
function colourAt(px, py) {
  if (!insideTile(px, py)) return null;
  if (inlets.some(([x, y]) => Math.hypot(px - x, py - y) <= INLET_RADIUS)) return inlet;
  const fromProducer = Math.hypot(px - producer.x, py - producer.y);
  if (fromProducer <= producer.inner) return background;
  if (fromProducer <= producer.outer) return pipe;
  if (pipes.some((segment) => distanceToSegment(px, py, segment) <= PIPE_HALF_WIDTH)) return pipe;
  return background;
}

/** RGBA pixels, row by row. */
function render() {
  const pixels = Buffer.alloc(SIZE * SIZE * 4);
  for (let y = 0; y < SIZE; y++) {
    for (let x = 0; x < SIZE; x++) {
      const sum = [0, 0, 0, 0];
      for (let sy = 0; sy < SAMPLES; sy++) {
        for (let sx = 0; sx < SAMPLES; sx++) {
          const colour = colourAt(x + (sx + 0.5) / SAMPLES, y + (sy + 0.5) / SAMPLES);
          if (!colour) continue;
          sum[0] += colour[0];
          sum[1] += colour[1];
          sum[2] += colour[2];
          sum[3] += 255;
        }
      }
      const covered = sum[3] / 255;
      const at = (y * SIZE + x) * 4;
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

/** The icon as PNG file bytes (8-bit RGBA, no interlace). */
export function drawIcon() {
  const pixels = render();
  const header = Buffer.alloc(13);
  header.writeUInt32BE(SIZE, 0);
  header.writeUInt32BE(SIZE, 4);
  header[8] = 8; // bit depth
  header[9] = 6; // colour type: RGBA
  const rows = Buffer.alloc(SIZE * (SIZE * 4 + 1));
  for (let y = 0; y < SIZE; y++) {
    rows[y * (SIZE * 4 + 1)] = 0; // filter: none
    pixels.copy(rows, y * (SIZE * 4 + 1) + 1, y * SIZE * 4, (y + 1) * SIZE * 4);
  }
  return Buffer.concat([
    Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]),
    chunk('IHDR', header),
    chunk('IDAT', deflateSync(rows, { level: 9 })),
    chunk('IEND', Buffer.alloc(0)),
  ]);
}

if (process.argv[1] === fileURLToPath(import.meta.url)) {
  writeFileSync(new URL('../images/icon.png', import.meta.url), drawIcon());
}
