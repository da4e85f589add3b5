/**
 * Draws the two icons of the Teams app package (deploy/teams/): color.png 192×192 (a deep teal
 * tile with a pale four-point probe head: four pins over a wafer line) and outline.png 32×32
 * (the same shape, white on transparent). Our own design. Run: npx tsx scripts/teams-icons.ts
 */
import { writeFileSync } from 'node:fs';
import { deflateSync } from 'node:zlib';

function crc32(buf: Buffer): number {
  let c = ~0;
  for (const b of buf) {
    c ^= b;
    for (let k = 0; k < 8; k++) c = c & 1 ? (c >>> 1) ^ 0xedb88320 : c >>> 1;
  }
  return ~c >>> 0;
}

function chunk(type: string, data: Buffer): Buffer {
  const len = Buffer.alloc(4);
  len.writeUInt32BE(data.length);
  const td = Buffer.concat([Buffer.from(type, 'latin1'), data]);
  const crc = Buffer.alloc(4);
  crc.writeUInt32BE(crc32(td));
  return Buffer.concat([len, td, crc]);
}

function png(size: number, pixel: (x: number, y: number) => [number, number, number, number]): Buffer {
  const rows: Buffer[] = [];
  for (let y = 0; y < size; y++) {
    const row = Buffer.alloc(1 + size * 4);
    for (let x = 0; x < size; x++) row.set(pixel(x, y), 1 + x * 4);
    rows.push(row);
  }
  const ihdr = Buffer.alloc(13);
  ihdr.writeUInt32BE(size, 0);
  ihdr.writeUInt32BE(size, 4);
  ihdr.set([8, 6, 0, 0, 0], 8); // 8-bit RGBA
  return Buffer.concat([Buffer.from([137, 80, 78, 71, 13, 10, 26, 10]), chunk('IHDR', ihdr), chunk('IDAT', deflateSync(Buffer.concat(rows))), chunk('IEND', Buffer.alloc(0))]);
}

/** The probe head: four pins and a wafer line, in a unit square (u, v in 0…1). */
function shape(u: number, v: number): boolean {
  const wafer = v > 0.72 && v < 0.8 && u > 0.12 && u < 0.88;
  const head = v > 0.2 && v < 0.34 && u > 0.22 && u < 0.78;
  const pins = [0.3, 0.43, 0.57, 0.7].some((p) => Math.abs(u - p) < 0.025) && v >= 0.34 && v < 0.7;
  return wafer || head || pins;
}

const teal: [number, number, number, number] = [0x1f, 0x5c, 0x5a, 255];
const pale: [number, number, number, number] = [0xe8, 0xf1, 0xea, 255];
writeFileSync('deploy/teams/color.png', png(192, (x, y) => (shape(x / 192, y / 192) ? pale : teal)));
writeFileSync('deploy/teams/outline.png', png(32, (x, y) => (shape(x / 32, y / 32) ? [255, 255, 255, 255] : [0, 0, 0, 0])));
