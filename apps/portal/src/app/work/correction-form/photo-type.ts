/** The photo types the server keeps (it judges the bytes again and re-encodes them as JPEG). */
export const PHOTO_ACCEPT = 'image/jpeg,image/png,image/webp,image/heic,image/heif,image/avif,.jpg,.jpeg,.png,.webp,.heic,.heif,.avif';

const ascii = (bytes: Uint8Array, from: number, to: number) => String.fromCharCode(...bytes.subarray(from, to));
const HEIF_BRANDS = ['heic', 'heix', 'hevc', 'hevx', 'heim', 'heis', 'mif1', 'msf1', 'avif', 'avis'];

/**
 * The photo type of a file by its first bytes (never its name or declared type): 'jpeg', 'png',
 * 'webp' or 'heif' (HEIC/HEIF/AVIF), or null for anything else (a text file renamed .jpg, a PDF…).
 */
export function photoTypeOf(head: Uint8Array): 'jpeg' | 'png' | 'webp' | 'heif' | null {
  if (head.length >= 3 && head[0] === 0xff && head[1] === 0xd8 && head[2] === 0xff) return 'jpeg';
  if (head.length >= 8 && [0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a].every((b, i) => head[i] === b)) return 'png';
  if (head.length >= 12 && ascii(head, 0, 4) === 'RIFF' && ascii(head, 8, 12) === 'WEBP') return 'webp';
  if (head.length >= 12 && ascii(head, 4, 8) === 'ftyp' && HEIF_BRANDS.includes(ascii(head, 8, 12))) return 'heif';
  return null;
}

/** Reads the first bytes of `file` and answers whether they are a photo. */
export async function isPhotoFile(file: Blob): Promise<boolean> {
  const head = new Uint8Array(await file.slice(0, 16).arrayBuffer());
  return photoTypeOf(head) !== null;
}

/**
 * The server's refusal of a photo in words: its details name the photo by kind and position
 * ("before.0"); this names it by kind, number and file name instead.
 */
export function photoRefusal(details: readonly { path: string; message: string }[], names: Record<'before' | 'after', readonly string[]>): string | null {
  const lines = details.flatMap((d) => {
    const match = /^(before|after)\.(\d+)$/.exec(d.path);
    if (!match) return [];
    const kind = match[1] as 'before' | 'after';
    const index = Number(match[2]);
    const name = names[kind][index];
    return [`${kind === 'before' ? 'Before' : 'After'} photo ${index + 1}${name ? ` (${name})` : ''} was refused: ${d.message}.`];
  });
  return lines.length ? lines.join(' ') : null;
}
