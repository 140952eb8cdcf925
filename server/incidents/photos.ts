import { fileTypeFromBuffer } from 'file-type';
import sharp from 'sharp';
import { photoTypes } from '../../shared/schemas/incidents';
import { AppError } from '../http/errors';

export type UploadedPhoto = { originalname: string; buffer: Buffer; size: number };

/**
 * Trust the bytes, not the name or the browser's claim: JPEG, PNG and HEIC/HEIF
 * only. JPEG and PNG get a small JPEG thumbnail; HEIC cannot be decoded here
 * (the bundled image library has no HEVC decoder), so it keeps no thumbnail.
 */
export async function preparePhoto(file: UploadedPhoto) {
  const type = await fileTypeFromBuffer(file.buffer);
  const mime = type?.mime === 'image/heif' || type?.mime === 'image/heic' ? 'image/heic' : type?.mime;
  if (!mime || !(photoTypes as readonly string[]).includes(mime)) {
    throw new AppError(415, 'unsupported_type', `"${file.originalname}" is not a JPEG, PNG or HEIC photo.`);
  }
  const thumbnail =
    mime === 'image/heic'
      ? null
      : await sharp(file.buffer)
          .rotate()
          .resize(320, 320, { fit: 'inside', withoutEnlargement: true })
          .jpeg({ quality: 72 })
          .toBuffer()
          .catch(() => {
            throw new AppError(415, 'unsupported_type', `"${file.originalname}" could not be read as an image.`);
          });
  return { contentType: mime, fileName: file.originalname.slice(0, 200), sizeBytes: file.size, data: file.buffer, thumbnail };
}
