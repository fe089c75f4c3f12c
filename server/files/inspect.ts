import { fileTypeFromBuffer } from 'file-type';
import sharp from 'sharp';
import { ATTACHMENT_CONTENT_TYPES, type AttachmentContentType } from '@shared/files/attachment.schema';

/**
 * Thumbnails fit in a 320 × 320 px box (our own choice: twice a 160 CSS px tile, so they
 * stay sharp on a 2× phone screen while staying a few kilobytes).
 */
export const THUMBNAIL_MAX_PX = 320;

/**
 * Images above this many pixels get no thumbnail (our own choice: 100 megapixels is above
 * what phone cameras save by default, and bounds the memory one decode may take).
 */
const MAX_DECODE_PIXELS = 100_000_000;

/** The type the bytes say they are (magic numbers, via file-type), or null when it is not one we take. */
export async function detectContentType(bytes: Buffer): Promise<AttachmentContentType | null> {
  const found = await fileTypeFromBuffer(bytes);
  if (!found) return null;
  return (ATTACHMENT_CONTENT_TYPES as readonly string[]).includes(found.mime) ? (found.mime as AttachmentContentType) : null;
}

export interface ImageFacts {
  /** Pixel size as shown, after the EXIF orientation (Exif 2.3, tag 0x0112) is applied. */
  width: number;
  height: number;
  /** A small WebP, rotated upright, with no metadata (sharp strips it unless asked to keep it). */
  thumbnail: Buffer;
}

/**
 * The size and a thumbnail of a photo, or null when sharp cannot read it: a PDF, a damaged
 * image, one too large to decode, or HEIC, whose HEVC compression the libvips that sharp
 * ships without cannot decode (the photo is still stored and downloadable).
 */
export async function describeImage(bytes: Buffer, contentType: AttachmentContentType): Promise<ImageFacts | null> {
  if (!contentType.startsWith('image/')) return null;
  const options = { limitInputPixels: MAX_DECODE_PIXELS, failOn: 'error' as const };
  try {
    const meta = await sharp(bytes, options).metadata();
    const thumbnail = await sharp(bytes, options)
      .rotate()
      .resize({ width: THUMBNAIL_MAX_PX, height: THUMBNAIL_MAX_PX, fit: 'inside', withoutEnlargement: true })
      .webp({ quality: 75 })
      .toBuffer();
    return { width: meta.autoOrient.width, height: meta.autoOrient.height, thumbnail };
  } catch {
    return null;
  }
}

/** Keeps the last path segment of a browser-sent name, without control characters, at most 255 characters. */
export function cleanFileName(name: string): string {
  const base = name.split(/[/\\]/).pop() ?? '';
  // eslint-disable-next-line no-control-regex
  const clean = base.replace(/[\u0000-\u001f\u007f]/g, '').trim();
  const chars = [...clean];
  return (chars.length > 255 ? chars.slice(0, 255).join('') : clean) || 'file';
}

/** `inline; filename="…"; filename*=UTF-8''…` per RFC 6266, with the UTF-8 name encoded per RFC 5987. */
export function inlineDisposition(fileName: string): string {
  // The plain parameter is an ASCII stand-in for old clients; the starred one carries the real name.
  const ascii = fileName.replace(/[^\x20-\x7e]/g, '_').replace(/["\\]/g, '_');
  const encoded = encodeURIComponent(fileName).replace(/['()*]/g, (c) => `%${c.charCodeAt(0).toString(16).toUpperCase()}`);
  return `inline; filename="${ascii}"; filename*=UTF-8''${encoded}`;
}
