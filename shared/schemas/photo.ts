import { z } from 'zod';
import type { Department } from './roles';
import { lookDefinitionSchema, type FilterPlace } from './look';
import type { ToneSettings } from './exposure';
import type { FilterSource } from './simulate';
import { itemNameSchema } from './item';

/** Formats accepted for upload, as read from the file's content (never from its name). */
export const PHOTO_FORMATS = ['jpeg', 'png', 'tiff', 'webp'] as const;
export type PhotoFormat = (typeof PHOTO_FORMATS)[number];

/** Largest upload accepted, bytes (a 24-megapixel 16-bit uncompressed TIFF is 144 MB). */
export const MAX_PHOTO_BYTES = 200 * 1024 * 1024;
/** Largest image accepted, pixels (width × height): 100 megapixels. */
export const MAX_PHOTO_PIXELS = 100_000_000;
/** Width of the stored preview the browser renders live (narrower originals keep their width), px. */
export const PREVIEW_WIDTH = 2048;
/** Longest side of the stored thumbnail, px. */
export const THUMB_SIZE = 480;

const name = itemNameSchema;

/** PATCH /photos/:photoId */
export const photoUpdateSchema = z
  .object({ name: name.optional(), notes: z.string().max(4000, 'At most 4000 characters.').optional() })
  .refine((v) => Object.keys(v).length > 0, { message: 'Nothing to change.' });
export type PhotoUpdateInput = z.input<typeof photoUpdateSchema>;

/** The multipart text fields sent with an upload (the file itself is the part named `file`). */
export const photoUploadFieldsSchema = z.object({ name: name.optional(), notes: z.string().max(4000).optional() });

/** Download formats of a full-resolution render. */
export const RENDER_FORMATS = ['png16', 'jpeg'] as const;
export type RenderFormat = (typeof RENDER_FORMATS)[number];
export const renderFormatSchema = z.enum(RENDER_FORMATS);

/** A look to render a photo through: a saved one, or an unsaved definition (the live preview's changes). */
const lookChoice = { lookId: z.number().int().positive().optional(), look: lookDefinitionSchema.optional() };
const oneLook = (v: { lookId?: number; look?: unknown }) => (v.lookId === undefined) !== (v.look === undefined);
const oneLookIssue = { message: 'Give either lookId (a saved look) or look (a look definition).', path: ['lookId'] };

/** POST /photos/:photoId/renders */
export const renderRequestSchema = z.strictObject({ ...lookChoice, format: renderFormatSchema.default('png16') }).refine(oneLook, oneLookIssue);
export type RenderRequestInput = z.input<typeof renderRequestSchema>;

/** POST /photo-looks: a look resolved to spectra, for the browser's live preview. */
export const photoLookRequestSchema = z.strictObject(lookChoice).refine(oneLook, oneLookIssue);
export type PhotoLookRequestInput = z.input<typeof photoLookRequestSchema>;

/** A light the preview can retune by colour temperature (its form and gels kept). */
export interface PhotoLightEdit {
  kind: 'blackbody' | 'daylight';
  kelvin: number;
  minKelvin: number;
  maxKelvin: number;
  gels: FilterSource[];
}

/** A parametric filter the preview can move along the spectrum. */
export interface PhotoFilterEdit {
  /** the filter's parametric source (a library filter is given by its definition) */
  source: FilterSource;
  /** which form and which of its wavelengths moves */
  form: 'longPass' | 'shortPass' | 'bandPass' | 'notch';
  param: 'cutOnNm' | 'cutOffNm' | 'centreNm';
  nm: number;
}

/** A look resolved for photos (answer of POST /photo-looks): spectra on the working grid and tone settings. */
export interface PhotoLookView {
  /** hash of the look's content: equal looks render alike */
  contentHash: string;
  /** wavelengths of every `values`, nm (the working grid, 350–900 at 1) */
  nm: number[];
  light: { label: string; values: number[]; edit: PhotoLightEdit | null };
  filters: { label: string; on: FilterPlace; values: number[]; edit: PhotoFilterEdit | null }[];
  medium: { label: string; values: number[] };
  /** tone-defaults id of the medium */
  mediumToneId: string;
  tone: ToneSettings;
  /** the key swatch's reflectance (0..1 on the grid), or null when middle grey is the key */
  key: number[] | null;
}

/** A photo as the API answers it. */
export interface PhotoView {
  id: number;
  name: string;
  notes: string;
  department: Department;
  format: PhotoFormat;
  bitDepth: number;
  width: number;
  height: number;
  previewWidth: number;
  previewHeight: number;
  fileBytes: number;
  /** the name of the file as it was uploaded (UTF-8; the original downloads under it) */
  originalName: string;
  /** the embedded ICC profile's description, or null (taken as sRGB) */
  iccProfile: string | null;
  orientation: number;
  isDemo: boolean;
  uploadedBy: { id: number; name: string } | null;
  createdAt: string;
  /** URLs of the sRGB preview, the thumbnail and the original */
  urls: { preview: string; thumb: string; original: string };
}

/** Where a render stands. `key` is the hash of what is rendered (photo, look content, format). */
export interface RenderStatus {
  key: string;
  status: 'queued' | 'running' | 'done' | 'failed';
  /** 0..1 */
  progress: number;
  /** what the renderer is doing now, for the progress bar */
  stage: 'queued' | 'decoding' | 'table' | 'rendering' | 'encoding' | 'done' | 'failed';
  format: RenderFormat;
  /** true when the result came from the cache without rendering */
  cached: boolean;
  /** set when done */
  url: string | null;
  bytes: number | null;
  error: string | null;
}

/** POST …/photo-uncertainty: the look whose uncertainty overlay is wanted (a saved look or a definition). */
export const uncertaintyRequestSchema = photoLookRequestSchema;

/**
 * An uncertainty table for the photos page's overlay: per sRGB colour, how wide the plausible range of its
 * tone is through the look (stops). `widths` (size³ numbers, index (b·size + g)·size + r, node i at the
 * encoded value i / (size − 1)) arrives when `status` is done; poll GET …/photo-uncertainty/:key until then.
 */
export interface UncertaintyStatus {
  key: string;
  status: 'running' | 'done' | 'failed';
  /** 0..1 */
  progress: number;
  size: number;
  widths: number[] | null;
  error: string | null;
}
