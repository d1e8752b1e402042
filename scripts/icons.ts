/**
 * Draws the installed app's icons from Heatclock's own mark (public/favicon.svg: a thermometer
 * with a leaf, on paper): plain PNGs at 192 and 512 px, and maskable ones whose mark sits inside
 * the central safe circle (80 %) on a full-bleed paper square. Run: npm run icons.
 */
import { readFileSync } from 'node:fs';
import sharp from 'sharp';

const publicDir = new URL('../public/', import.meta.url);
const mark = readFileSync(new URL('favicon.svg', publicDir), 'utf8');
const inner = mark.replace(/^[\s\S]*?<svg[^>]*>/, '').replace(/<\/svg>\s*$/, '');

/** The mark, shrunk to `scale` of the canvas and centred on paper (maskable icons are cropped to any shape). */
const maskable = (scale: number) => {
  const offset = (32 * (1 - scale)) / 2;
  return `<svg xmlns="http://www.w3.org/2000/svg" viewBox="0 0 32 32"><rect width="32" height="32" fill="#f6efe0"/><g transform="translate(${offset} ${offset}) scale(${scale})">${inner}</g></svg>`;
};

async function draw(svg: string, size: number, name: string) {
  await sharp(Buffer.from(svg), { density: (72 * size) / 32 }).resize(size, size).png().toFile(new URL(name, publicDir).pathname);
  console.log(`public/${name}`);
}

for (const size of [192, 512]) {
  await draw(mark, size, `icon-${size}.png`);
  await draw(maskable(0.7), size, `icon-maskable-${size}.png`);
}
