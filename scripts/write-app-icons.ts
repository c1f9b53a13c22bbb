/**
 * Writes the installed app's icons (public/icons) from the logo mark: the plate on the page colour for "any", and a
 * full-bleed version for "maskable" with the mark inside the central 80 % safe zone (W3C Web App Manifest, "icons").
 * Run with `npx tsx scripts/write-app-icons.ts` after the logo changes; the PNGs are committed.
 */
import fs from 'node:fs';
import path from 'node:path';
import sharp from 'sharp';
import { PROJECT_ROOT } from './lib/paths';

const logo = fs.readFileSync(path.join(PROJECT_ROOT, 'public', 'logo.svg'));
const outDir = path.join(PROJECT_ROOT, 'public', 'icons');
const PLATE = '#F6F3EE';
const IRON = '#23272B';

async function icon(size: number, markShare: number, background: string, file: string) {
  const mark = Math.round(size * markShare);
  const png = await sharp(logo, { density: Math.ceil((72 * mark) / 32) }).resize(mark, mark).png().toBuffer();
  await sharp({ create: { width: size, height: size, channels: 4, background } })
    .composite([{ input: png, gravity: 'center' }])
    .png({ compressionLevel: 9 })
    .toFile(path.join(outDir, file));
}

fs.mkdirSync(outDir, { recursive: true });
await icon(192, 0.9, PLATE, 'icon-192.png');
await icon(512, 0.9, PLATE, 'icon-512.png');
await icon(512, 0.62, IRON, 'icon-maskable-512.png');
await icon(180, 0.82, PLATE, 'apple-touch-icon.png');
console.log(`Icons written to ${path.relative(PROJECT_ROOT, outDir)}`);
