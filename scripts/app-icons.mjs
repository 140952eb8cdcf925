// Renders the installable app's PNG icons from public/icons/nestkeeper-app.svg with sharp:
// `node scripts/app-icons.mjs` after changing the drawing; the PNGs are committed beside it.
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import sharp from 'sharp';

const dir = path.join(path.dirname(fileURLToPath(import.meta.url)), '../public/icons');
const source = path.join(dir, 'nestkeeper-app.svg');
// 192 and 512 for the manifest (512 doubles as the maskable icon: the mark sits in the safe middle), 180 for iOS home screens.
const sizes = { 'nestkeeper-192.png': 192, 'nestkeeper-512.png': 512, 'apple-touch-icon.png': 180 };

for (const [name, size] of Object.entries(sizes)) {
  await sharp(source, { density: Math.ceil((72 * size) / 512) })
    .resize(size, size)
    .png({ compressionLevel: 9 })
    .toFile(path.join(dir, name));
  console.log(`${name}: ${size}×${size}`);
}
