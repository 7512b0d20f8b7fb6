/**
 * Draws the app's own mark and writes it to public/: an SVG, PNGs at the sizes an installed app
 * and a phone's home screen ask for, and favicon.ico. Run `node scripts/make-icons.mjs` after
 * changing the drawing; the files it writes are committed, so a build does not depend on it.
 *
 * The mark: a deep teal rounded square holding a three-by-three block of pale tiles, one of them
 * amber — a small group of people in which one outcome stands out, in the app's own colours.
 * Drawn here from rectangles with rounded corners; the PNGs are rasterised by this script itself
 * (4 × 4 samples a pixel), with no image library.
 */
import { deflateSync } from 'node:zlib';
import { mkdirSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';

const PUBLIC = fileURLToPath(new URL('../public/', import.meta.url));

export const MARK_COLOURS = { ground: '#0e5a55', tile: '#eef6f4', accent: '#f0a830' };

/** Shapes in a 64 × 64 box: rounded rectangles {x, y, w, h, r, fill}, painted in order. */
function shapes({ maskable }) {
  const list = [];
  list.push(maskable ? { x: 0, y: 0, w: 64, h: 64, r: 0, fill: MARK_COLOURS.ground } : { x: 0, y: 0, w: 64, h: 64, r: 14, fill: MARK_COLOURS.ground });
  // Maskable icons keep their content inside the central 80% circle: shrink the tiles about the centre.
  const scale = maskable ? 0.72 : 1;
  const place = (v) => 32 + (v - 32) * scale;
  for (let row = 0; row < 3; row += 1) {
    for (let column = 0; column < 3; column += 1) {
      const x = 11 + column * 15;
      const y = 11 + row * 15;
      const accent = row === 2 && column === 2;
      list.push({ x: place(x), y: place(y), w: 12 * scale, h: 12 * scale, r: 3.2 * scale, fill: accent ? MARK_COLOURS.accent : MARK_COLOURS.tile });
    }
  }
  return list;
}

export function markSvg({ maskable = false } = {}) {
  const rects = shapes({ maskable })
    .map((s) => `<rect x="${+s.x.toFixed(3)}" y="${+s.y.toFixed(3)}" width="${+s.w.toFixed(3)}" height="${+s.h.toFixed(3)}" rx="${+s.r.toFixed(3)}" fill="${s.fill}"/>`)
    .join('');
  return `<svg xmlns="http://www.w3.org/2000/svg" viewBox="0 0 64 64">${rects}</svg>\n`;
}

function inside(s, px, py) {
  if (px < s.x || py < s.y || px > s.x + s.w || py > s.y + s.h) return false;
  const cx = Math.min(Math.max(px, s.x + s.r), s.x + s.w - s.r);
  const cy = Math.min(Math.max(py, s.y + s.r), s.y + s.h - s.r);
  return (px - cx) ** 2 + (py - cy) ** 2 <= s.r ** 2;
}

const rgb = (hex) => [1, 3, 5].map((i) => parseInt(hex.slice(i, i + 2), 16));

/** RGBA pixels of the mark at size × size, 4 × 4 samples per pixel. */
function raster(size, options) {
  const list = shapes(options).map((s) => ({ ...s, rgb: rgb(s.fill) }));
  const pixels = Buffer.alloc(size * size * 4);
  const n = 4;
  for (let y = 0; y < size; y += 1) {
    for (let x = 0; x < size; x += 1) {
      let r = 0, g = 0, b = 0, a = 0;
      for (let sy = 0; sy < n; sy += 1) {
        for (let sx = 0; sx < n; sx += 1) {
          const px = ((x + (sx + 0.5) / n) * 64) / size;
          const py = ((y + (sy + 0.5) / n) * 64) / size;
          let colour = null;
          for (const s of list) if (inside(s, px, py)) colour = s.rgb;
          if (colour) {
            r += colour[0]; g += colour[1]; b += colour[2]; a += 1;
          }
        }
      }
      const o = (y * size + x) * 4;
      pixels[o] = a ? Math.round(r / a) : 0;
      pixels[o + 1] = a ? Math.round(g / a) : 0;
      pixels[o + 2] = a ? Math.round(b / a) : 0;
      pixels[o + 3] = Math.round((a / (n * n)) * 255);
    }
  }
  return pixels;
}

const CRC_TABLE = Array.from({ length: 256 }, (_, k) => {
  let c = k;
  for (let i = 0; i < 8; i += 1) c = c & 1 ? 0xedb88320 ^ (c >>> 1) : c >>> 1;
  return c >>> 0;
});
function crc32(buffer) {
  let c = 0xffffffff;
  for (const byte of buffer) c = CRC_TABLE[(c ^ byte) & 0xff] ^ (c >>> 8);
  return (c ^ 0xffffffff) >>> 0;
}
function chunk(type, data) {
  const length = Buffer.alloc(4);
  length.writeUInt32BE(data.length);
  const body = Buffer.concat([Buffer.from(type, 'ascii'), data]);
  const crc = Buffer.alloc(4);
  crc.writeUInt32BE(crc32(body));
  return Buffer.concat([length, body, crc]);
}

/** A PNG (ISO/IEC 15948): 8-bit RGBA, no filtering, one IDAT. */
export function png(size, options = {}) {
  const pixels = raster(size, options);
  const rows = Buffer.alloc(size * (size * 4 + 1));
  for (let y = 0; y < size; y += 1) {
    rows[y * (size * 4 + 1)] = 0;
    pixels.copy(rows, y * (size * 4 + 1) + 1, y * size * 4, (y + 1) * size * 4);
  }
  const header = Buffer.alloc(13);
  header.writeUInt32BE(size, 0);
  header.writeUInt32BE(size, 4);
  header[8] = 8; // bit depth
  header[9] = 6; // RGBA
  return Buffer.concat([Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]), chunk('IHDR', header), chunk('IDAT', deflateSync(rows, { level: 9 })), chunk('IEND', Buffer.alloc(0))]);
}

/** An ICO holding PNG images (allowed since Windows Vista; every current browser reads it). */
export function ico(images) {
  const header = Buffer.alloc(6);
  header.writeUInt16LE(0, 0);
  header.writeUInt16LE(1, 2);
  header.writeUInt16LE(images.length, 4);
  let offset = 6 + 16 * images.length;
  const entries = images.map(({ size, data }) => {
    const e = Buffer.alloc(16);
    e[0] = size >= 256 ? 0 : size;
    e[1] = size >= 256 ? 0 : size;
    e.writeUInt16LE(1, 4); // colour planes
    e.writeUInt16LE(32, 6); // bits per pixel
    e.writeUInt32LE(data.length, 8);
    e.writeUInt32LE(offset, 12);
    offset += data.length;
    return e;
  });
  return Buffer.concat([header, ...entries, ...images.map((i) => i.data)]);
}

function main() {
  mkdirSync(PUBLIC, { recursive: true });
  writeFileSync(join(PUBLIC, 'icon.svg'), markSvg());
  for (const size of [192, 512]) writeFileSync(join(PUBLIC, `icon-${size}.png`), png(size));
  writeFileSync(join(PUBLIC, 'icon-maskable-512.png'), png(512, { maskable: true }));
  writeFileSync(join(PUBLIC, 'apple-touch-icon.png'), png(180, { maskable: true }));
  writeFileSync(join(PUBLIC, 'favicon.ico'), ico([16, 32, 48].map((size) => ({ size, data: png(size) }))));
}

main();
