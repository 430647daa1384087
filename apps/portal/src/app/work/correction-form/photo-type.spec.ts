import { isPhotoFile, photoRefusal, photoTypeOf } from './photo-type';

const bytes = (...values: (number | string)[]) =>
  new Uint8Array(values.flatMap((v) => (typeof v === 'string' ? Array.from(v, (c) => c.charCodeAt(0)) : [v])));

describe('photoTypeOf', () => {
  it('knows JPEG, PNG, WebP and HEIC by their first bytes', () => {
    expect(photoTypeOf(bytes(0xff, 0xd8, 0xff, 0xe0))).toBe('jpeg');
    expect(photoTypeOf(bytes(0x89, 'PNG', 0x0d, 0x0a, 0x1a, 0x0a))).toBe('png');
    expect(photoTypeOf(bytes('RIFF', 0, 0, 0, 0, 'WEBP'))).toBe('webp');
    expect(photoTypeOf(bytes(0, 0, 0, 0x18, 'ftypheic'))).toBe('heif');
  });

  it('refuses a PDF and a text file, whatever they are called', () => {
    expect(photoTypeOf(bytes('%PDF-1.7'))).toBeNull();
    expect(photoTypeOf(bytes('GFCI tested ok'))).toBeNull();
  });
});

describe('isPhotoFile', () => {
  it('reads the file itself: a .txt renamed .jpg is not a photo', async () => {
    const renamed = new File(['not a photo, just some text'], 'after.jpg', { type: 'image/jpeg' });
    const jpeg = new File([new Uint8Array([0xff, 0xd8, 0xff, 0xdb, 0, 0x43])], 'IMG_1.jpg', { type: 'image/jpeg' });
    expect(await isPhotoFile(renamed)).toBe(false);
    expect(await isPhotoFile(jpeg)).toBe(true);
  });
});

describe('photoRefusal', () => {
  it('puts the server’s refusal in words, naming the photo instead of "before.0"', () => {
    const text = photoRefusal([{ path: 'before.0', message: 'Choose a JPEG, PNG, WebP or HEIC photo' }], { before: ['panel.pdf'], after: [] });
    expect(text).toBe('Before photo 1 (panel.pdf) was refused: Choose a JPEG, PNG, WebP or HEIC photo.');
    expect(text).not.toContain('before.0');
    expect(photoRefusal([{ path: 'reason', message: 'Give the reason' }], { before: [], after: [] })).toBeNull();
  });
});
