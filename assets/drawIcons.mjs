// Draws Loadwright's icons (our own mark: a beam on two supports under three
// loads) as PNG files at the sizes the manifest names. Run: node assets/drawIcons.mjs
import { writeFileSync } from "node:fs";
import { deflateSync } from "node:zlib";

const SIZES = [16, 32, 64, 80, 128];
const BACKGROUND = [35, 65, 90];
const BEAM = [255, 255, 255];
const LOAD = [242, 178, 51];

const inRect = (x, y, x0, y0, x1, y1) => x >= x0 && x <= x1 && y >= y0 && y <= y1;
function inTriangle(x, y, [ax, ay], [bx, by], [cx, cy]) {
  const s = (px, py, qx, qy, rx, ry) => (px - rx) * (qy - ry) - (qx - rx) * (py - ry);
  const d1 = s(x, y, ax, ay, bx, by);
  const d2 = s(x, y, bx, by, cx, cy);
  const d3 = s(x, y, cx, cy, ax, ay);
  return !((d1 < 0 || d2 < 0 || d3 < 0) && (d1 > 0 || d2 > 0 || d3 > 0));
}
function inRoundedSquare(x, y, r) {
  const cx = Math.min(Math.max(x, r), 1 - r);
  const cy = Math.min(Math.max(y, r), 1 - r);
  return (x - cx) ** 2 + (y - cy) ** 2 <= r * r;
}

/** The colour at (x, y) in the unit square, or null outside the mark. */
function colourAt(x, y) {
  if (!inRoundedSquare(x, y, 0.18)) return null;
  if (inRect(x, y, 0.12, 0.58, 0.88, 0.68)) return BEAM;
  if (inTriangle(x, y, [0.22, 0.68], [0.12, 0.84], [0.32, 0.84])) return BEAM;
  if (inTriangle(x, y, [0.78, 0.68], [0.68, 0.84], [0.88, 0.84])) return BEAM;
  for (const ax of [0.3, 0.5, 0.7]) {
    if (inRect(x, y, ax - 0.035, 0.16, ax + 0.035, 0.42)) return LOAD;
    if (inTriangle(x, y, [ax - 0.1, 0.4], [ax + 0.1, 0.4], [ax, 0.54])) return LOAD;
  }
  return BACKGROUND;
}

function pixels(size) {
  const n = 4; // supersampling per axis
  const data = Buffer.alloc(size * (size * 4 + 1));
  for (let py = 0; py < size; py++) {
    data[py * (size * 4 + 1)] = 0; // filter: none
    for (let px = 0; px < size; px++) {
      const sum = [0, 0, 0, 0];
      for (let sy = 0; sy < n; sy++) {
        for (let sx = 0; sx < n; sx++) {
          const c = colourAt((px + (sx + 0.5) / n) / size, (py + (sy + 0.5) / n) / size);
          if (!c) continue;
          sum[0] += c[0];
          sum[1] += c[1];
          sum[2] += c[2];
          sum[3] += 1;
        }
      }
      const at = py * (size * 4 + 1) + 1 + px * 4;
      const covered = sum[3];
      data[at] = covered ? Math.round(sum[0] / covered) : 0;
      data[at + 1] = covered ? Math.round(sum[1] / covered) : 0;
      data[at + 2] = covered ? Math.round(sum[2] / covered) : 0;
      data[at + 3] = Math.round((covered / (n * n)) * 255);
    }
  }
  return data;
}

const CRC_TABLE = Array.from({ length: 256 }, (_, k) => {
  let c = k;
  for (let i = 0; i < 8; i++) c = c & 1 ? 0xedb88320 ^ (c >>> 1) : c >>> 1;
  return c >>> 0;
});
function crc32(buffer) {
  let c = 0xffffffff;
  for (const b of buffer) c = CRC_TABLE[(c ^ b) & 0xff] ^ (c >>> 8);
  return (c ^ 0xffffffff) >>> 0;
}
function chunk(type, body) {
  const length = Buffer.alloc(4);
  length.writeUInt32BE(body.length);
  const typed = Buffer.concat([Buffer.from(type, "ascii"), body]);
  const crc = Buffer.alloc(4);
  crc.writeUInt32BE(crc32(typed));
  return Buffer.concat([length, typed, crc]);
}
function png(size) {
  const header = Buffer.alloc(13);
  header.writeUInt32BE(size, 0);
  header.writeUInt32BE(size, 4);
  header[8] = 8; // bit depth
  header[9] = 6; // RGBA
  return Buffer.concat([
    Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]),
    chunk("IHDR", header),
    chunk("IDAT", deflateSync(pixels(size))),
    chunk("IEND", Buffer.alloc(0)),
  ]);
}

for (const size of SIZES) writeFileSync(new URL(`./icon-${size}.png`, import.meta.url), png(size));
