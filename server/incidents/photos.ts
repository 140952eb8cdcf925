import { fileTypeFromBuffer } from 'file-type';
import decodeHeic from 'heic-decode';
import sharp, { type Sharp } from 'sharp';
import { photoTypes } from '../../shared/schemas/incidents';
import { AppError } from '../http/errors';

export type UploadedPhoto = { originalname: string; buffer: Buffer; size: number };

export type PreparedPhoto = { contentType: string; fileName: string; sizeBytes: number; data: Buffer; thumbnail: Buffer | null };

const THUMBNAIL = { width: 320, height: 320, quality: 72 };

const thumbnailOf = (image: Sharp) =>
  image.resize(THUMBNAIL.width, THUMBNAIL.height, { fit: 'inside', withoutEnlargement: true }).jpeg({ quality: THUMBNAIL.quality }).toBuffer();

/**
 * HEIC (what phones take by default) through libheif compiled to WebAssembly,
 * since the bundled image library has no HEVC decoder. A file that only looks
 * like HEIC is kept, without a thumbnail.
 */
async function heicThumbnail(buffer: Buffer): Promise<Buffer | null> {
  try {
    const { width, height, data } = await decodeHeic({ buffer });
    return await thumbnailOf(sharp(Buffer.from(data.buffer, data.byteOffset, data.byteLength), { raw: { width, height, channels: 4 } }));
  } catch {
    return null;
  }
}

/**
 * Trust the bytes, not the name or the browser's claim: JPEG, PNG and HEIC/HEIF
 * only, each with a small JPEG thumbnail for lists.
 */
export async function preparePhoto(file: UploadedPhoto): Promise<PreparedPhoto> {
  const type = await fileTypeFromBuffer(file.buffer);
  const mime = type?.mime === 'image/heif' || type?.mime === 'image/heic' ? 'image/heic' : type?.mime;
  if (!mime || !(photoTypes as readonly string[]).includes(mime)) {
    throw new AppError(415, 'unsupported_type', `"${file.originalname}" is not a JPEG, PNG or HEIC photo.`);
  }
  const thumbnail =
    mime === 'image/heic'
      ? await heicThumbnail(file.buffer)
      : await thumbnailOf(sharp(file.buffer).rotate()).catch(() => {
          throw new AppError(415, 'unsupported_type', `"${file.originalname}" could not be read as an image.`);
        });
  return { contentType: mime, fileName: file.originalname.slice(0, 200), sizeBytes: file.size, data: file.buffer, thumbnail };
}
