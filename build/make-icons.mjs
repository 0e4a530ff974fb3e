// Draws the app icon (a spark jumping a plug gap on a dark square) and writes it as PNG files in
// build/icons/ at the sizes the Linux desktop and the installers use. Pure Node: a tiny
// rasteriser with 4x4 supersampling and a hand-written PNG encoder (zlib + CRC-32).
import { mkdirSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { deflateSync } from 'node:zlib';

const outDir = path.join(path.dirname(fileURLToPath(import.meta.url)), 'icons');

// Shapes in a 0..1 unit square, painted in order.
const background = [0x1f, 0x29, 0x37];
const electrode = [0xc9, 0xcf, 0xd6];
const spark = [0xff, 0xc2, 0x1a];
const bolt = [
  [0.56, 0.12], [0.3, 0.52], [0.47, 0.52], [0.4, 0.88], [0.7, 0.44], [0.53, 0.44], [0.62, 0.12],
];

function inPolygon(x, y, poly) {
  let inside = false;
  for (let i = 0, j = poly.length - 1; i < poly.length; j = i++) {
    const [xi, yi] = poly[i];
    const [xj, yj] = poly[j];
    if (yi > y !== yj > y && x < ((xj - xi) * (y - yi)) / (yj - yi) + xi) inside = !inside;
  }
  return inside;
}

function inRoundedSquare(x, y, r) {
  const cx = Math.min(Math.max(x, r), 1 - r);
  const cy = Math.min(Math.max(y, r), 1 - r);
  return (x - cx) ** 2 + (y - cy) ** 2 <= r * r;
}

function colourAt(x, y) {
  if (!inRoundedSquare(x, y, 0.18)) return null;
  if (inPolygon(x, y, bolt)) return spark;
  // The two electrodes of the gap, above and below the spark.
  if (x > 0.38 && x < 0.62 && ((y > 0.04 && y < 0.1) || (y > 0.9 && y < 0.96))) return electrode;
  return background;
}

function render(size) {
  const ss = 4;
  const rows = [];
  for (let py = 0; py < size; py++) {
    const row = Buffer.alloc(1 + size * 4); // filter byte 0, then RGBA
    for (let px = 0; px < size; px++) {
      let r = 0, g = 0, b = 0, a = 0;
      for (let sy = 0; sy < ss; sy++) {
        for (let sx = 0; sx < ss; sx++) {
          const c = colourAt((px + (sx + 0.5) / ss) / size, (py + (sy + 0.5) / ss) / size);
          if (c) { r += c[0]; g += c[1]; b += c[2]; a += 1; }
        }
      }
      const o = 1 + px * 4;
      if (a > 0) { row[o] = Math.round(r / a); row[o + 1] = Math.round(g / a); row[o + 2] = Math.round(b / a); }
      row[o + 3] = Math.round((255 * a) / (ss * ss));
    }
    rows.push(row);
  }
  return png(size, Buffer.concat(rows));
}

const crcTable = Array.from({ length: 256 }, (_, n) => {
  let c = n;
  for (let k = 0; k < 8; k++) c = c & 1 ? 0xedb88320 ^ (c >>> 1) : c >>> 1;
  return c >>> 0;
});
function crc32(buf) {
  let c = 0xffffffff;
  for (const byte of buf) c = crcTable[(c ^ byte) & 0xff] ^ (c >>> 8);
  return (c ^ 0xffffffff) >>> 0;
}
function chunk(type, data) {
  const len = Buffer.alloc(4);
  len.writeUInt32BE(data.length);
  const body = Buffer.concat([Buffer.from(type, 'ascii'), data]);
  const crc = Buffer.alloc(4);
  crc.writeUInt32BE(crc32(body));
  return Buffer.concat([len, body, crc]);
}
function png(size, raw) {
  const ihdr = Buffer.alloc(13);
  ihdr.writeUInt32BE(size, 0);
  ihdr.writeUInt32BE(size, 4);
  ihdr[8] = 8; // bit depth
  ihdr[9] = 6; // RGBA
  return Buffer.concat([
    Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]),
    chunk('IHDR', ihdr),
    chunk('IDAT', deflateSync(raw, { level: 9 })),
    chunk('IEND', Buffer.alloc(0)),
  ]);
}

mkdirSync(outDir, { recursive: true });
for (const size of [16, 32, 48, 64, 128, 256, 512]) {
  writeFileSync(path.join(outDir, `${size}x${size}.png`), render(size));
}
console.log(`Wrote icons to ${outDir}`);
