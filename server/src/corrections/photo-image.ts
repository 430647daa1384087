import sharp from 'sharp';
import { MAX_PHOTO_BYTES } from '@cc/shared';
import { TooLargeError, UnsupportedTypeError } from '../errors';

// file-type is an ES module only: loaded with import() on first use.
const loadFileType = () => import('file-type');

/** Image types a photo may be, judged by the bytes themselves (never the name or the declared type). */
const IMAGE_TYPES = ['image/jpeg', 'image/png', 'image/webp', 'image/heic', 'image/heif', 'image/avif'];
/** Long side of a stored photo, in pixels: enough to read a label or a tester's lamps. */
const MAX_SIDE = 2000;

export interface CleanPhoto {
  data: Buffer;
  width: number;
  height: number;
}

/**
 * Checks that `bytes` are an image by their content and re-encodes them as JPEG, turned upright and
 * shrunk to at most MAX_SIDE. Re-encoding keeps no metadata: EXIF, GPS position and camera serials
 * are gone before anything is stored.
 */
export async function cleanPhoto(bytes: Buffer, field: string): Promise<CleanPhoto> {
  if (bytes.length > MAX_PHOTO_BYTES) throw new TooLargeError('The photo is larger than allowed', [{ path: field, message: `Use a photo of at most ${MAX_PHOTO_BYTES / 1024 / 1024} MB` }]);
  const type = await (await loadFileType()).fileTypeFromBuffer(bytes);
  if (!type || !IMAGE_TYPES.includes(type.mime)) {
    throw new UnsupportedTypeError('Only photos can be attached', [{ path: field, message: 'Choose a JPEG, PNG, WebP or HEIC photo' }]);
  }
  try {
    const { data, info } = await sharp(bytes, { limitInputPixels: 50_000_000 })
      .rotate()
      .resize({ width: MAX_SIDE, height: MAX_SIDE, fit: 'inside', withoutEnlargement: true })
      .jpeg({ quality: 82, mozjpeg: true })
      .toBuffer({ resolveWithObject: true });
    return { data, width: info.width, height: info.height };
  } catch {
    throw new UnsupportedTypeError('The photo could not be read', [{ path: field, message: 'This image is damaged or in a form we cannot read' }]);
  }
}
