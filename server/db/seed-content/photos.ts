/**
 * Demo photos the project makes itself: synthetic scenes drawn as SVG from the demo swatches' colours
 * (seed-content/looks-boards.ts), rasterised by sharp, with a little even grain so they behave like
 * photographs under a look. Everything in them is invented; no third-party image is used.
 */
import fs from 'node:fs';
import path from 'node:path';
import sharp from 'sharp';
import type { EntityManager } from 'typeorm';
import { Photo } from '../entities/photo.entity';
import type { Production } from '../entities/production.entity';
import type { Membership } from '../entities/membership.entity';
import { ingestPhoto } from '../../modules/photos/photo-ingest';
import { PhotoStorage, removeQuietly } from '../../modules/photos/photo-storage';
import { MAX_PHOTO_PIXELS } from '../../../shared/schemas/photo';
import { DEMO_BOARDS } from './looks-boards';

/** The demo swatch colour called `name` (fallback: `hex`, used if the board changes). */
function c(name: string, hex: string): string {
  for (const b of DEMO_BOARDS) for (const [n, given] of b.swatches) if (n === name && typeof given === 'string') return given;
  return hex;
}

/** Eleven greys of the zone ramp, zone 0..X (CIE L* 0, 10 … 100). */
const ZONE_GREYS = ['#000000', '#1b1b1b', '#303030', '#474747', '#5e5e5e', '#777777', '#919191', '#ababab', '#c6c6c6', '#e2e2e2', '#ffffff'];

export interface DemoScene {
  name: string;
  notes: string;
  department: 'makeup' | 'costume' | 'art' | 'camera';
  width: number;
  height: number;
  /** the scene in a 1200 × 800 (or 900 × 1200) user space */
  svg: () => string;
}

/** The demo swatch colours the scenes are painted with (one table for every scene). */
const PAINT = {
  wall: c('Workshop wall, warm white', '#ece4d2'),
  panel: c('Duck-egg blue', '#a9c4c0'),
  lacquer: c('Oxblood lacquer', '#5e1e1e'),
  brass: c('Ochre limewash', '#c9a05a'),
  red: c('Lacquer red', '#b0302a'),
  silk: c('Burgundy silk', '#7a2335'),
  navy: c('Navy wool coat', '#2b3552'),
  sage: c('Sage green', '#9aa68a'),
  forest: c('Forest green', '#2f4a35'),
  cream: c('Cream linen', '#e6dcc3'),
  mustard: c('Mustard tweed', '#b8923a'),
  skin: c('Base, warm medium', '#c99470'),
  fair: c('Base, fair', '#e8c4a8'),
  lip: c('Lip colour, deep rose', '#a33b4a'),
  cheek: c('Cheek, flushed', '#d98a80'),
  shadow: c('Eye shadow, brown', '#6b4a3a'),
  hair: c('Black wool', '#1e1c1c'),
  bruise: c('Greasepaint, bruise blue', '#4f5a7a'),
  back: c('Charcoal', '#3a3a3c'),
};

function chartSvg(): string {
  const rows = DEMO_BOARDS.map((b) => b.swatches.filter((s) => typeof s[1] === 'string').map((s) => s[1] as string));
  const cell = 100;
  let body = '';
  rows.forEach((row, y) => {
    row.forEach((hex, x) => {
      body += `<rect x="${60 + x * (cell + 10)}" y="${60 + y * (cell + 30)}" width="${cell}" height="${cell}" rx="6" fill="${hex}"/>`;
    });
  });
  ZONE_GREYS.forEach((g, i) => {
    body += `<rect x="${60 + i * 98}" y="520" width="98" height="120" fill="${g}"/>`;
  });
  body += '<rect x="58" y="518" width="1082" height="124" fill="none" stroke="#000" stroke-width="2"/>';
  return `<svg xmlns="http://www.w3.org/2000/svg" viewBox="0 0 1200 800"><rect width="1200" height="800" fill="#8a8a88"/>${body}</svg>`;
}

function stillLifeSvg(): string {
  const { wall, panel, lacquer, brass, red, silk, navy, sage, forest, cream, mustard } = PAINT;
  return `<svg xmlns="http://www.w3.org/2000/svg" viewBox="0 0 1200 800">
  <defs>
    <linearGradient id="wall" x1="0" y1="0" x2="1" y2="0.3"><stop offset="0" stop-color="${wall}"/><stop offset="1" stop-color="#9d9486"/></linearGradient>
    <linearGradient id="panel" x1="0" y1="0" x2="0" y2="1"><stop offset="0" stop-color="${panel}"/><stop offset="1" stop-color="#6f8582"/></linearGradient>
    <linearGradient id="table" x1="0" y1="0" x2="0" y2="1"><stop offset="0" stop-color="${lacquer}"/><stop offset="1" stop-color="#2a0c0c"/></linearGradient>
    <radialGradient id="brass" cx="0.38" cy="0.35" r="0.7"><stop offset="0" stop-color="#f3dca0"/><stop offset="0.35" stop-color="${brass}"/><stop offset="1" stop-color="#5a4218"/></radialGradient>
    <linearGradient id="silk" x1="0" y1="0" x2="1" y2="0">
      <stop offset="0" stop-color="${silk}"/><stop offset="0.18" stop-color="#b8475c"/><stop offset="0.33" stop-color="${silk}"/>
      <stop offset="0.5" stop-color="#3f0f1b"/><stop offset="0.7" stop-color="${silk}"/><stop offset="0.85" stop-color="#a33d52"/><stop offset="1" stop-color="#3f0f1b"/>
    </linearGradient>
    <linearGradient id="coat" x1="0" y1="0" x2="1" y2="0"><stop offset="0" stop-color="#151a2b"/><stop offset="0.45" stop-color="${navy}"/><stop offset="1" stop-color="#10131f"/></linearGradient>
    <radialGradient id="shadow" cx="0.5" cy="0.5" r="0.5"><stop offset="0" stop-color="#000" stop-opacity="0.55"/><stop offset="1" stop-color="#000" stop-opacity="0"/></radialGradient>
  </defs>
  <rect width="1200" height="800" fill="url(#wall)"/>
  <rect x="0" y="330" width="1200" height="190" fill="url(#panel)"/>
  <rect x="0" y="326" width="1200" height="8" fill="${cream}"/>
  <rect x="60" y="40" width="230" height="360" fill="url(#silk)"/>
  <path d="M930 60 h120 l40 420 h-200 z" fill="url(#coat)"/>
  <rect x="975" y="40" width="30" height="30" rx="6" fill="${mustard}"/>
  <polygon points="0,520 1200,520 1200,800 0,800" fill="url(#table)"/>
  <ellipse cx="520" cy="560" rx="190" ry="26" fill="url(#shadow)"/>
  <circle cx="520" cy="380" r="170" fill="url(#brass)"/>
  <circle cx="520" cy="380" r="128" fill="${cream}"/>
  <g stroke="#1e1c1c" stroke-linecap="round"><line x1="520" y1="380" x2="520" y2="290" stroke-width="9"/><line x1="520" y1="380" x2="585" y2="420" stroke-width="6"/></g>
  <circle cx="520" cy="380" r="10" fill="#1e1c1c"/>
  <rect x="470" y="545" width="100" height="20" fill="#3b2a10"/>
  <ellipse cx="820" cy="600" rx="110" ry="18" fill="url(#shadow)"/>
  <rect x="730" y="500" width="170" height="95" fill="${red}"/>
  <polygon points="730,500 760,470 930,470 900,500" fill="#d4564c"/>
  <polygon points="900,500 930,470 930,565 900,595" fill="#6e1a16"/>
  <ellipse cx="230" cy="640" rx="70" ry="14" fill="url(#shadow)"/>
  <path d="M190 560 q40 -30 80 0 l-12 80 h-56 z" fill="${sage}"/>
  <rect x="300" y="470" width="36" height="170" rx="14" fill="${forest}"/>
  <rect x="308" y="440" width="20" height="40" fill="${forest}"/>
</svg>`;
}

function portraitSvg(): string {
  const { skin, fair, lip, cheek, shadow, hair, navy: coat, bruise, back, cream: collar } = PAINT;
  return `<svg xmlns="http://www.w3.org/2000/svg" viewBox="0 0 900 1200">
  <defs>
    <radialGradient id="bg" cx="0.6" cy="0.3" r="0.9"><stop offset="0" stop-color="#6a6a6e"/><stop offset="1" stop-color="${back}"/></radialGradient>
    <radialGradient id="face" cx="0.4" cy="0.38" r="0.7"><stop offset="0" stop-color="${fair}"/><stop offset="0.55" stop-color="${skin}"/><stop offset="1" stop-color="#6e452c"/></radialGradient>
    <radialGradient id="cheek" cx="0.5" cy="0.5" r="0.5"><stop offset="0" stop-color="${cheek}" stop-opacity="0.85"/><stop offset="1" stop-color="${cheek}" stop-opacity="0"/></radialGradient>
    <radialGradient id="bruise" cx="0.5" cy="0.5" r="0.5"><stop offset="0" stop-color="${bruise}" stop-opacity="0.8"/><stop offset="1" stop-color="${bruise}" stop-opacity="0"/></radialGradient>
    <linearGradient id="coat" x1="0" y1="0" x2="1" y2="0"><stop offset="0" stop-color="#131829"/><stop offset="0.5" stop-color="${coat}"/><stop offset="1" stop-color="#0e111c"/></linearGradient>
  </defs>
  <rect width="900" height="1200" fill="url(#bg)"/>
  <rect x="390" y="700" width="120" height="190" fill="${skin}"/>
  <path d="M120 1200 q20 -300 330 -330 q310 30 330 330 z" fill="url(#coat)"/>
  <path d="M330 880 l120 110 l120 -110 l-60 -20 l-60 55 l-60 -55 z" fill="${collar}"/>
  <ellipse cx="450" cy="500" rx="215" ry="285" fill="${hair}"/>
  <ellipse cx="450" cy="540" rx="180" ry="240" fill="url(#face)"/>
  <path d="M270 420 q180 -190 360 0 q-30 -200 -180 -210 q-150 10 -180 210 z" fill="${hair}"/>
  <ellipse cx="370" cy="500" rx="46" ry="22" fill="${shadow}" opacity="0.7"/>
  <ellipse cx="530" cy="500" rx="46" ry="22" fill="${shadow}" opacity="0.7"/>
  <circle cx="370" cy="502" r="12" fill="#1e1c1c"/><circle cx="530" cy="502" r="12" fill="#1e1c1c"/>
  <ellipse cx="340" cy="610" rx="70" ry="50" fill="url(#cheek)"/>
  <ellipse cx="560" cy="610" rx="70" ry="50" fill="url(#cheek)"/>
  <ellipse cx="590" cy="540" rx="40" ry="30" fill="url(#bruise)"/>
  <path d="M400 675 q50 -28 100 0 q-50 40 -100 0 z" fill="${lip}"/>
  <path d="M400 675 q50 12 100 0" stroke="#5a1a24" stroke-width="4" fill="none"/>
</svg>`;
}

/** The demo scenes (invented). */
export const DEMO_SCENES: DemoScene[] = [
  {
    name: 'Swatch chart, three departments',
    notes: 'Synthetic chart: the demo makeup, costume and set-paint colours in rows, over the zone ramp. Made by Grisaille for the demo; not a photograph.',
    department: 'camera',
    width: 2400,
    height: 1600,
    svg: chartSvg,
  },
  {
    name: 'Workshop still life',
    notes: 'Synthetic still life of the clock workshop drawn from the demo set-paint and wardrobe colours. Invented; not a photograph.',
    department: 'art',
    width: 2400,
    height: 1600,
    svg: stillLifeSvg,
  },
  {
    name: 'Makeup test, portrait',
    notes: 'Synthetic portrait study from the demo makeup colours: base, flushed cheeks, lip colour and a greasepaint bruise. Invented; not a photograph.',
    department: 'makeup',
    width: 1800,
    height: 2400,
    svg: portraitSvg,
  },
];

/** Even grain, ± amplitude code values, from a fixed-seed generator (the same image every run). */
function addGrain(px: Buffer, amplitude: number, seed = 12345): void {
  let s = seed >>> 0;
  for (let i = 0; i < px.length; i++) {
    s = (s * 1664525 + 1013904223) >>> 0;
    const v = px[i] + ((s >>> 24) / 255 - 0.5) * 2 * amplitude;
    px[i] = v < 0 ? 0 : v > 255 ? 255 : v;
  }
}

/** A demo scene as an sRGB JPEG of `width` × `height` (default: the scene's size). */
export async function demoSceneJpeg(scene: DemoScene, width = scene.width, height = scene.height, quality = 92): Promise<Buffer> {
  const { data, info } = await sharp(Buffer.from(scene.svg()), { density: 72 * (width / (scene.width > scene.height ? 1200 : 900)) })
    .resize(width, height, { fit: 'fill' })
    .removeAlpha()
    .raw()
    .toBuffer({ resolveWithObject: true });
  addGrain(data, 3);
  return sharp(data, { raw: { width: info.width, height: info.height, channels: 3 } }).jpeg({ quality }).toBuffer();
}

/**
 * Seeds the demo photos: files first (each through the same ingest as an upload, the scenes in
 * parallel), then the rows in the seed's transaction `t`.
 */
export async function seedDemoPhotos(t: EntityManager, production: Production, members: Record<string, Membership>, dataDir: string): Promise<void> {
  const storage = new PhotoStorage(dataDir);
  const uploader = members['camera@demo.grisaille.test']?.user ?? null;
  const made = await Promise.all(
    DEMO_SCENES.map(async (scene) => {
      const incoming = path.join(storage.incomingDir, `${PhotoStorage.newKey()}.upload`);
      const staging = storage.stagingDir();
      const key = PhotoStorage.newKey();
      try {
        fs.writeFileSync(incoming, await demoSceneJpeg(scene));
        const info = await ingestPhoto(incoming, staging, { maxPixels: MAX_PHOTO_PIXELS });
        storage.commit(staging, key);
        return { scene, key, info };
      } finally {
        removeQuietly(incoming);
        removeQuietly(staging);
      }
    }),
  );
  for (const { scene, key, info } of made) {
    await t.save(Photo, t.create(Photo, {
      production,
      uploadedBy: uploader,
      department: scene.department,
      name: scene.name,
      notes: scene.notes,
      originalName: `${scene.name.toLowerCase().replace(/[^a-z0-9]+/g, '-')}.jpg`,
      storageKey: key,
      isDemo: true,
      ...info,
    }));
  }
}
