#!/usr/bin/env node
/**
 * Writes the demo measurement files in examples/maps/ (invented data for the demo scenario:
 * Harrowgate Fab 2, product HX-200, lot LOT-A17). Deterministic: rerunning gives the same bytes.
 *
 *   LOT-A17-w03-rs.csv      49 sites, sheet resistance, commas, 200 mm
 *   LOT-A17-w05-vi.csv      49 sites, V and I, semicolons and decimal commas, 200 mm
 *   LOT-B04-w01-rs-121.csv  121 sites on a 300 mm wafer, a hot spot near the flat
 *   LOT-A17-w04-rs.csv      49 sites of HX-200P (725 µm, about 9.8 Ω·cm), for `record … map`
 *   LOT-A17-w06-rs.csv      the same wafer layout with a low edge ring: over the uniformity limit
 */
import { writeFileSync } from 'node:fs';

function rings(counts, radii) {
  const sites = [[0, 0]];
  counts.forEach((n, k) => {
    for (let j = 0; j < n; j++) {
      const a = (2 * Math.PI * j) / n + (k % 2 ? Math.PI / n : 0);
      sites.push([radii[k] * Math.cos(a), radii[k] * Math.sin(a)]);
    }
  });
  return sites;
}

const fix = (v, d) => Number(v.toFixed(d));

// 200 mm, dome-shaped sheet resistance (thicker deposition in the centre reads low), slight tilt.
const w03 = rings([8, 16, 24], [32, 64, 93]);
let text = 'site,x (mm),y (mm),rs (ohm/sq),wafer\n';
w03.forEach(([x, y], i) => {
  const r = Math.hypot(x, y) / 100;
  const rs = 45.2 * (1 + 0.018 * r * r + 0.004 * (x / 100)) * (1 + 0.002 * Math.sin(7 * i));
  text += `${i + 1},${fix(x, 2)},${fix(y, 2)},${fix(i === 30 ? rs * 1.09 : rs, 3)},W03\n`;
});
writeFileSync('examples/maps/LOT-A17-w03-rs.csv', text);

// The same pattern read as V/I at 1 mA, written by a tool with decimal commas.
text = '# Harrowgate Fab 2, 4PP-2 mapping head, 1 mA\nsite;x (mm);y (mm);v (mV);i (mA)\n';
w03.forEach(([x, y], i) => {
  const r = Math.hypot(x, y) / 100;
  const rs = 12.8 * (1 - 0.012 * r * r) * (1 + 0.002 * Math.cos(5 * i));
  const mv = (rs / (Math.PI / Math.LN2)) * 1;
  text += `${i + 1};${String(fix(x, 2)).replace('.', ',')};${String(fix(y, 2)).replace('.', ',')};${String(fix(mv, 4)).replace('.', ',')};1\n`;
});
writeFileSync('examples/maps/LOT-A17-w05-vi.csv', text);

// 300 mm, 121 sites on a square grid, a hot spot near the notch.
text = 'x_mm,y_mm,rs_ohm_sq\n';
let n = 0;
for (let gy = -5; gy <= 5; gy++) {
  for (let gx = -5; gx <= 5; gx++) {
    const x = gx * 26;
    const y = gy * 26;
    if (Math.hypot(x, y) > 147) continue;
    const hot = Math.exp(-((x - 10) ** 2 + (y + 110) ** 2) / (2 * 25 ** 2));
    const rs = 118 * (1 + 0.01 * (y / 150) + 0.06 * hot);
    text += `${x},${y},${fix(rs, 2)}\n`;
    n++;
  }
}
writeFileSync('examples/maps/LOT-B04-w01-rs-121.csv', text);
// HX-200P wafers of LOT-A17 measured on the 4PP-2 head: a gentle bowl (passes) and a wafer with a
// low-resistivity edge ring (non-uniform).
for (const [name, ring] of [['LOT-A17-w04-rs.csv', 0], ['LOT-A17-w06-rs.csv', 0.09]]) {
  text = 'site,x (mm),y (mm),rs (ohm/sq),wafer\n';
  w03.forEach(([x, y], i) => {
    const r = Math.hypot(x, y) / 93;
    const rs = 135.5 * (1 + 0.012 * r * r - ring * r ** 6) * (1 + 0.003 * Math.sin(11 * i));
    text += `${i + 1},${fix(x, 2)},${fix(y, 2)},${fix(rs, 2)},${name.slice(8, 11).toUpperCase()}\n`;
  });
  writeFileSync(`examples/maps/${name}`, text);
}
process.stderr.write(`examples/maps: 5 files (${w03.length}, ${w03.length}, ${n}, ${w03.length}, ${w03.length} sites)\n`);
